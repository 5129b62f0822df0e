package org.loopwright.sim.assess;

/**
 * Horch's cross-correlation test for stiction (Horch 1999, "A simple method for detection of stiction
 * in control valves", Control Engineering Practice 7; from memory). In an oscillating loop with
 * integral action on a process whose measurement follows the sticking element (self-regulating, or a
 * position on a sticking drive), stiction makes the output a ramp (the integral of a square-ish
 * error) and the measurement square-ish: the two are a quarter period apart, and the
 * cross-correlation of output and measurement is an odd function of the lag. An oscillation from
 * aggressive tuning or an outside disturbance leaves them nearly in anti-phase: the cross-correlation
 * is even, its extremum at lag 0. The test does not apply to integrating processes (a level behind a
 * sticking valve ramps, which turns the picture round).
 *
 * <p>The figure: with τl &le; 0 &lt; τr the zero crossings of the cross-correlation nearest lag 0,
 * φ = 90°·|τr + τl|/(τr − τl), the phase shift between output and (negated) measurement read off
 * the crossings: 0° for an even function, 90° for an odd one. Our cut-offs: odd (stiction) above
 * {@value #ALARM_DEGREES}°, where lag 0 lies nearer a zero crossing than the extremum between them;
 * undecided from {@value #WARN_DEGREES}°.
 */
public final class HorchStiction {

    /** Phase above which the cross-correlation counts as odd: stiction (our cut-off). */
    public static final double ALARM_DEGREES = 45.0;
    /** Phase from which the test is undecided (our cut-off). */
    public static final double WARN_DEGREES = 30.0;

    private HorchStiction() {
    }

    /**
     * The phase φ in degrees, or NaN when the cross-correlation has no zero crossing on one side within
     * the given lag range.
     *
     * @param output      controller output samples
     * @param measurement measurement samples
     * @param from        first sample used
     * @param to          one past the last sample used
     * @param maxLag      largest lag examined (samples), about one oscillation period
     */
    public static double phaseDegrees(double[] output, double[] measurement, int from, int to, int maxLag) {
        double[] r = crossCorrelation(output, measurement, from, to, maxLag);
        double right = Double.NaN;
        for (int lag = 0; lag < maxLag; lag++) {
            double a = r[maxLag + lag];
            double b = r[maxLag + lag + 1];
            if ((a >= 0.0) != (b >= 0.0)) {
                right = lag + a / (a - b);
                break;
            }
        }
        double left = Double.NaN;
        for (int lag = 0; lag > -maxLag; lag--) {
            double a = r[maxLag + lag];
            double b = r[maxLag + lag - 1];
            if ((a >= 0.0) != (b >= 0.0)) {
                left = lag - a / (a - b);
                break;
            }
        }
        if (Double.isNaN(right) || Double.isNaN(left) || !(right > left)) {
            return Double.NaN;
        }
        return 90.0 * Math.abs(right + left) / (right - left);
    }

    /**
     * The normalised cross-correlation r(τ) of output u(t + τ) and measurement y(t), means removed,
     * for τ = −maxLag..maxLag at index τ + maxLag.
     */
    static double[] crossCorrelation(double[] u, double[] y, int from, int to, int maxLag) {
        int n = to - from;
        double meanU = 0.0;
        double meanY = 0.0;
        for (int k = from; k < to; k++) {
            meanU += u[k];
            meanY += y[k];
        }
        meanU /= n;
        meanY /= n;
        double varU = 0.0;
        double varY = 0.0;
        for (int k = from; k < to; k++) {
            varU += (u[k] - meanU) * (u[k] - meanU);
            varY += (y[k] - meanY) * (y[k] - meanY);
        }
        double scale = Math.sqrt(varU * varY);
        double[] r = new double[2 * maxLag + 1];
        for (int lag = -maxLag; lag <= maxLag; lag++) {
            double sum = 0.0;
            for (int t = Math.max(from, from - lag); t < Math.min(to, to - lag); t++) {
                sum += (u[t + lag] - meanU) * (y[t] - meanY);
            }
            r[lag + maxLag] = scale > 0.0 ? sum / scale : 0.0;
        }
        return r;
    }
}
