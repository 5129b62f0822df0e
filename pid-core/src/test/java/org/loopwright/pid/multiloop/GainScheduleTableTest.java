package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;

/**
 * A table of three points, so that a segment other than the first is looked up (issue 11: with two
 * points the mutation run could not tell the segment search from "always the first"), the ends of
 * a segment exactly, and the scheduled controller's limits and reset.
 */
class GainScheduleTableTest {

    private static final ParallelGains AT_0 = new ParallelGains(1.0, 0.1, 0.0);
    private static final ParallelGains AT_10 = new ParallelGains(3.0, 0.3, 1.0);
    private static final ParallelGains AT_20 = new ParallelGains(2.0, 0.2, 0.5);

    private static GainSchedule threePoints(ScheduleVariable variable) {
        return new GainSchedule(variable, List.of(new SchedulePoint(0.0, AT_0), new SchedulePoint(10.0, AT_10),
                new SchedulePoint(20.0, AT_20)));
    }

    private static ControllerSettings base() {
        return ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0)).samplePeriodSeconds(0.1).build();
    }

    @Test
    void interpolatesLinearlyWithinTheSegmentThatHoldsTheValue() {
        GainSchedule s = threePoints(ScheduleVariable.MEASUREMENT);
        // linear interpolation between the neighbours, by definition: halfway from (3, 0.3, 1) to (2, 0.2, 0.5)
        ParallelGains at15 = s.gainsAt(15.0);
        assertThat(at15.proportionalGain()).isCloseTo(2.5, within(1e-12));
        assertThat(at15.integralGain()).isCloseTo(0.25, within(1e-12));
        assertThat(at15.derivativeGain()).isCloseTo(0.75, within(1e-12));
        // a quarter of the way from (1, 0.1, 0) to (3, 0.3, 1)
        ParallelGains at2 = s.gainsAt(2.5);
        assertThat(at2.proportionalGain()).isCloseTo(1.5, within(1e-12));
        assertThat(at2.integralGain()).isCloseTo(0.15, within(1e-12));
        assertThat(at2.derivativeGain()).isCloseTo(0.25, within(1e-12));
        // exact on a point, and the end points' gains beyond the ends (the class contract)
        assertThat(s.gainsAt(10.0)).isEqualTo(AT_10);
        assertThat(s.gainsAt(20.0)).isEqualTo(AT_20);
        assertThat(s.gainsAt(1e6)).isEqualTo(AT_20);
        assertThat(s.gainsAt(-1e6)).isEqualTo(AT_0);
    }

    @Test
    void theSegmentOfAValueIsTheLastPointAtOrBelowIt() {
        GainSchedule s = threePoints(ScheduleVariable.MEASUREMENT);
        assertThat(s.segment(-1.0)).isZero();
        assertThat(s.segment(Math.nextDown(10.0))).isZero();
        assertThat(s.segment(10.0)).isEqualTo(1);
        assertThat(s.segment(19.0)).isEqualTo(1);
        assertThat(s.segment(20.0)).isEqualTo(2);
        assertThat(s.segment(99.0)).isEqualTo(2);
    }

    @Test
    void aBlendIsExactAtBothEndsOfItsSegmentAndTheLastPointStandsAlone() {
        // 0.7 + (0.1 − 0.7)·1 is 0.09999999999999998 in binary floating point: the far end must be
        // the neighbour's gains themselves, as the table promises exact gains at its points
        ParallelGains far = new ParallelGains(0.1, 0.2, 0.0);
        GainSchedule s = new GainSchedule(ScheduleVariable.EXTERNAL,
                List.of(new SchedulePoint(0.0, new ParallelGains(0.7, 0.7, 0.0)), new SchedulePoint(1.0, far)));
        assertThat(s.blend(0, 1.0)).isEqualTo(far);
        assertThat(s.blend(0, 0.0)).isEqualTo(new ParallelGains(0.7, 0.7, 0.0));
        assertThat(s.blend(1, 0.5)).isEqualTo(far);
    }

    @Test
    void stepsPerSegmentRunFromOneToTheDocumentedMaximum() {
        GainSchedule s = threePoints(ScheduleVariable.MEASUREMENT);
        assertThat(new ScheduledController(base(), s, 1).settings().parallelGains()).isEqualTo(AT_0);
        assertThat(new ScheduledController(base(), s, ScheduledController.MAX_STEPS_PER_SEGMENT).settings()
                .parallelGains()).isEqualTo(AT_0);
        assertThatThrownBy(() -> new ScheduledController(base(), s, ScheduledController.MAX_STEPS_PER_SEGMENT + 1))
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage("stepsPerSegment must be between 1 and 4096: stepsPerSegment=4097");
    }

    @Test
    void aScheduledControllerFollowsTheSecondSegment() {
        ScheduledController c = new ScheduledController(base(), threePoints(ScheduleVariable.SETPOINT), 4);
        assertThat(c.schedule().size()).isEqualTo(3);
        // 17.5 is three quarters of the way from 10 to 20: the third of four steps, by linear interpolation
        c.update(17.5, 0.0);
        assertThat(c.settings().parallelGains().proportionalGain()).isCloseTo(2.25, within(1e-12));
        c.update(20.0, 0.0);
        assertThat(c.settings().parallelGains()).isEqualTo(AT_20);
    }

    @Test
    void resetGivesTheSameOutputsAsANewScheduledController() {
        GainSchedule schedule = threePoints(ScheduleVariable.EXTERNAL);
        ScheduledController used = new ScheduledController(base(), schedule);
        used.externalValue(20.0);
        for (int k = 0; k < 30; k++) {
            used.update(1.0, 0.1 * k);
        }
        assertThat(used.settings().parallelGains()).isEqualTo(AT_20);

        used.reset();
        ScheduledController fresh = new ScheduledController(base(), schedule);
        // the documented contract of reset: the first point's settings, no external value, a controller at rest
        assertThat(used.schedule()).isSameAs(schedule);
        assertThat(used.settings().parallelGains()).isEqualTo(AT_0);
        for (int k = 0; k < 20; k++) {
            double y = 0.5 * Math.sin(0.4 * k);
            assertThat(used.update(1.0, y)).as("output at sample %d", k).isEqualTo(fresh.update(1.0, y));
            assertThat(used.settings().parallelGains()).isEqualTo(fresh.settings().parallelGains());
        }
    }
}
