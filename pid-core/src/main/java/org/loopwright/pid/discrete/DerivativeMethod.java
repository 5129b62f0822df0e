package org.loopwright.pid.discrete;

import org.loopwright.pid.InvalidSettingException;

/**
 * Discretisation of the filtered derivative D(s) = Kd·s/(1 + s·Tf). Every method gives the same
 * recursion D(k) = pole·D(k−1) + gain·(v(k) − v(k−1)), with v the derivative's input
 * (Åström &amp; Wittenmark 1997, §8.3; the invariant forms are derived in the class notes below).
 *
 * <ul>
 *   <li>backward Euler: pole = Tf/(Tf + h), gain = Kd/(Tf + h) — stable for every h;</li>
 *   <li>Tustin: pole = (2Tf − h)/(2Tf + h), gain = 2Kd/(2Tf + h);</li>
 *   <li>step invariant (zero-order hold): pole = e^(−h/Tf), gain = Kd/Tf;</li>
 *   <li>ramp invariant (first-order hold): pole = e^(−h/Tf), gain = Kd·(1 − e^(−h/Tf))/h;</li>
 *   <li>forward Euler: pole = 1 − h/Tf, gain = Kd/Tf — stable only for h &lt; 2·Tf.</li>
 * </ul>
 * The step-invariant form is (1 − z⁻¹)·Z{Kd/Tf·e^(−t/Tf)}; the ramp-invariant one is
 * (z − 1)²/(z·h)·Z{Kd·(1 − e^(−t/Tf))}, both from the continuous step and ramp responses.
 */
public enum DerivativeMethod {
    /** s ≈ (1 − z⁻¹)/h. */
    BACKWARD_EULER,
    /** s ≈ (2/h)·(z − 1)/(z + 1). */
    TUSTIN,
    /** Zero-order-hold (step) invariant. */
    STEP_INVARIANT,
    /** First-order-hold (ramp) invariant. */
    RAMP_INVARIANT,
    /** s ≈ (z − 1)/h; requires h &lt; 2·Tf. */
    FORWARD_EULER;

    /**
     * Whether the recursion is stable for this period and filter time: the one place of the
     * forward-Euler rule h &lt; 2·Tf (pole 1 − h/Tf inside the unit circle).
     *
     * @param periodSeconds     h
     * @param filterTimeSeconds Tf
     * @return false only for a forward-Euler derivative with h &ge; 2·Tf
     */
    public boolean isStable(double periodSeconds, double filterTimeSeconds) {
        return this != FORWARD_EULER || periodSeconds < 2.0 * filterTimeSeconds;
    }

    /**
     * Requires that a derivative term (if there is one) can run at a period.
     *
     * @param derivativeGain    Kd; 0 means no derivative term, which always runs
     * @param periodSeconds     h
     * @param filterTimeSeconds Tf
     * @throws InvalidSettingException naming {@code samplePeriodSeconds} when {@link #isStable} is false
     */
    public void requireStable(double derivativeGain, double periodSeconds, double filterTimeSeconds) {
        if (derivativeGain > 0.0 && !isStable(periodSeconds, filterTimeSeconds)) {
            throw new InvalidSettingException("samplePeriodSeconds", periodSeconds,
                    "must be < 2 * derivativeFilterTimeSeconds for the forward-Euler derivative"
                            + " (derivativeFilterTimeSeconds=" + filterTimeSeconds + ")");
        }
    }

    /**
     * The pole of the recursion (weight of D(k−1)); needs Tf &gt; 0.
     *
     * @param periodSeconds the sample period h in seconds, &gt; 0
     * @param filterTimeSeconds the derivative filter time Tf in seconds, &gt; 0
     * @return ad, the weight of D(k−1)
     */
    public double pole(double periodSeconds, double filterTimeSeconds) {
        return switch (this) {
            case BACKWARD_EULER -> filterTimeSeconds / (filterTimeSeconds + periodSeconds);
            case TUSTIN -> (2.0 * filterTimeSeconds - periodSeconds) / (2.0 * filterTimeSeconds + periodSeconds);
            case STEP_INVARIANT, RAMP_INVARIANT -> Math.exp(-periodSeconds / filterTimeSeconds);
            case FORWARD_EULER -> 1.0 - periodSeconds / filterTimeSeconds;
        };
    }

    /**
     * The gain of the recursion (weight of v(k) − v(k−1)); needs Tf &gt; 0.
     *
     * @param derivativeGain Kd in output units times seconds per unit of error, &ge; 0
     * @param periodSeconds the sample period h in seconds, &gt; 0
     * @param filterTimeSeconds the derivative filter time Tf in seconds, &gt; 0
     * @return bd, the weight of v(k) − v(k−1)
     */
    public double gain(double derivativeGain, double periodSeconds, double filterTimeSeconds) {
        return switch (this) {
            case BACKWARD_EULER -> derivativeGain / (filterTimeSeconds + periodSeconds);
            case TUSTIN -> 2.0 * derivativeGain / (2.0 * filterTimeSeconds + periodSeconds);
            case STEP_INVARIANT, FORWARD_EULER -> derivativeGain / filterTimeSeconds;
            case RAMP_INVARIANT -> derivativeGain * -Math.expm1(-periodSeconds / filterTimeSeconds) / periodSeconds;
        };
    }
}
