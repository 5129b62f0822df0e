package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;

/**
 * Back-calculation and tracking against Åström &amp; Murray, <i>Feedback Systems</i> (2nd ed., 2021),
 * ch. 11 (§11.4 integrator windup, §11.5 implementation). Their computer code, quoted from memory:
 * <pre>
 *   bi = K·h/Ti;  ad = Td/(Td + N·h);  bd = K·Td·N/(Td + N·h);  br = h/Tt
 *   P = K·(b·r − y);  D = ad·D − bd·(y − yold);  v = P + I + D;  u = sat(v)
 *   I = I + bi·(r − y) + br·(u − v);  yold = y
 * </pre>
 * The integral is updated after the output, so the controller's forward-Euler integral with the
 * backward-Euler derivative is this algorithm. For tracking, u in the integral update is the
 * actuator's measured position. The numbers below were worked by hand from these lines for
 * K = 1, Ti = 2 s, Td = 0.5 s, N = 5, Tt = 0.5 s, h = 0.1 s, b = 1, output in [−1, 1]:
 * bi = 0.05, ad = 0.5, bd = 2.5, br = 0.2; setpoint 2, measurements 0, 0.1, 0.3, 0.6.
 */
class BackCalculationTest {

    private static final double[] MEASUREMENTS = {0.0, 0.1, 0.3, 0.6};
    private static final double EXACT = 1e-12;

    private static ControllerSettings.Builder bookCase() {
        return ControllerSettings.builder()
                .gains(new IdealGains(1.0, 2.0, 0.5))
                .derivativeFilterRatio(5.0)
                .samplePeriodSeconds(0.1)
                .integralMethod(IntegralMethod.FORWARD_EULER)
                .derivativeMethod(DerivativeMethod.BACKWARD_EULER)
                .trackingTimeSeconds(0.5)
                .outputRange(-1.0, 1.0);
    }

    @Test
    void backCalculationFollowsTheBookStepByStep() {
        // k = 0: P = 2, D = 0, I = 0, v = 2, u = 1;      then I = 0 + 0.05·2 + 0.2·(1 − 2) = −0.1
        // k = 1: P = 1.9, D = −2.5·0.1 = −0.25, v = 1.55, u = 1;  I = −0.1 + 0.095 + 0.2·(1 − 1.55) = −0.115
        // k = 2: P = 1.7, D = 0.5·(−0.25) − 2.5·0.2 = −0.625, v = 0.96, u = 0.96;  I = −0.115 + 0.085 = −0.03
        // k = 3: P = 1.4, D = 0.5·(−0.625) − 2.5·0.3 = −1.0625, v = 0.3075, u = 0.3075
        double[] integral = {0.0, -0.1, -0.115, -0.03};
        double[] derivative = {0.0, -0.25, -0.625, -1.0625};
        double[] output = {1.0, 1.0, 0.96, 0.3075};
        PidController c = new PidController(bookCase().windupProtection(WindupProtection.BACK_CALCULATION).build());
        for (int k = 0; k < MEASUREMENTS.length; k++) {
            assertThat(c.update(2.0, MEASUREMENTS[k])).as("u(%d)", k).isCloseTo(output[k], within(EXACT));
            assertThat(c.integralTerm()).as("I(%d)", k).isCloseTo(integral[k], within(EXACT));
            assertThat(c.derivativeTerm()).as("D(%d)", k).isCloseTo(derivative[k], within(EXACT));
            assertThat(c.proportionalTerm()).as("P(%d)", k).isCloseTo(2.0 - MEASUREMENTS[k], within(EXACT));
        }
    }

    @Test
    void trackingUsesTheActuatorsMeasuredPosition() {
        // The valve sticks at 0.8 for two samples, then follows the command. With u the measured position:
        // I(1) = 0 + 0.1 + 0.2·(0.8 − 2) = −0.14;          v(1) = 1.9 − 0.14 − 0.25 = 1.51, u = 1
        // I(2) = −0.14 + 0.095 + 0.2·(0.8 − 1.51) = −0.187; v(2) = 1.7 − 0.187 − 0.625 = 0.888
        // I(3) = −0.187 + 0.085 + 0.2·(0.888 − 0.888) = −0.102; v(3) = 1.4 − 0.102 − 1.0625 = 0.2355
        double[] actuator = {Double.NaN, 0.8, 0.8, 0.888};
        double[] integral = {0.0, -0.14, -0.187, -0.102};
        double[] output = {1.0, 1.0, 0.888, 0.2355};
        PidController c = new PidController(bookCase().windupProtection(WindupProtection.ACTUATOR_TRACKING).build());
        for (int k = 0; k < MEASUREMENTS.length; k++) {
            c.actuatorPosition(actuator[k]);
            assertThat(c.update(2.0, MEASUREMENTS[k])).as("u(%d)", k).isCloseTo(output[k], within(EXACT));
            assertThat(c.integralTerm()).as("I(%d)", k).isCloseTo(integral[k], within(EXACT));
        }
    }

    @Test
    void withoutAnActuatorReadingTrackingFallsBackToTheComputedOutput() {
        PidController tracking = new PidController(bookCase().windupProtection(WindupProtection.ACTUATOR_TRACKING).build());
        PidController back = new PidController(bookCase().windupProtection(WindupProtection.BACK_CALCULATION).build());
        for (double y : MEASUREMENTS) {
            assertThat(tracking.update(2.0, y)).isEqualTo(back.update(2.0, y));
        }
    }

    @Test
    void trackingGainIsCappedAtOneWhenThePeriodExceedsTheTrackingTime() {
        // Our rule, not the book's: with h > Tt the book's br = h/Tt > 1 would overshoot the correction;
        // br = min(h/Tt, 1) = 1 puts the unlimited output exactly on the limit. Tt = 0.05 s, h = 0.1 s:
        // I(1) = 0 + 0.05·2 + 1·(1 − 2) = −0.9
        PidController c = new PidController(bookCase().trackingTimeSeconds(0.05).build());
        c.update(2.0, 0.0);
        c.update(2.0, 0.1);
        assertThat(c.integralTerm()).isCloseTo(-0.9, within(EXACT));
    }

    @Test
    void defaultTrackingTimeIsTheRuleOfThumb() {
        // Tt = √(Ti·Td) for PID (Åström & Murray 2021 §11.4 and Åström & Hägglund 2006 §3.5, a rule of
        // thumb, from memory); for PI, where Td = 0 makes that zero, Tt = Ti.
        assertThat(ControllerSettings.builder().gains(new IdealGains(1.0, 2.0, 0.5)).samplePeriodSeconds(0.1).build()
                .trackingTimeSeconds()).isCloseTo(1.0, within(EXACT));
        assertThat(ControllerSettings.builder().gains(IdealGains.pi(1.0, 7.0)).samplePeriodSeconds(0.1).build()
                .trackingTimeSeconds()).isEqualTo(7.0);
    }

    @Test
    void conditionalIntegrationStopsOnlyWhileTheErrorPushesIntoTheLimit() {
        // Åström & Murray 2021 §11.4: the integral is frozen while the output saturates and the error
        // would drive it further. Same book case, clamping: I stays 0 while u = 1 and e > 0.
        PidController c = new PidController(bookCase().windupProtection(WindupProtection.CLAMPING).build());
        c.update(2.0, 0.0);
        c.update(2.0, 0.1);
        assertThat(c.integralTerm()).isZero();
        // measurement above the setpoint: e < 0 drives the integral out of the limit, so it integrates
        c.update(2.0, 2.5);
        assertThat(c.integralTerm()).isCloseTo(0.05 * 1.9, within(EXACT));
    }
}
