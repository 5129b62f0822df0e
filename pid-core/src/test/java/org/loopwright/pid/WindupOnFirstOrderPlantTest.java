package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.IdealGains;

/**
 * A saturated PI controller on a first-order plant K/(T·s + 1), simulated exactly inside the test
 * (zero-order hold: y(k+1) = a·y(k) + K·(1 − a)·u(k), a = e^(−h/T)).
 *
 * <p>Analytic anchor: with Ti = T the loop without limits is first order with time constant
 * T/(Kc·K) and no overshoot (pole–zero cancellation; Åström &amp; Murray 2021, ch. 11, and a standard
 * textbook result). With an output limit the integral winds up while the output is saturated and
 * the measurement overshoots; common practice: windup protection removes most of that overshoot.
 */
class WindupOnFirstOrderPlantTest {

    private static final double PLANT_GAIN = 1.0;
    private static final double TIME_CONSTANT = 10.0;
    private static final double PERIOD = 0.05;
    private static final double CONTROLLER_GAIN = 5.0;
    private static final double DURATION = 40.0;

    /** Returns the measurement samples of a unit setpoint step. */
    private static double[] stepResponse(double outputMax, WindupProtection scheme) {
        ControllerSettings s = ControllerSettings.builder()
                .gains(IdealGains.pi(CONTROLLER_GAIN, TIME_CONSTANT))
                .samplePeriodSeconds(PERIOD)
                .outputRange(0.0, outputMax)
                .windupProtection(scheme)
                .build();
        PidController c = new PidController(s);
        double a = Math.exp(-PERIOD / TIME_CONSTANT);
        int steps = (int) Math.round(DURATION / PERIOD);
        double[] y = new double[steps + 1];
        for (int k = 0; k < steps; k++) {
            double u = c.update(1.0, y[k]);
            y[k + 1] = a * y[k] + PLANT_GAIN * (1.0 - a) * u;
        }
        return y;
    }

    private static double overshoot(double[] y) {
        double peak = Double.NEGATIVE_INFINITY;
        for (double v : y) {
            peak = Math.max(peak, v);
        }
        return Math.max(0.0, peak - 1.0);
    }

    @Test
    void unlimitedLoopIsTheAnalyticFirstOrderResponse() {
        double[] y = stepResponse(Double.POSITIVE_INFINITY, WindupProtection.NONE);
        double closedLoopTimeConstant = TIME_CONSTANT / (CONTROLLER_GAIN * PLANT_GAIN);
        for (int k = 0; k < y.length; k++) {
            double t = k * PERIOD;
            // sampling adds a delay of about h/2 and a small gain error; 0.01 covers both at h = T/200
            assertThat(y[k]).as("y(%f)", t).isCloseTo(1.0 - Math.exp(-t / closedLoopTimeConstant), within(0.01));
        }
        assertThat(overshoot(y)).isLessThan(1e-3);
    }

    @Test
    void protectionRemovesMostOfTheWindupOvershoot() {
        // the output may go to 1.5: the unlimited loop starts at u = Kc = 5, so it saturates for a while
        double unlimited = overshoot(stepResponse(Double.POSITIVE_INFINITY, WindupProtection.NONE));
        double wound = overshoot(stepResponse(1.5, WindupProtection.NONE));
        assertThat(wound).as("overshoot without protection").isGreaterThan(0.1);
        for (WindupProtection scheme : new WindupProtection[] {WindupProtection.CLAMPING,
                WindupProtection.BACK_CALCULATION, WindupProtection.ACTUATOR_TRACKING}) {
            double protectedOvershoot = overshoot(stepResponse(1.5, scheme));
            assertThat(protectedOvershoot - unlimited).as(scheme.name()).isLessThan(0.25 * (wound - unlimited));
        }
    }
}
