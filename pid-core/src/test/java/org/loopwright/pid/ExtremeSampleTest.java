package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.ParallelGains;

/**
 * Finite samples at the far end of the double range: they may be dropped as an overflow, but they
 * never leave a state that is not finite, never lock the controller in a fault, and never stop
 * manual mode obeying the operator. The cases are the ones a long random run found (issue 11).
 */
class ExtremeSampleTest {

    private static ControllerSettings.Builder piOnZeroToHundred() {
        return ControllerSettings.builder().gains(new ParallelGains(1.0, 0.1, 0.0)).samplePeriodSeconds(0.1)
                .outputRange(0.0, 100.0);
    }

    @Test
    void retuneAfterAnExtremeSampleLeavesTheControllerWorking() {
        PidController c = new PidController(piOnZeroToHundred().build());
        assertThat(c.update(0.0, -1e308)).isEqualTo(100.0);
        c.retune(piOnZeroToHundred().gains(new ParallelGains(2.0, 0.1, 0.0)).build());

        // the old P − new P at the last inputs is −∞: the rebalance falls back to the last output
        assertThat(c.update(50.0, 49.0)).isEqualTo(100.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(StateSnapshot.parse(c.snapshot().toText())).isEqualTo(c.snapshot());
        // and the law runs on from there: the error steps from +1 to −1, so P moves by Kp·(−2) and
        // the Tustin integral by Ki·h·(1 + (−1))/2 = 0
        assertThat(c.update(48.0, 49.0)).isCloseTo(96.0, within(1e-12));

        c.switchToManual();
        c.manualOutput(42.0);
        assertThat(c.update(50.0, 49.0)).isEqualTo(42.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
    }

    @Test
    void retuneOfACircularVariableAfterAnExtremeSampleLeavesTheControllerWorking() {
        // 6e307 wraps by a span of 0.5 (6e307 / 0.5 is a double) but not by 0.25: the error at the last
        // inputs under the new settings is not finite, nor is the next change of the wrapped measurement
        ControllerSettings.Builder b = piOnZeroToHundred().wrapSpan(0.5);
        PidController c = new PidController(b.build());
        c.update(0.0, 0.0);
        double last = c.update(6e307, 0.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        c.retune(b.wrapSpan(0.25).gains(new ParallelGains(2.0, 0.1, 0.0)).build());
        // at most one sample is dropped, and the output carries on from where it was
        assertThat(c.update(0.1, 0.0)).isEqualTo(last);
        assertThat(c.update(0.1, 0.0)).isEqualTo(last);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(c.update(0.1, 0.0)).isNotEqualTo(last);
        assertThat(StateSnapshot.parse(c.snapshot().toText())).isEqualTo(c.snapshot());
    }

    @Test
    void manualObeysTheOperatorWhenTheErrorOverflows() {
        PidController c = new PidController(ControllerSettings.builder().gains(new ParallelGains(1.0, 0.1, 0.5))
                .samplePeriodSeconds(0.1).build());
        c.update(0.0, 0.0);
        c.switchToManual();
        c.manualOutput(7.0);
        // r − y = 2e308 is beyond the double range; the operator's output does not depend on it
        assertThat(c.update(1e308, -1e308)).isEqualTo(7.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(c.update(1e308, -1e308)).isEqualTo(7.0);
        assertThat(StateSnapshot.parse(c.snapshot().toText())).isEqualTo(c.snapshot());
        // back in automatic at ordinary inputs: the change from the last inputs may overflow the
        // derivative once, and the output carries on from the operator's, bumpless
        c.switchToAutomatic();
        assertThat(c.update(1.0, 1.0)).isEqualTo(7.0);
        assertThat(c.update(1.0, 1.0)).isEqualTo(7.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(c.update(2.0, 1.0)).isGreaterThan(7.0);
    }

    @Test
    void overflowInAutomaticDropsTheSampleButNeverLocksTheController() {
        // a PD at Kd·Δy/(Tf + h) ≈ 3.3·Δy: the accepted measurement −1e308 next to any ordinary one
        // makes a derivative beyond the double range
        PidController c = new PidController(ControllerSettings.builder().gains(new ParallelGains(1.0, 0.0, 0.5))
                .samplePeriodSeconds(0.1).outputRange(-10.0, 10.0).build());
        c.update(0.0, 0.0);
        c.update(0.0, -3e307);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(c.position()).isEqualTo(10.0);
        c.update(0.0, 3e307);
        assertThat(c.fault()).isEqualTo(Fault.ARITHMETIC_OVERFLOW);
        assertThat(c.position()).isEqualTo(10.0);
        // ordinary inputs again: the law starts afresh, bumpless, and runs on
        assertThat(c.update(0.0, 1.0)).isEqualTo(10.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(c.update(0.0, 3.0)).isLessThan(10.0);
    }

    @Test
    void incrementOutputIsAlwaysFinite() {
        // a position step of 2e308 cannot be told as an increment: the step is limited to half the
        // largest double, and the position gets there over the next samples
        double most = OutputKind.LARGEST_INCREMENT;
        PidController c = new PidController(ControllerSettings.builder().gains(new ParallelGains(2.0, 0.0, 0.0))
                .samplePeriodSeconds(0.1).outputRange(-1e308, 1e308).outputKind(OutputKind.INCREMENT).build());
        assertThat(c.update(0.0, 5e307)).isZero();
        assertThat(c.position()).isEqualTo(-1e308);
        assertThat(c.update(0.0, -5e307)).isEqualTo(most);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(c.update(0.0, -5e307)).isEqualTo(most);
        double position = c.position();
        assertThat(c.update(0.0, -5e307)).isEqualTo(1e308 - position);
        assertThat(c.position()).isEqualTo(1e308);
    }

    @Test
    void safeOutputOnAnIncrementOutputIsAlwaysFinite() {
        double most = OutputKind.LARGEST_INCREMENT;
        PidController c = new PidController(ControllerSettings.builder().gains(new ParallelGains(2.0, 0.0, 0.0))
                .samplePeriodSeconds(0.1).outputRange(-1e308, 1e308).outputKind(OutputKind.INCREMENT)
                .faultPolicy(FaultPolicy.SAFE_OUTPUT, 1e308).build());
        c.update(0.0, 5e307);
        assertThat(c.update(0.0, Double.NaN)).isEqualTo(most);
        assertThat(c.update(0.0, Double.NaN)).isEqualTo(most);
        double position = c.position();
        assertThat(c.update(0.0, Double.NaN)).isEqualTo(1e308 - position);
        assertThat(c.position()).isEqualTo(1e308);
    }

    @Test
    void aRetuneThatMovesAnIncrementOutputsRangeFarAwayStillGivesFiniteIncrements() {
        // the last position −1e308; the new range starts at 1.5e308: the range wins over the slew, but
        // the way there (2.5e308) is beyond the largest double, so it is walked in steps of at most
        // half of it, as every other position step of an increment output
        double most = OutputKind.LARGEST_INCREMENT;
        ControllerSettings.Builder wide = ControllerSettings.builder().gains(new ParallelGains(2.0, 0.0, 0.0))
                .samplePeriodSeconds(0.1).outputRange(-1e308, 1e308).outputKind(OutputKind.INCREMENT);
        PidController c = new PidController(wide.build());
        c.update(0.0, 5e307);
        assertThat(c.position()).isEqualTo(-1e308);
        c.retune(wide.outputRange(1.5e308, 1.7e308).build());

        assertThat(c.update(0.0, 5e307)).isEqualTo(most);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(c.update(0.0, 5e307)).isEqualTo(most);
        double position = c.position();
        assertThat(c.update(0.0, 5e307)).isEqualTo(1.5e308 - position);
        assertThat(c.position()).isEqualTo(1.5e308);
    }

    @Test
    void aRetuneThatMovesAnIncrementOutputsRangeFarAwayStillGivesFiniteIncrementsOnABadSample() {
        double most = OutputKind.LARGEST_INCREMENT;
        ControllerSettings.Builder wide = ControllerSettings.builder().gains(new ParallelGains(2.0, 0.0, 0.0))
                .samplePeriodSeconds(0.1).outputRange(-1e308, 1e308).outputKind(OutputKind.INCREMENT);
        PidController c = new PidController(wide.build());
        c.update(0.0, 5e307);
        c.retune(wide.outputRange(1.5e308, 1.7e308).build());

        assertThat(c.update(0.0, Double.NaN)).isEqualTo(most);
        assertThat(c.fault()).isEqualTo(Fault.MEASUREMENT_NOT_FINITE);
    }

    @Test
    void manualObeysTheOperatorOnABadSampleToo() {
        // the safe output is for automatic and tracking; in manual the operator stays in charge
        PidController c = new PidController(piOnZeroToHundred().faultPolicy(FaultPolicy.SAFE_OUTPUT, 0.0).build());
        c.update(50.0, 40.0);
        c.switchToManual();
        c.manualOutput(30.0);
        assertThat(c.update(50.0, Double.NaN)).isEqualTo(30.0);
        assertThat(c.fault()).isEqualTo(Fault.MEASUREMENT_NOT_FINITE);
        assertThat(c.faultCount()).isEqualTo(1);
        c.switchToAutomatic();
        assertThat(c.update(50.0, Double.NaN)).isZero();
        assertThat(c.fault()).isEqualTo(Fault.MEASUREMENT_NOT_FINITE);
    }

    @Test
    void aCircularSetpointThatJumpsAcrossTheDoubleRangeStaysFinite() {
        // the wrapped difference of −1e308 and 1e308 is NaN; the ramp goes to the (finite) new setpoint
        PidController c = new PidController(piOnZeroToHundred().wrapSpan(360.0).build());
        c.update(1e308, 0.0);
        c.switchToManual();
        c.update(-1e308, 0.0);
        assertThat(c.snapshot().values().previousSetpoint()).isEqualTo(-1e308);
        assertThat(StateSnapshot.parse(c.snapshot().toText())).isEqualTo(c.snapshot());
    }
}
