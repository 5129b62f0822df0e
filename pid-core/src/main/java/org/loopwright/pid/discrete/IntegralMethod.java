package org.loopwright.pid.discrete;

/**
 * Approximation of the integral over one period [t(k−1), t(k)] of length h, for an integral gain
 * Ki: the increment is {@code weightOnCurrent·e(k) + weightOnPrevious·e(k−1)}
 * (Åström &amp; Wittenmark 1997, §8.2).
 */
public enum IntegralMethod {
    /** h·e(k−1): the rectangle on the left. */
    FORWARD_EULER,
    /** h·e(k): the rectangle on the right. */
    BACKWARD_EULER,
    /** h·(e(k−1) + e(k))/2: the trapezoid. */
    TUSTIN;

    /**
     * Weight of the current error e(k) in the integral increment.
     *
     * @param integralGain Ki in 1/s
     * @param periodSeconds the sample period h in seconds
     * @return b0, the factor on e(k)
     */
    public double weightOnCurrent(double integralGain, double periodSeconds) {
        return switch (this) {
            case FORWARD_EULER -> 0.0;
            case BACKWARD_EULER -> integralGain * periodSeconds;
            case TUSTIN -> 0.5 * integralGain * periodSeconds;
        };
    }

    /**
     * Weight of the previous error e(k−1) in the integral increment.
     *
     * @param integralGain Ki in 1/s
     * @param periodSeconds the sample period h in seconds
     * @return b1, the factor on e(k−1)
     */
    public double weightOnPrevious(double integralGain, double periodSeconds) {
        return switch (this) {
            case FORWARD_EULER -> integralGain * periodSeconds;
            case BACKWARD_EULER -> 0.0;
            case TUSTIN -> 0.5 * integralGain * periodSeconds;
        };
    }
}
