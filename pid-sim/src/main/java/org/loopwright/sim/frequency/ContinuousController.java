package org.loopwright.sim.frequency;

import org.hipparchus.complex.Complex;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.ParallelGains;

/**
 * The continuous design the discrete controller approximates, from error to output:
 * C(s) = Kp + Ki/s + Kd·s/(1 + s·Tf), with the derivative filter time Tf the settings resolve.
 * Setpoint weights do not enter: they shape the response to setpoint changes, not the feedback loop.
 *
 * <p>Source: Åström &amp; Hägglund, <i>Advanced PID Control</i> (2006), §3.2–3.3. Thread-safe: immutable.
 */
public final class ContinuousController implements FrequencyResponse {

    private final double proportionalGain;
    private final double integralGain;
    private final double derivativeGain;
    private final double filterTimeSeconds;

    /** The continuous controller of {@code settings} (its action sign excluded). */
    public ContinuousController(ControllerSettings settings) {
        ParallelGains gains = settings.parallelGains();
        proportionalGain = gains.proportionalGain();
        integralGain = gains.integralGain();
        derivativeGain = gains.derivativeGain();
        filterTimeSeconds = settings.derivativeFilterTimeSeconds();
    }

    @Override
    public Complex at(double omegaRadPerSecond) {
        Complex s = new Complex(0.0, omegaRadPerSecond);
        Complex response = Complex.valueOf(proportionalGain);
        if (integralGain != 0.0) {
            response = response.add(Complex.valueOf(integralGain).divide(s));
        }
        if (derivativeGain != 0.0) {
            response = response.add(s.multiply(derivativeGain).divide(s.multiply(filterTimeSeconds).add(1.0)));
        }
        return response;
    }
}
