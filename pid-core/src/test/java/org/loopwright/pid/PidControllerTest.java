package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;

/** Behaviour of the controller that needs one example rather than a property. */
class PidControllerTest {

    private static ControllerSettings.Builder pid() {
        return ControllerSettings.builder()
                .gains(new IdealGains(2.0, 8.0, 1.0))
                .samplePeriodSeconds(0.1)
                .outputRange(-50.0, 50.0);
    }

    @Test
    void proportionalOnlyControllerKeepsItsBiasThroughSaturation() {
        // A P-only controller has no integral to wind up: after a saturated stretch the output must
        // return to Kp·e with the bias it had (here 0), whatever the windup scheme. Common practice.
        for (WindupProtection scheme : WindupProtection.values()) {
            PidController c = new PidController(ControllerSettings.builder()
                    .gains(new ParallelGains(1.0, 0.0, 0.0)).samplePeriodSeconds(0.1)
                    .outputRange(-10.0, 10.0).windupProtection(scheme).build());
            for (int k = 0; k < 20; k++) {
                assertThat(c.update(50.0, 0.0)).isEqualTo(10.0);
            }
            assertThat(c.update(3.0, 0.0)).as(scheme.name()).isEqualTo(3.0);
            assertThat(c.update(0.0, 0.0)).as(scheme.name()).isEqualTo(0.0);
        }
    }

    @Test
    void faultySampleDoesNotAdoptAPendingRetune() {
        PidController c = new PidController(pid().build());
        c.update(1.0, 0.0);
        c.update(1.0, 0.2);
        StateSnapshot.Values before = c.snapshot().values();
        c.retune(pid().gains(new IdealGains(5.0, 8.0, 1.0)).build());
        c.update(Double.NaN, 0.2);
        StateSnapshot.Values after = c.snapshot().values();
        assertThat(after).usingRecursiveComparison().ignoringFields("faultCount").isEqualTo(before);
        assertThat(after.faultCount()).isEqualTo(before.faultCount() + 1);
    }

    @Test
    void heldOutputRespectsARangeNarrowedByRetune() {
        PidController c = new PidController(pid().build());
        c.update(10.0, 0.0);
        assertThat(c.position()).isEqualTo(20.0);
        c.retune(pid().outputRange(-5.0, 5.0).build());
        assertThat(c.update(10.0, Double.NaN)).isEqualTo(5.0);
    }

    @Test
    void rangeNarrowedByRetuneWinsOverTheSlewLimit() {
        // The output never leaves the actuator's range (the update's contract; common practice): when
        // a retune leaves the last output beyond the new range, farther than one slew step, the next
        // output is the range's nearest edge, and the slew limit applies again from there.
        for (double direction : new double[] {1.0, -1.0}) {
            ControllerSettings.Builder b = ControllerSettings.builder()
                    .gains(new ParallelGains(1.0, 0.0, 0.0)).samplePeriodSeconds(0.1)
                    .outputRange(-50.0, 50.0).outputSlewPerSecond(10.0);
            PidController c = new PidController(b.build());
            c.update(0.0, 0.0);
            for (int k = 0; k < 20; k++) {
                c.update(100.0 * direction, 0.0);
            }
            assertThat(c.position()).isEqualTo(20.0 * direction);
            c.retune(b.outputRange(-5.0, 5.0).build());
            // the law asks for 0, inside the new range but beyond one slew step from the last output
            assertThat(c.update(0.0, 0.0)).isEqualTo(5.0 * direction);
            assertThat(c.update(0.0, 0.0)).isEqualTo(4.0 * direction);
        }
    }

    @ParameterizedTest
    @EnumSource(DerivativeMethod.class)
    void variablePeriodUpdateEqualsFixedPeriodUpdateAtTheSamplePeriod(DerivativeMethod derivative) {
        for (IntegralMethod integral : IntegralMethod.values()) {
            ControllerSettings s = pid().integralMethod(integral).derivativeMethod(derivative)
                    .setpointWeights(0.7, 0.3).outputSlewPerSecond(40.0).setpointSlewPerSecond(30.0)
                    .outputRange(-3.0, 4.0).build();
            PidController fixed = new PidController(s);
            PidController variable = new PidController(s);
            for (int k = 0; k < 400; k++) {
                double r = k < 200 ? 1.0 : -0.5;
                double y = Math.sin(0.05 * k);
                assertThat(variable.update(r, y, 0.1)).isEqualTo(fixed.update(r, y));
                assertThat(variable.integralTerm()).isEqualTo(fixed.integralTerm());
                assertThat(variable.derivativeTerm()).isEqualTo(fixed.derivativeTerm());
            }
        }
    }

    @Test
    void incrementOutputSumsToThePositionOutput() {
        ControllerSettings position = pid().outputSlewPerSecond(30.0).build();
        PidController p = new PidController(position);
        PidController v = new PidController(position.toBuilder().outputKind(OutputKind.INCREMENT).build());
        double sum = p.update(1.0, 0.0);
        assertThat(v.update(1.0, 0.0)).isZero();
        assertThat(v.position()).isEqualTo(p.position());
        for (int k = 1; k < 300; k++) {
            double y = 0.5 * Math.cos(0.03 * k);
            double pos = p.update(1.0, y);
            sum += v.update(1.0, y);
            assertThat(v.position()).isEqualTo(pos);
            assertThat(sum).isCloseTo(pos, within(1e-9));
        }
    }

    @Test
    void feedforwardSwitchedOnAndOffWithoutABump() {
        PidController c = new PidController(pid().build());
        c.feedforward(7.0);
        double last = 0.0;
        for (int k = 0; k < 30; k++) {
            last = c.update(1.0, 0.8);
        }
        // at constant inputs the only change is the integral's own increment (Tustin: Ki·h·e)
        double integralStep = 2.0 / 8.0 * 0.1 * 0.2;
        c.feedforwardOn(true);
        double on = c.update(1.0, 0.8);
        assertThat(on - last).isCloseTo(integralStep, within(1e-12));
        assertThat(c.feedforwardTerm()).isEqualTo(7.0);
        c.feedforwardOn(false);
        double off = c.update(1.0, 0.8);
        assertThat(off - on).isCloseTo(integralStep, within(1e-12));
    }

    @Test
    void safeOutputPolicyGoesToTheSafeOutputAndReturnsWithoutABump() {
        PidController c = new PidController(pid().faultPolicy(FaultPolicy.SAFE_OUTPUT, 3.0).build());
        for (int k = 0; k < 10; k++) {
            c.update(5.0, 1.0);
        }
        assertThat(c.update(5.0, Double.POSITIVE_INFINITY)).isEqualTo(3.0);
        assertThat(c.fault()).isEqualTo(Fault.MEASUREMENT_NOT_FINITE);
        assertThat(c.update(5.0, 1.0, 0.0)).isEqualTo(3.0);
        assertThat(c.fault()).isEqualTo(Fault.PERIOD_NOT_VALID);
        assertThat(c.faultCount()).isEqualTo(2);
        assertThat(c.update(5.0, 1.0)).isEqualTo(3.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
    }

    @Test
    void finiteInputsThatOverflowTheLawAreDroppedAndTheLawStartsAgainBumpless() {
        PidController c = new PidController(pid().outputRange(-5.0, 5.0).build());
        c.update(1.0, 0.5);
        double held = c.position();
        // r − y overflows to +∞ although both inputs are finite
        assertThat(c.update(Double.MAX_VALUE, -Double.MAX_VALUE)).isEqualTo(held);
        assertThat(c.fault()).isEqualTo(Fault.ARITHMETIC_OVERFLOW);
        assertThat(c.faultCount()).isEqualTo(1);
        assertThat(c.snapshot().values().started()).isFalse();
        // the next sample is a first one (no derivative, no setpoint ramp), rebalanced to the last output
        assertThat(c.update(1.0, 0.5)).isEqualTo(held);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
    }

    @Test
    void returnToAutomaticAtTheRangeLimitIsBumplessUnderClamping() {
        // The rebalanced output lands on the limit; a rounding error of one ulp beyond it must not
        // make conditional integration take back an increment that was never added.
        PidController c = new PidController(ControllerSettings.builder().gains(new IdealGains(3.7, 0.9, 0.3))
                .samplePeriodSeconds(0.25).outputRange(-80.03691700225966, -72.83335190695308)
                .windupProtection(WindupProtection.CLAMPING).action(Action.DIRECT).build());
        c.trackValue(-72.83335190695308);
        java.util.Random rnd = new java.util.Random(7);
        for (int k = 0; k < 2000; k++) {
            c.switchToTracking();
            c.update(-15.5, -14.0 + rnd.nextGaussian());
            double last = c.position();
            c.switchToAutomatic();
            c.update(-15.5, -14.0 + rnd.nextGaussian());
            assertThat(c.position()).isCloseTo(last, within(1e-9));
        }
    }

    private static ControllerSettings.Builder proportional(double kp) {
        return ControllerSettings.builder().gains(new ParallelGains(kp, 0.0, 0.0)).samplePeriodSeconds(0.1);
    }

    @Test
    void directActionRaisesTheOutputWhenTheMeasurementRises() {
        // reverse: e = r − y (a heater); direct: e = y − r (a cooler). Kp = 2, r = 1, y = 3.
        assertThat(new PidController(proportional(2.0).build()).update(1.0, 3.0)).isEqualTo(-4.0);
        assertThat(new PidController(proportional(2.0).action(Action.DIRECT).build()).update(1.0, 3.0)).isEqualTo(4.0);
    }

    @Test
    void deadbandZeroesSmallErrorsAndShiftsLargeOnesWithoutAStep() {
        // common practice: a deadband of 0.5 gives e' = 0 for |e| <= 0.5 and e' = e ∓ 0.5 beyond
        PidController c = new PidController(proportional(2.0).errorDeadband(0.5).build());
        assertThat(c.update(0.3, 0.0)).isZero();
        assertThat(c.update(-0.5, 0.0)).isZero();
        assertThat(c.update(1.0, 0.0)).isEqualTo(1.0);
        assertThat(c.update(-1.0, 0.0)).isEqualTo(-1.0);
        assertThat(c.update(0.5000001, 0.0)).isCloseTo(2e-7, within(1e-12));
    }

    @Test
    void circularProcessVariableTakesTheShortWayRound() {
        // a camera gimbal axis in degrees: setpoint 350°, measurement 10° is an error of −20°, not 340°
        PidController c = new PidController(proportional(1.0).wrapSpan(360.0).build());
        assertThat(c.update(350.0, 10.0)).isCloseTo(-20.0, within(1e-12));
        assertThat(c.update(10.0, 350.0)).isCloseTo(20.0, within(1e-12));
        // the derivative sees the measurement cross 360° → 0° as a move of +2°, not −358°
        PidController d = new PidController(ControllerSettings.builder().gains(new ParallelGains(1.0, 0.0, 0.5))
                .derivativeFilterTimeSeconds(0.1).samplePeriodSeconds(0.1).wrapSpan(360.0).build());
        d.update(0.0, 359.0);
        d.update(0.0, 1.0);
        // backward Euler: D = −Kd/(Tf + h)·Δy = −0.5/0.2·2 = −5
        assertThat(d.derivativeTerm()).isCloseTo(-5.0, within(1e-9));
    }

    @Test
    void setpointSlewRampsTheSetpointTheLawSees() {
        // 5 units/s at h = 0.1 s: a step from 0 to 10 reaches the law as 0.5 per sample
        PidController c = new PidController(proportional(1.0).setpointSlewPerSecond(5.0).build());
        c.update(0.0, 0.0);
        for (int k = 1; k <= 20; k++) {
            assertThat(c.update(10.0, 0.0)).isCloseTo(0.5 * k, within(1e-12));
        }
        assertThat(c.update(10.0, 0.0)).isCloseTo(10.0, within(1e-12));
    }

    @Test
    void setpointSlewTakesTheShortWayRoundOnACircularProcessVariable() {
        // 10°/s at h = 0.1 s: a setpoint move from 350° to 10° is +20° through 0°, reached in 20 samples
        PidController c = new PidController(proportional(1.0).wrapSpan(360.0).setpointSlewPerSecond(10.0).build());
        c.update(350.0, 350.0);
        for (int k = 1; k <= 20; k++) {
            // the law sees the setpoint 350° + k°, the error k° (never the long way, −k°)
            assertThat(c.update(10.0, 350.0)).isCloseTo(k, within(1e-9));
        }
        assertThat(c.update(10.0, 350.0)).isCloseTo(20.0, within(1e-9));
    }

    @Test
    void outputSlewLimitsEveryMoveAndCountsAsALimitForTheIntegral() {
        // 2 units/s at h = 0.1 s: at most 0.2 per sample; the unlimited PI would jump to 10
        ControllerSettings s = ControllerSettings.builder().gains(IdealGains.pi(10.0, 1.0)).samplePeriodSeconds(0.1)
                .outputSlewPerSecond(2.0).windupProtection(WindupProtection.CLAMPING).build();
        PidController c = new PidController(s);
        c.update(0.0, 0.0);
        for (int k = 1; k <= 10; k++) {
            assertThat(c.update(1.0, 0.0)).isCloseTo(0.2 * k, within(1e-12));
            // held back by the slew limit, the integral does not integrate (conditional integration)
            assertThat(c.integralTerm()).isZero();
        }
    }

    @Test
    void manualOutputMovesWithinTheSlewLimitAndRefusesNonFiniteValues() {
        PidController c = new PidController(pid().outputSlewPerSecond(10.0).build());
        c.update(1.0, 1.0);
        c.switchToManual();
        assertThat(c.manualOutput(Double.NaN)).isFalse();
        assertThat(c.manualOutput(5.0)).isTrue();
        assertThat(c.update(1.0, 1.0)).isCloseTo(1.0, within(1e-12));
        assertThat(c.update(1.0, 1.0)).isCloseTo(2.0, within(1e-12));
        assertThat(c.mode()).isEqualTo(Mode.MANUAL);
    }

    @ParameterizedTest
    @EnumSource(IntegralMethod.class)
    void startingRuleAndTheIntegralOverOnePeriod(IntegralMethod method) {
        // Issue 2's starting rule: at the first sample I = D = 0; then the integral over [t(k−1), t(k)]
        // is h·e(k−1) (forward Euler), h·e(k) (backward Euler) or h·(e(k−1) + e(k))/2 (Tustin).
        // Ki = 0.5, h = 0.1, errors 1 then 3.
        for (DerivativeMethod derivative : DerivativeMethod.values()) {
            PidController c = new PidController(ControllerSettings.builder().gains(new ParallelGains(1.0, 0.5, 0.2))
                    .derivativeFilterTimeSeconds(0.1)
                    .samplePeriodSeconds(0.1).integralMethod(method).derivativeMethod(derivative).build());
            c.update(1.0, 0.0);
            assertThat(c.integralTerm()).isZero();
            assertThat(c.derivativeTerm()).isZero();
            assertThat(c.output()).isEqualTo(1.0);
            c.update(3.0, 0.0);
            double expected = switch (method) {
                case FORWARD_EULER -> 0.5 * 0.1 * 1.0;
                case BACKWARD_EULER -> 0.5 * 0.1 * 3.0;
                case TUSTIN -> 0.5 * 0.1 * 2.0;
            };
            assertThat(c.integralTerm()).isCloseTo(expected, within(1e-15));
        }
    }

    @Test
    void seriesFormFiltersTheIdealDerivativeTime() {
        // series Kc' = 1, Ti' = 4, Td' = 1 is ideal Td = 0.8 (A&H 2006 §3.4); N = 10 gives Tf = 0.08
        ControllerSettings s = ControllerSettings.builder().gains(new org.loopwright.pid.form.SeriesGains(1.0, 4.0, 1.0))
                .samplePeriodSeconds(0.01).build();
        assertThat(s.derivativeFilterTimeSeconds()).isCloseTo(0.08, within(1e-15));
    }

    @Test
    void anOverflowingSampleKeepsTheRebalanceOfTheReturnToAutomatic() {
        PidController c = new PidController(pid().build());
        c.update(1.0, 0.0);
        c.switchToManual();
        c.manualOutput(30.0);
        c.update(1.0, 0.0);
        c.update(1.0, 0.0);
        c.switchToAutomatic();
        c.update(Double.MAX_VALUE, -Double.MAX_VALUE);
        assertThat(c.fault()).isEqualTo(Fault.ARITHMETIC_OVERFLOW);
        assertThat(c.update(1.0, 0.0)).isCloseTo(30.0, within(1e-12));
    }

    @Test
    void retuneAtUnchangedInputsMovesTheOutputOnlyByTheNewIntegralStep() {
        // Kc 2 → 6, Ti 8 → 4, Td 1 → 0 (the derivative, decayed to 0 at constant inputs, folds into I):
        // the output moves by the new controller's own integral step Ki'·h·e = 1.5·0.1·0.5 only
        PidController c = new PidController(pid().build());
        for (int k = 0; k < 200; k++) {
            c.update(1.0, 0.5);
        }
        double last = c.position();
        c.retune(pid().gains(IdealGains.pi(6.0, 4.0)).setpointWeights(0.5, 0.0).build());
        assertThat(c.update(1.0, 0.5) - last).isCloseTo(1.5 * 0.1 * 0.5, within(1e-9));
    }

    @Test
    void manualToAutomaticAndBackIsBumpless() {
        PidController c = new PidController(pid().build());
        for (int k = 0; k < 50; k++) {
            c.update(1.0, 0.2);
        }
        double auto = c.position();
        c.switchToManual();
        assertThat(c.update(1.0, 0.9)).isEqualTo(auto);
        c.manualOutput(12.5);
        assertThat(c.update(1.0, 0.9)).isEqualTo(12.5);
        c.switchToAutomatic();
        assertThat(c.update(1.0, 0.4)).isCloseTo(12.5, within(1e-12));
        assertThat(c.mode()).isEqualTo(Mode.AUTOMATIC);
    }
}
