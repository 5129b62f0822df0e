package org.loopwright.sim.timing;

import java.lang.management.ManagementFactory;

import org.HdrHistogram.Histogram;
import org.loopwright.pid.runner.LoopRunner;
import org.loopwright.pid.runner.TimingListener;

/**
 * Records each tick's period error into a histogram on the loop thread, reads the thread's CPU time
 * at the first tick and once the duration has passed, then ends the run. Allocates nothing per tick.
 */
final class PeriodErrorRecorder implements TimingListener {

    /** Errors above 10 s are recorded as 10 s (the histogram's top). */
    private static final long HIGHEST_NANOS = 10_000_000_000L;

    private final com.sun.management.ThreadMXBean threads =
            (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
    private final Histogram periodErrors = new Histogram(HIGHEST_NANOS, 3);
    private final long periodNanos;
    private final long durationNanos;
    private LoopRunner runner;
    private volatile boolean finished;
    private long ticks;
    private long overruns;
    private long firstStart;
    private long previousStart;
    private long lastStart;
    private long cpuAtFirst;
    private long cpuAtLast;

    PeriodErrorRecorder(long periodNanos, long durationNanos) {
        this.periodNanos = periodNanos;
        this.durationNanos = durationNanos;
    }

    void stopRunnerWhenDone(LoopRunner loopRunner) {
        runner = loopRunner;
    }

    @Override
    public void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overrun) {
        if (finished) {
            return;
        }
        if (ticks == 0) {
            firstStart = startNanos;
            cpuAtFirst = threads.getCurrentThreadCpuTime();
        } else {
            long error = Math.abs(startNanos - previousStart - periodNanos);
            periodErrors.recordValue(Math.min(error, HIGHEST_NANOS));
        }
        ticks++;
        if (overrun) {
            overruns++;
        }
        previousStart = startNanos;
        if (startNanos - firstStart >= durationNanos) {
            lastStart = startNanos;
            cpuAtLast = threads.getCurrentThreadCpuTime();
            finished = true;
            if (runner != null) {
                runner.stop();
            }
        }
    }

    boolean finished() {
        return finished;
    }

    /** The run, once {@link #finished()}. */
    TimedRun result(String loop, long spinMarginNanos, long skipped, double updateNanos) {
        long wall = lastStart - firstStart;
        TimingResult figures = new TimingResult(loop, periodNanos, spinMarginNanos, ticks, overruns, skipped,
                periodErrors.getValueAtPercentile(50.0), periodErrors.getValueAtPercentile(99.0),
                periodErrors.getValueAtPercentile(99.9), periodErrors.getMaxValue(),
                (double) (cpuAtLast - cpuAtFirst) / wall, wall * 1e-9, updateNanos);
        return new TimedRun(figures, periodErrors.copy());
    }
}
