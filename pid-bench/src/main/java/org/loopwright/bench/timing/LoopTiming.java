package org.loopwright.bench.timing;

import java.time.Duration;

import org.loopwright.bench.Workloads;
import org.loopwright.pid.PidController;
import org.loopwright.pid.runner.LoopRunner;
import org.loopwright.pid.runner.RunnerSettings;
import org.loopwright.pid.runner.StopReason;

/**
 * Runs one loop at one rate for a while and reports its period-error percentiles, overruns and CPU
 * time. Every tick does the same work: read the next measurement of the bath workload, update the
 * full-featured controller, store the output.
 */
public final class LoopTiming {

    /** The hybrid wait's margin: 100 µs, or half the period when that is shorter. */
    public static long spinMarginFor(long periodNanos) {
        return Math.min(RunnerSettings.DEFAULT_SPIN_MARGIN_NANOS, periodNanos / 2);
    }

    private final double[] setpoints = Workloads.setpoints();
    private final double[] measurements = Workloads.measurements(6);
    private int next;
    private double lastOutput;

    private LoopTiming() {
    }

    /**
     * Measures one loop.
     *
     * @param loop        which loop
     * @param periodNanos the nominal period (1,000,000 for 1 kHz)
     * @param duration    how long to measure
     * @return the figures
     * @throws InterruptedException when interrupted while waiting for the loop
     */
    public static TimingResult measure(TimedLoop loop, long periodNanos, Duration duration) throws InterruptedException {
        return new LoopTiming().run(loop, periodNanos, duration.toNanos());
    }

    private PidController controller(long periodNanos) {
        return new PidController(Workloads.fullFeatured().toBuilder().samplePeriodSeconds(periodNanos * 1e-9).build());
    }

    private double measurement() {
        return measurements[next++ & Workloads.MASK];
    }

    private double setpoint() {
        return setpoints[next & Workloads.MASK];
    }

    /** Stores the output in a field of an object the loop shares, so the JIT keeps the work. */
    private void write(double output) {
        lastOutput = output;
    }

    private TimingResult run(TimedLoop loop, long periodNanos, long durationNanos) throws InterruptedException {
        PeriodErrorRecorder recorder = new PeriodErrorRecorder(periodNanos, durationNanos);
        PidController controller = controller(periodNanos);
        if (loop == TimedLoop.BUSY_WAIT_BASELINE) {
            long[] skipped = {0};
            Thread baseline = new Thread(() -> skipped[0] = busyWait(controller, periodNanos, recorder),
                    "loopwright-baseline");
            baseline.setDaemon(true);
            baseline.start();
            baseline.join();
            return recorder.result(loop, 0, skipped[0]);
        }
        long margin = spinMarginFor(periodNanos);
        RunnerSettings settings = RunnerSettings.builder().waitStrategy(loop.waitStrategy())
                .spinMarginNanos(margin).threadName("loopwright-timing").daemon(true).build();
        LoopRunner runner = new LoopRunner(settings, controller, this::setpoint, this::measurement, this::write,
                recorder);
        recorder.stopRunnerWhenDone(runner);
        runner.start();
        while (!runner.awaitStop(Duration.ofSeconds(1))) {
            // the recorder stops the runner once the duration has passed
        }
        if (runner.stopReason() != StopReason.STOP_REQUESTED) {
            throw new IllegalStateException("the timed runner stopped early: " + runner.stopReason(),
                    runner.lastFailureCause());
        }
        return recorder.result(loop, loop == TimedLoop.RUNNER_PARK_THEN_SPIN ? margin : 0, runner.skippedTickCount());
    }

    /** The baseline: the same tick, with nothing but a spin on the clock between ticks. */
    private long busyWait(PidController controller, long periodNanos, PeriodErrorRecorder recorder) {
        long origin = System.nanoTime();
        long k = 0;
        long skipped = 0;
        while (!recorder.finished()) {
            long scheduled = origin + k * periodNanos;
            while (System.nanoTime() - scheduled < 0) {
                Thread.onSpinWait();
            }
            long start = System.nanoTime();
            double y = measurement();
            write(controller.update(setpoint(), y));
            long end = System.nanoTime();
            boolean overrun = end - scheduled > periodNanos;
            recorder.onTick(scheduled, start, end, overrun);
            k++;
            if (overrun) {
                long resume = (System.nanoTime() - origin) / periodNanos + 1;
                skipped += resume - k;
                k = resume;
            }
        }
        return skipped;
    }
}
