package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.IdealGains;

class SplitRangeTest {

    private static ControllerSettings percent(double min, double max) {
        return ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0)).samplePeriodSeconds(1.0)
                .outputRange(min, max).build();
    }

    private static final ActuatorRange COOLING = new ActuatorRange(0.0, 100.0);
    private static final ActuatorRange HEATING = new ActuatorRange(0.0, 2000.0);

    @Test
    void theWorkedExampleOfTheClassDescription() {
        SplitRange s = new SplitRange(percent(0.0, 100.0), 50.0, 0.0, COOLING, HEATING);
        assertThat(s.first(25.0)).isEqualTo(50.0);
        assertThat(s.second(25.0)).isEqualTo(0.0);
        assertThat(s.first(75.0)).isEqualTo(0.0);
        assertThat(s.second(75.0)).isEqualTo(1000.0);
        assertThat(s.first(0.0)).isEqualTo(100.0);
        assertThat(s.second(100.0)).isEqualTo(2000.0);
    }

    @Test
    void bothIdleAcrossTheGap() {
        SplitRange s = new SplitRange(percent(0.0, 100.0), 50.0, 10.0, COOLING, HEATING);
        for (double u = 45.0; u <= 55.0; u += 0.5) {
            assertThat(s.first(u)).isEqualTo(0.0);
            assertThat(s.second(u)).isEqualTo(0.0);
        }
        assertThat(s.first(0.0)).isEqualTo(100.0);
        assertThat(s.first(22.5)).isEqualTo(50.0);
        assertThat(s.second(77.5)).isEqualTo(1000.0);
    }

    static Stream<Arguments> invalid() {
        return Stream.of(
                Arguments.of(percent(0.0, Double.POSITIVE_INFINITY), 50.0, 0.0, COOLING, HEATING,
                        "outputMax must be finite, and outputMin too, for a split range (outputMin=0.0): outputMax=Infinity"),
                Arguments.of(percent(0.0, 100.0), 50.0, -1.0, COOLING, HEATING, "gap must be finite and >= 0: gap=-1.0"),
                Arguments.of(percent(0.0, 100.0), 95.0, 10.0, COOLING, HEATING,
                        "splitAt must leave each actuator part of the output range: outputMin < splitAt - gap/2 and"
                                + " splitAt + gap/2 < outputMax (outputMin=0.0, outputMax=100.0, gap=10.0): splitAt=95.0"),
                Arguments.of(percent(0.0, 100.0), 50.0, 0.0, new ActuatorRange(5.0, 5.0), HEATING,
                        "first.max must be finite and > first.min (first.min=5.0): first.max=5.0"),
                Arguments.of(percent(0.0, 100.0), 50.0, 0.0, COOLING, new ActuatorRange(Double.NaN, 1.0),
                        "second.min must be finite: second.min=NaN"));
    }

    @ParameterizedTest
    @MethodSource("invalid")
    void refusesASplitThatLeavesAnActuatorNoRoom(ControllerSettings settings, double splitAt, double gap,
            ActuatorRange first, ActuatorRange second, String message) {
        assertThatThrownBy(() -> new SplitRange(settings, splitAt, gap, first, second))
                .isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }
}
