package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;

/** Each actuator stays within its range, both are continuous (Lipschitz) in the output, and the split point idles both. */
class SplitRangeProperties {

    @Property(tries = 2000)
    void actuatorsStayInRangeAndMoveContinuously(
            @ForAll @DoubleRange(min = -100.0, max = 100.0) double outputMin,
            @ForAll @DoubleRange(min = 1.0, max = 500.0) double span,
            @ForAll @DoubleRange(min = 0.05, max = 0.95) double splitShare,
            @ForAll @DoubleRange(min = 0.0, max = 0.9) double gapShare,
            @ForAll @DoubleRange(min = -50.0, max = 50.0) double firstMin,
            @ForAll @DoubleRange(min = 0.1, max = 3000.0) double firstSpan,
            @ForAll @DoubleRange(min = -50.0, max = 50.0) double secondMin,
            @ForAll @DoubleRange(min = 0.1, max = 3000.0) double secondSpan,
            @ForAll @DoubleRange(min = -0.2, max = 1.2) double where,
            @ForAll @DoubleRange(min = 0.0, max = 1.0) double stepShare) {
        double outputMax = outputMin + span;
        double splitAt = outputMin + splitShare * span;
        double room = 2.0 * Math.min(splitAt - outputMin, outputMax - splitAt);
        double gap = gapShare * room;
        SplitRange split = new SplitRange(ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0))
                .samplePeriodSeconds(1.0).outputRange(outputMin, outputMax).build(), splitAt, gap,
                new ActuatorRange(firstMin, firstMin + firstSpan), new ActuatorRange(secondMin, secondMin + secondSpan));
        double u = outputMin - 0.2 * span + 1.4 * span * (where + 0.2) / 1.4;
        double delta = 1e-3 * span * stepShare;
        double first = split.first(u);
        double second = split.second(u);
        assertThat(first).isBetween(firstMin, firstMin + firstSpan);
        assertThat(second).isBetween(secondMin, secondMin + secondSpan);
        // continuity: no move larger than the steeper of the two slopes times the output's move
        double firstSlope = firstSpan / (splitAt - gap / 2.0 - outputMin);
        double secondSlope = secondSpan / (outputMax - splitAt - gap / 2.0);
        double slack = 1e-9 * (1.0 + firstSpan + secondSpan + Math.abs(firstMin) + Math.abs(secondMin));
        assertThat(Math.abs(split.first(u + delta) - first)).isLessThanOrEqualTo(firstSlope * delta + slack);
        assertThat(Math.abs(split.second(u + delta) - second)).isLessThanOrEqualTo(secondSlope * delta + slack);
        // at most one actuator works at a time, and both idle at the split
        assertThat(first == firstMin || second == secondMin).isTrue();
        assertThat(split.first(splitAt)).isEqualTo(firstMin);
        assertThat(split.second(splitAt)).isEqualTo(secondMin);
        // the measured positions give back the output where an actuator works; both idle stand for the gap
        double clamped = Math.max(outputMin, Math.min(outputMax, u));
        double tolerance = 1e-9 * (1.0 + Math.abs(outputMin) + span);
        if (first == firstMin && second == secondMin) {
            assertThat(split.outputFor(first, second)).isEqualTo(splitAt);
            assertThat(Math.abs(clamped - splitAt)).isLessThanOrEqualTo(gap / 2.0 + tolerance);
        } else {
            assertThat(split.outputFor(first, second)).isCloseTo(clamped,
                    org.assertj.core.api.Assertions.within(tolerance));
        }
    }
}
