package org.loopwright.sim.assess;

/**
 * The period and regularity of an oscillation from the zero crossings of the autocorrelation of the
 * error (Thornhill, Huang &amp; Zhang 2003, "Detection of multiple oscillations in control loops",
 * Journal of Process Control 13; from memory). The autocorrelation of an oscillating signal oscillates
 * with the same period, with the noise filtered out. From the first {@value #CROSSINGS} zero crossings
 * (interpolated between lags) the intervals Δi give periods Tp,i = 2Δi; the period is their mean and
 * the regularity r = mean(Tp) / (3·std(Tp)). An oscillation is regular when r &gt; {@value #REGULAR}.
 *
 * @param periodSeconds the mean period, NaN when not found
 * @param regularity    r, NaN when not found
 * @param crossings     zero crossings used
 */
public record ErrorAutocorrelation(double periodSeconds, double regularity, int crossings) {

    /** Zero crossings used (ten intervals). */
    public static final int CROSSINGS = 11;
    /** Regularity above which the oscillation is regular (Thornhill et al. 2003, from memory). */
    public static final double REGULAR = 1.0;
    /** Fewest crossings for a figure (three intervals). */
    public static final int MIN_CROSSINGS = 4;

    /**
     * Analyses e[from..to): the autocorrelation is computed lag by lag up to half the stretch until
     * {@value #CROSSINGS} zero crossings are found.
     */
    public static ErrorAutocorrelation of(double[] e, int from, int to, double samplePeriodSeconds) {
        int n = to - from;
        double mean = 0.0;
        for (int k = from; k < to; k++) {
            mean += e[k];
        }
        mean /= n;
        double r0 = lagSum(e, from, to, mean, 0);
        double[] crossings = new double[CROSSINGS];
        int found = 0;
        double previous = 1.0;
        for (int lag = 1; lag <= n / 2 && found < CROSSINGS && r0 > 0.0; lag++) {
            double r = lagSum(e, from, to, mean, lag) / r0;
            if ((r >= 0.0) != (previous >= 0.0)) {
                crossings[found++] = lag - 1 + previous / (previous - r);
            }
            previous = r;
        }
        if (found < MIN_CROSSINGS) {
            return new ErrorAutocorrelation(Double.NaN, Double.NaN, found);
        }
        int intervals = found - 1;
        double sum = 0.0;
        for (int i = 0; i < intervals; i++) {
            sum += 2.0 * (crossings[i + 1] - crossings[i]);
        }
        double meanPeriod = sum / intervals;
        double squares = 0.0;
        for (int i = 0; i < intervals; i++) {
            double d = 2.0 * (crossings[i + 1] - crossings[i]) - meanPeriod;
            squares += d * d;
        }
        double std = Math.sqrt(squares / (intervals - 1));
        return new ErrorAutocorrelation(meanPeriod * samplePeriodSeconds, meanPeriod / (3.0 * std), found);
    }

    private static double lagSum(double[] e, int from, int to, double mean, int lag) {
        double sum = 0.0;
        for (int k = from; k + lag < to; k++) {
            sum += (e[k] - mean) * (e[k + lag] - mean);
        }
        return sum;
    }

    /** Whether a period was found and the oscillation is regular. */
    public boolean regular() {
        return regularity > REGULAR;
    }
}
