package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.discrete.DiscretePid;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;

/** Schedule crossings are bumpless and the gains in force follow the interpolation. */
class GainScheduleProperties {

    private static GainSchedule schedule(ScheduleVariable variable, List<Double> gains, List<Double> integralTimes,
            List<Double> derivativeTimes) {
        List<SchedulePoint> points = new ArrayList<>();
        int n = Math.min(gains.size(), Math.min(integralTimes.size(), derivativeTimes.size()));
        for (int i = 0; i < n; i++) {
            points.add(new SchedulePoint(10.0 * i, new IdealGains(gains.get(i), integralTimes.get(i),
                    derivativeTimes.get(i))));
        }
        return new GainSchedule(variable, points);
    }

    /**
     * At unchanged setpoint and measurement, a jump of the scheduling variable across the table
     * moves the output by no more than the controller's own increment at those inputs under the
     * new settings, |Δu| ≤ (b0 + b1)·|e| + (1 − ad)·|D| (the retune rule: the proportional term's
     * change goes into the integral; D is the last derivative term).
     */
    @Property
    void crossingTheScheduleIsBumpless(
            @ForAll @Size(min = 1, max = 4) List<@DoubleRange(min = 0.05, max = 20.0) Double> gains,
            @ForAll @Size(min = 1, max = 4) List<@DoubleRange(min = 0.5, max = 100.0) Double> integralTimes,
            @ForAll @Size(min = 1, max = 4) List<@DoubleRange(min = 0.0, max = 0.1) Double> derivativeTimes,
            @ForAll @IntRange(min = 1, max = 64) int steps,
            @ForAll @DoubleRange(min = -5.0, max = 5.0) double setpoint,
            @ForAll @Size(min = 5, max = 40) List<@DoubleRange(min = -5.0, max = 5.0) Double> measurements,
            @ForAll @Size(min = 5, max = 40) List<@DoubleRange(min = -10.0, max = 50.0) Double> externalValues) {
        ControllerSettings base = ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0))
                .samplePeriodSeconds(0.1).build();
        ScheduledController c = new ScheduledController(base,
                schedule(ScheduleVariable.EXTERNAL, gains, integralTimes, derivativeTimes), steps);
        for (double y : measurements) {
            c.update(setpoint, y);
        }
        double y = measurements.get(measurements.size() - 1);
        for (double value : externalValues) {
            double before = c.controller().output();
            double derivative = c.controller().derivativeTerm();
            c.externalValue(value);
            double after = c.update(setpoint, y);
            DiscretePid coefficients = c.settings().discretePid();
            double error = setpoint - y;
            double ownIncrement = Math.abs((coefficients.integralWeightOnCurrent()
                    + coefficients.integralWeightOnPrevious()) * error)
                    + (1.0 - coefficients.derivativePole()) * Math.abs(derivative);
            assertThat(Math.abs(after - before)).as("output step at scheduling value %f", value)
                    .isLessThanOrEqualTo(ownIncrement + 1e-9 * (1.0 + Math.abs(before)));
        }
    }

    /** The gains in force are within half a step of the linear interpolation, and exact on a point. */
    @Property
    void gainsInForceFollowTheInterpolation(
            @ForAll @Size(min = 1, max = 5) List<@DoubleRange(min = 0.05, max = 20.0) Double> gains,
            @ForAll @Size(min = 1, max = 5) List<@DoubleRange(min = 0.5, max = 100.0) Double> integralTimes,
            @ForAll @IntRange(min = 1, max = 64) int steps,
            @ForAll @DoubleRange(min = -10.0, max = 50.0) double measurement,
            @ForAll @IntRange(min = 0, max = 4) int point) {
        List<Double> noDerivative = List.of(0.0, 0.0, 0.0, 0.0, 0.0);
        GainSchedule schedule = schedule(ScheduleVariable.MEASUREMENT, gains, integralTimes, noDerivative);
        ScheduledController c = new ScheduledController(ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0))
                .samplePeriodSeconds(0.1).build(), schedule, steps);
        c.update(0.0, measurement);
        ParallelGains inForce = c.settings().parallelGains();
        int i = schedule.segment(measurement);
        ParallelGains lo = schedule.gainsAt(schedule.at(i));
        ParallelGains hi = schedule.gainsAt(schedule.at(Math.min(i + 1, schedule.size() - 1)));
        ParallelGains exact = schedule.gainsAt(measurement);
        double halfStep = 0.5 / steps + 1e-12;
        assertThat(inForce.proportionalGain()).isCloseTo(exact.proportionalGain(),
                within(halfStep * Math.abs(hi.proportionalGain() - lo.proportionalGain()) + 1e-12));
        assertThat(inForce.integralGain()).isCloseTo(exact.integralGain(),
                within(halfStep * Math.abs(hi.integralGain() - lo.integralGain()) + 1e-12));

        int onPoint = Math.min(point, schedule.size() - 1);
        c.update(0.0, schedule.at(onPoint));
        assertThat(c.settings().parallelGains()).isEqualTo(schedule.gainsAt(schedule.at(onPoint)));
    }
}
