package org.loopwright.sim.sweep;

import java.util.Arrays;

import org.loopwright.sim.metrics.ResponseAccumulator;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseWindow;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.SampleRecorder;

/**
 * What a sweep run keeps as it goes, instead of its trajectory: its response figures
 * ({@link ResponseAccumulator}), the {@link SustainedOscillation} check when the run is judged by simulation,
 * and its measurement thinned to about {@value Sweep#PLOT_POINTS} points (every n-th sample and the last) for
 * the plot. Sized once for the scenario's sample count and reused run after run.
 *
 * <p>Not thread-safe: one thread's loop feeds it. {@link #record} allocates nothing.
 */
final class RunRecorder implements SampleRecorder {

    private final ResponseAccumulator metrics;
    private final int stride;
    private final double[] plotTimes;
    private final double[] plotMeasurements;
    private SustainedOscillation oscillation;
    private int samples;
    private int kept;
    private double lastTime;
    private double lastMeasurement;
    private boolean diverged;
    /** The instants of the last trace handed out, shared by the next when they are the same. */
    private double[] sharedTimes = new double[0];

    /** A recorder for runs of the scenario (any plant: the window and the sample count are the plant's own). */
    RunRecorder(Scenario scenario) {
        int capacity = scenario.sampleCount();
        metrics = new ResponseAccumulator(ResponseWindow.of(scenario), capacity);
        stride = Math.max(1, (capacity + Sweep.PLOT_POINTS - 1) / Sweep.PLOT_POINTS);
        plotTimes = new double[(capacity + stride - 1) / stride + 1];
        plotMeasurements = new double[plotTimes.length];
    }

    /** Has this run's process error fed to {@code check} too, until the next {@link #clear()}. */
    void watch(SustainedOscillation check) {
        oscillation = check;
    }

    @Override
    public void record(double t, double r, double y, double u, double d, double process, double delivered,
            boolean limited) {
        metrics.sample(t, r, process, u, limited);
        if (oscillation != null) {
            oscillation.sample(t, r - process);
        }
        if (samples % stride == 0) {
            plotTimes[kept] = t;
            plotMeasurements[kept] = y;
            kept++;
        }
        lastTime = t;
        lastMeasurement = y;
        samples++;
    }

    @Override
    public void markDiverged(double instant) {
        diverged = true;
    }

    @Override
    public void clear() {
        metrics.clear();
        oscillation = null;
        samples = 0;
        kept = 0;
        diverged = false;
    }

    /** Whether this run was stopped as diverged. */
    boolean diverged() {
        return diverged;
    }

    /** The response figures of this run. */
    ResponseMetrics metrics() {
        return metrics.finish(diverged);
    }

    /**
     * This run's thinned measurement, the last sample's included, on the instants of the previous run's trace
     * when they are the same.
     */
    PlotTrace plot() {
        double[] times = thinned(plotTimes, lastTime);
        if (!Arrays.equals(times, sharedTimes)) {
            sharedTimes = times;
        }
        return new PlotTrace(sharedTimes, thinned(plotMeasurements, lastMeasurement));
    }

    private double[] thinned(double[] kept, double last) {
        boolean lastKept = samples == 0 || (samples - 1) % stride == 0;
        double[] copy = Arrays.copyOf(kept, lastKept ? this.kept : this.kept + 1);
        if (!lastKept) {
            copy[this.kept] = last;
        }
        return copy;
    }
}
