package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.sim.config.InputException;

class SpreadTest {

    @Test
    void readsEveryKeyAndLeavesTheOthersAtZero() {
        assertThat(Spread.parse("gain=20%,time-constant=10%,dead-time=30%")).isEqualTo(new Spread(0.2, 0.1, 0.3));
        assertThat(Spread.parse(" dead-time = 12.5% ")).isEqualTo(new Spread(0.0, 0.0, 0.125));
        assertThat(Spread.parse("gain=0%")).isEqualTo(Spread.NONE);
        assertThat(new Spread(0.2, 0.1, 0.125).text()).isEqualTo("gain=20%,time-constant=10%,dead-time=12.5%");
    }

    static Stream<Arguments> badSpreads() {
        return Stream.of(
                Arguments.of("gain", "--spread entries must be key=P% with key gain, time-constant or dead-time:"
                        + " --spread=gain"),
                Arguments.of("tau=10%", "--spread key must be gain, time-constant or dead-time: --spread=tau=10%"),
                Arguments.of("gain=20", "--spread gain must be a percentage from 0% to below 100%: gain=20"),
                Arguments.of("gain=100%", "--spread gain must be a percentage from 0% to below 100%: gain=100%"),
                Arguments.of("dead-time=-5%", "--spread dead-time must be a percentage from 0% to below 100%:"
                        + " dead-time=-5%"),
                Arguments.of("time-constant=x%", "--spread time-constant must be a percentage from 0% to below 100%:"
                        + " time-constant=x%"),
                Arguments.of("gain=10%,gain=20%", "--spread must name gain once: --spread=gain=10%,gain=20%"),
                Arguments.of("gain=10%,", "--spread entries must be key=P% with key gain, time-constant or dead-time:"
                        + " --spread=gain=10%,"));
    }

    @ParameterizedTest
    @MethodSource("badSpreads")
    void badSpreadNamesTheEntryAndWhatIsAllowed(String text, String message) {
        assertThatThrownBy(() -> Spread.parse(text)).isInstanceOf(InputException.class)
                .hasMessage(message);
    }
}
