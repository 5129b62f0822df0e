package org.loopwright.sim.metrics;

import java.util.Optional;

import org.loopwright.sim.simulate.Trajectory;

/**
 * The sustained oscillation of a loop (an on-off loop hunting around its setpoint), measured on the
 * true process output: the period as the mean time between upward crossings of the output's mean
 * level (interpolated between samples), and the amplitude as half the peak-to-peak swing over the
 * whole cycles seen.
 *
 * @param amplitude     half the peak-to-peak swing, process units
 * @param periodSeconds the oscillation's period
 * @param cycles        the number of whole cycles the figures rest on
 */
public record LimitCycle(double amplitude, double periodSeconds, int cycles) {

    /**
     * The limit cycle after {@code fromSeconds} (skip the start-up), or empty when fewer than two
     * whole cycles are seen.
     */
    public static Optional<LimitCycle> of(Trajectory trajectory, double fromSeconds) {
        int first = 0;
        int n = trajectory.length();
        while (first < n && trajectory.time(first) < fromSeconds) {
            first++;
        }
        if (n - first < 4) {
            return Optional.empty();
        }
        double mean = 0.0;
        for (int k = first; k < n; k++) {
            mean += trajectory.process(k);
        }
        mean /= n - first;
        double firstCrossing = Double.NaN;
        double lastCrossing = Double.NaN;
        int firstIndex = -1;
        int lastIndex = -1;
        int crossings = 0;
        for (int k = first + 1; k < n; k++) {
            double before = trajectory.process(k - 1) - mean;
            double here = trajectory.process(k) - mean;
            if (before < 0.0 && here >= 0.0) {
                double t = trajectory.time(k - 1)
                        + (-before / (here - before)) * (trajectory.time(k) - trajectory.time(k - 1));
                if (crossings == 0) {
                    firstCrossing = t;
                    firstIndex = k;
                }
                lastCrossing = t;
                lastIndex = k;
                crossings++;
            }
        }
        if (crossings < 3) {
            return Optional.empty();
        }
        double max = Double.NEGATIVE_INFINITY;
        double min = Double.POSITIVE_INFINITY;
        for (int k = firstIndex; k <= lastIndex; k++) {
            max = Math.max(max, trajectory.process(k));
            min = Math.min(min, trajectory.process(k));
        }
        int cycles = crossings - 1;
        return Optional.of(new LimitCycle(0.5 * (max - min), (lastCrossing - firstCrossing) / cycles, cycles));
    }
}
