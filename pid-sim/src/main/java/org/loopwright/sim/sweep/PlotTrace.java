package org.loopwright.sim.sweep;

/**
 * A run's measurement thinned for the plot: the instants kept and the measurement at each, read one value at
 * a time so nothing is copied. Immutable. The runs of a sweep whose instants are the same (every run without
 * sensor jitter) share one array of them: 10⁴ runs keep 10⁴ measurements and the instants once, which halves
 * what a sweep holds and what the collector copies while it runs.
 */
public final class PlotTrace {

    private final double[] times;
    private final double[] measurements;

    /** Takes the arrays as they are: the caller hands them over and keeps no reference it writes to. */
    PlotTrace(double[] times, double[] measurements) {
        if (times.length != measurements.length) {
            throw new IllegalArgumentException("a trace needs a measurement per instant: " + times.length
                    + " instants, " + measurements.length + " measurements");
        }
        this.times = times;
        this.measurements = measurements;
    }

    /** The number of points. */
    public int length() {
        return times.length;
    }

    /** Instant {@code k}, seconds. */
    public double time(int k) {
        return times[k];
    }

    /** The measurement at instant {@code k} (NaN for a dropout). */
    public double measurement(int k) {
        return measurements[k];
    }

    /** A copy of the instants, seconds. */
    public double[] times() {
        return times.clone();
    }

    /** A copy of the measurements. */
    public double[] measurements() {
        return measurements.clone();
    }

    /** Whether the instants are the same array as {@code other}'s (shared, so equal without a comparison). */
    boolean sharesTimesWith(PlotTrace other) {
        return times == other.times;
    }
}
