package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;

class GainScheduleTest {

    private static SchedulePoint point(double at, double gain, double integralTime) {
        return new SchedulePoint(at, IdealGains.pi(gain, integralTime));
    }

    static Stream<Arguments> invalidTables() {
        return Stream.of(
                Arguments.of(List.of(), "points must hold at least one point: points=[]"),
                Arguments.of(List.of(point(Double.NaN, 1.0, 10.0)), "points[0].at must be finite: points[0].at=NaN"),
                Arguments.of(List.of(point(20.0, 1.0, 10.0), point(10.0, 1.0, 10.0)),
                        "points[1].at must be greater than the previous point's (points[0].at=20.0): points[1].at=10.0"),
                Arguments.of(List.of(point(20.0, 1.0, 10.0), point(20.0, 1.0, 10.0)),
                        "points[1].at must be greater than the previous point's (points[0].at=20.0): points[1].at=20.0"));
    }

    @ParameterizedTest
    @MethodSource("invalidTables")
    void refusesATableThatIsEmptyUnsortedOrNotFinite(List<SchedulePoint> points, String message) {
        assertThatThrownBy(() -> new GainSchedule(ScheduleVariable.MEASUREMENT, points))
                .isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }

    @Test
    void interpolatesTheParallelGainsAndHoldsBeyondTheEnds() {
        // the table of the class javadoc: Ki = 2/30 at 20 and 0.8/45 at 80; halfway, the mean of each
        GainSchedule s = new GainSchedule(ScheduleVariable.MEASUREMENT,
                List.of(point(20.0, 2.0, 30.0), point(80.0, 0.8, 45.0)));
        ParallelGains half = s.gainsAt(50.0);
        assertThat(half.proportionalGain()).isCloseTo(1.4, within(1e-12));
        assertThat(half.integralGain()).isCloseTo((2.0 / 30.0 + 0.8 / 45.0) / 2.0, within(1e-12));
        assertThat(s.gainsAt(-5.0)).isEqualTo(new ParallelGains(2.0, 2.0 / 30.0, 0.0));
        assertThat(s.gainsAt(500.0)).isEqualTo(new ParallelGains(0.8, 0.8 / 45.0, 0.0));
    }

    @Test
    void aPointWithoutIntegralActionBlendsIntoOneWithIt() {
        GainSchedule s = new GainSchedule(ScheduleVariable.SETPOINT,
                List.of(point(0.0, 1.0, Double.POSITIVE_INFINITY), point(10.0, 1.0, 10.0)));
        assertThat(s.gainsAt(5.0).integralGain()).isCloseTo(0.05, within(1e-15));
    }

    @Test
    void aNonFiniteSchedulingValueKeepsTheSettingsInForce() {
        ControllerSettings base = ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0))
                .samplePeriodSeconds(0.1).build();
        ScheduledController c = new ScheduledController(base, new GainSchedule(ScheduleVariable.EXTERNAL,
                List.of(point(0.0, 1.0, 10.0), point(10.0, 3.0, 10.0))));
        c.externalValue(10.0);
        c.update(1.0, 0.0);
        ControllerSettings inForce = c.settings();
        c.externalValue(Double.NaN);
        c.update(1.0, 0.0);
        assertThat(c.settings()).isSameAs(inForce);
        assertThat(inForce.parallelGains().proportionalGain()).isEqualTo(3.0);
    }

    @Test
    void refusesStepsOutsideTheirRange() {
        ControllerSettings base = ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0))
                .samplePeriodSeconds(0.1).build();
        GainSchedule s = new GainSchedule(ScheduleVariable.MEASUREMENT, List.of(point(0.0, 1.0, 10.0)));
        assertThatThrownBy(() -> new ScheduledController(base, s, 0))
                .hasMessage("stepsPerSegment must be between 1 and 4096: stepsPerSegment=0");
    }
}
