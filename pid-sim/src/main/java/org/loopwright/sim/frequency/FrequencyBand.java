package org.loopwright.sim.frequency;

import java.util.Arrays;

/**
 * A frequency grid for bracketing crossings: logarithmic with {@code pointsPerDecade} points per
 * decade, and where a dead time L turns the phase fast, no coarser than π/4 of that turn between
 * points (spacing π/(4L) rad/s), so no two crossings share an interval. A sampled loop's band ends at
 * its Nyquist frequency. Thread-safe: immutable.
 *
 * @param lowestRadPerSecond  first grid point, &gt; 0
 * @param highestRadPerSecond last grid point, &gt; lowest
 * @param pointsPerDecade     logarithmic density, &ge; 1
 * @param deadTimeSeconds     the delay whose phase turn the grid must resolve, &ge; 0
 * @param endsAtNyquist       whether the last point is the Nyquist frequency π/h of a sampled loop
 */
public record FrequencyBand(double lowestRadPerSecond, double highestRadPerSecond, int pointsPerDecade,
        double deadTimeSeconds, boolean endsAtNyquist) {

    /** The largest phase turn of the dead time between neighbouring points. */
    private static final double MAX_DELAY_TURN_RADIANS = Math.PI / 4.0;

    /** Checks the band. */
    public FrequencyBand {
        if (!(lowestRadPerSecond > 0.0) || !(highestRadPerSecond > lowestRadPerSecond)
                || !Double.isFinite(highestRadPerSecond)) {
            throw new IllegalArgumentException("band must satisfy 0 < lowest < highest < infinity: lowest="
                    + lowestRadPerSecond + ", highest=" + highestRadPerSecond);
        }
        if (pointsPerDecade < 1) {
            throw new IllegalArgumentException("points per decade must be >= 1: pointsPerDecade=" + pointsPerDecade);
        }
        if (!(deadTimeSeconds >= 0.0) || !Double.isFinite(deadTimeSeconds)) {
            throw new IllegalArgumentException("dead time must be finite and >= 0: deadTimeSeconds=" + deadTimeSeconds);
        }
    }

    /** The grid points, rising, first and last exactly the band's ends. */
    public double[] grid() {
        double logStep = Math.pow(10.0, 1.0 / pointsPerDecade);
        double[] omega = new double[1024];
        int count = 0;
        double w = lowestRadPerSecond;
        while (w < highestRadPerSecond) {
            if (count == omega.length) {
                omega = Arrays.copyOf(omega, 2 * count);
            }
            omega[count++] = w;
            double delayStep = deadTimeSeconds > 0.0 ? MAX_DELAY_TURN_RADIANS / deadTimeSeconds : Double.POSITIVE_INFINITY;
            w = Math.min(w * logStep, w + delayStep);
        }
        if (count > 1 && highestRadPerSecond - omega[count - 1] < 1e-9 * highestRadPerSecond) {
            count--; // the end replaces a point that falls on it
        }
        omega = Arrays.copyOf(omega, count + 1);
        omega[count] = highestRadPerSecond;
        return omega;
    }
}
