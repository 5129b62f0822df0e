package org.loopwright.examples;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class DurationArgumentTest {

    @Test
    void noArgumentGivesTheDefault() {
        assertThat(DurationArgument.seconds(new String[0], 90.0)).isEqualTo(90.0);
    }

    @Test
    void firstArgumentIsSeconds() {
        assertThat(DurationArgument.seconds(new String[] {" 1.5 ", "ignored"}, 90.0)).isEqualTo(1.5);
    }

    static Stream<Arguments> notNumbers() {
        return Stream.of(
                Arguments.of("ten", "duration must be a number of seconds: duration=ten"),
                Arguments.of("", "duration must be a number of seconds: duration="),
                Arguments.of("1,5", "duration must be a number of seconds: duration=1,5"));
    }

    @ParameterizedTest
    @MethodSource("notNumbers")
    void rejectsWhatIsNotANumber(String argument, String message) {
        assertThatThrownBy(() -> DurationArgument.seconds(new String[] {argument}, 90.0))
                .isInstanceOf(IllegalArgumentException.class).hasMessage(message);
    }

    @Test
    void examplesRefuseABadArgumentBeforeRunning() {
        assertThatThrownBy(() -> WaterBath.main(new String[] {"-1"}))
                .hasMessage("duration must be finite and > 0: duration=-1.0");
        assertThatThrownBy(() -> BoosterPump.main(new String[] {"soon"}))
                .hasMessage("duration must be a number of seconds: duration=soon");
        assertThatThrownBy(() -> GimbalAxis.main(new String[] {"Infinity"}))
                .hasMessage("duration must be finite and > 0: duration=Infinity");
    }
}
