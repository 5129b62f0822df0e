package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

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
        StateSnapshot before = c.snapshot();
        c.retune(pid().gains(new IdealGains(5.0, 8.0, 1.0)).build());
        c.update(Double.NaN, 0.2);
        StateSnapshot after = c.snapshot();
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
            assertThat(sum).isCloseTo(pos, org.assertj.core.api.Assertions.within(1e-9));
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
        assertThat(on - last).isCloseTo(integralStep, org.assertj.core.api.Assertions.within(1e-12));
        assertThat(c.feedforwardTerm()).isEqualTo(7.0);
        c.feedforwardOn(false);
        double off = c.update(1.0, 0.8);
        assertThat(off - on).isCloseTo(integralStep, org.assertj.core.api.Assertions.within(1e-12));
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
    void finiteInputsThatOverflowTheLawAreDroppedLikeAFault() {
        PidController c = new PidController(pid().outputRange(-5.0, 5.0).build());
        c.update(1.0, 0.5);
        StateSnapshot before = c.snapshot();
        double held = c.position();
        // r − y overflows to +∞ although both inputs are finite
        assertThat(c.update(Double.MAX_VALUE, -Double.MAX_VALUE)).isEqualTo(held);
        assertThat(c.fault()).isEqualTo(Fault.ARITHMETIC_OVERFLOW);
        assertThat(c.snapshot()).usingRecursiveComparison().ignoringFields("faultCount").isEqualTo(before);
        assertThat(c.update(1.0, 0.5)).isBetween(-5.0, 5.0);
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
            assertThat(c.position()).isCloseTo(last, org.assertj.core.api.Assertions.within(1e-9));
        }
    }
}
