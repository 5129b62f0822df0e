package org.loopwright.pid.discrete;

/**
 * The difference-equation coefficients of one controller at one sample period, as the controller
 * runs them. Feedback path (setpoint weights aside), with e the error and v the derivative input:
 * <pre>
 *   P(k) = proportionalGain·e(k)
 *   I(k) = I(k−1) + integralWeightOnCurrent·e(k) + integralWeightOnPrevious·e(k−1)
 *   D(k) = derivativePole·D(k−1) + derivativeGain·(v(k) − v(k−1))
 * </pre>
 * so the controller's pulse-transfer function from error to output is
 * C(z) = Kp + (b0 + b1·z⁻¹)/(1 − z⁻¹) + bd·(1 − z⁻¹)/(1 − ad·z⁻¹).
 *
 * @param periodSeconds            h
 * @param proportionalGain         Kp
 * @param integralWeightOnCurrent  b0
 * @param integralWeightOnPrevious b1
 * @param derivativePole           ad (0 when there is no derivative action)
 * @param derivativeGain           bd (0 when there is no derivative action)
 */
public record DiscretePid(double periodSeconds, double proportionalGain, double integralWeightOnCurrent,
        double integralWeightOnPrevious, double derivativePole, double derivativeGain) {

    /**
     * Coefficients for parallel gains, a derivative filter time and the chosen methods.
     * No derivative action (Kd = 0) gives a zero pole and gain, whatever the filter.
     *
     * @param proportionalGain Kp
     * @param integralGain Ki in 1/s
     * @param derivativeGain Kd in s
     * @param filterTimeSeconds the derivative filter time Tf in seconds (&gt; 0 when Kd &gt; 0)
     * @param integral how the integral is discretised
     * @param derivative how the filtered derivative is discretised
     * @param periodSeconds the sample period h in seconds, &gt; 0
     * @return the coefficients at that period
     */
    public static DiscretePid of(double proportionalGain, double integralGain, double derivativeGain,
            double filterTimeSeconds, IntegralMethod integral, DerivativeMethod derivative, double periodSeconds) {
        boolean hasDerivative = derivativeGain > 0.0;
        return new DiscretePid(periodSeconds, proportionalGain,
                integral.weightOnCurrent(integralGain, periodSeconds),
                integral.weightOnPrevious(integralGain, periodSeconds),
                hasDerivative ? derivative.pole(periodSeconds, filterTimeSeconds) : 0.0,
                hasDerivative ? derivative.gain(derivativeGain, periodSeconds, filterTimeSeconds) : 0.0);
    }
}
