package org.loopwright.sim.sweep;

import java.util.Arrays;
import java.util.function.IntToDoubleFunction;

/**
 * The spread of one figure over the runs where it has a value (NaN values, figures that do not
 * apply, are left out and not counted). Percentiles interpolate linearly between order statistics:
 * with the n values sorted x₀ ≤ … ≤ x₍ₙ₋₁₎, the p-th percentile is x at the fractional rank
 * (n − 1)·p/100 (Hyndman &amp; Fan 1996, definition 7, the default of R and NumPy); the median is the 50th.
 *
 * @param count  the number of runs with a value
 * @param min    the smallest value (NaN when count is 0)
 * @param median the median
 * @param p90    the 90th percentile
 * @param max    the largest value
 */
public record Distribution(int count, double min, double median, double p90, double max) {

    /** The distribution of the non-NaN values (infinite ones count, and sort to the ends). */
    public static Distribution of(double[] values) {
        double[] sorted = Arrays.stream(values).filter(v -> !Double.isNaN(v)).sorted().toArray();
        if (sorted.length == 0) {
            return new Distribution(0, Double.NaN, Double.NaN, Double.NaN, Double.NaN);
        }
        return new Distribution(sorted.length, sorted[0], percentile(sorted, 50.0), percentile(sorted, 90.0),
                sorted[sorted.length - 1]);
    }

    /** The p-th percentile (0 ≤ p ≤ 100) of sorted values, interpolated linearly. */
    static double percentile(double[] sorted, double p) {
        return percentile(k -> sorted[k], sorted.length, p);
    }

    /**
     * The p-th percentile (0 ≤ p ≤ 100) of n values, interpolated linearly, given the k-th smallest of them for
     * any k from 0 (so a caller can select the two ranks it needs instead of sorting them all).
     */
    static double percentile(IntToDoubleFunction kthSmallest, int n, double p) {
        double rank = (n - 1) * p / 100.0;
        int below = (int) Math.floor(rank);
        if (below + 1 >= n) {
            return kthSmallest.applyAsDouble(n - 1);
        }
        double fraction = rank - below;
        double low = kthSmallest.applyAsDouble(below);
        return fraction == 0.0 ? low : low + fraction * (kthSmallest.applyAsDouble(below + 1) - low);
    }
}
