package org.loopwright.sim.timing;

import java.time.Duration;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.runner.LoopRunner;
import org.loopwright.pid.runner.RunnerSettings;
import org.loopwright.pid.runner.StopReason;
import org.loopwright.pid.runner.WaitStrategy;

/**
 * Times one loop at the controller's sample period for a while: the runner with a wait strategy, or
 * the bare busy-wait baseline. Each run builds its own controller from the settings and its own
 * {@link TickWork}, so runs do not share state. Example:
 * {@code LoopTiming.runner(settings, WaitStrategy.PARK_THEN_SPIN, 100_000, Duration.ofSeconds(10))}.
 */
public final class LoopTiming {

    /** The loop name of the baseline. */
    public static final String BASELINE = "busy-wait baseline";

    private LoopTiming() {
    }

    /** Updates done before any timed run, so the JIT has compiled the tick's work (common practice). */
    static final int WARM_UP_TICKS = 50_000;

    /**
     * Runs the tick's work {@value #WARM_UP_TICKS} times on a throwaway controller, untimed, so that the
     * timed runs measure compiled code rather than the interpreter.
     */
    public static void warmUp(ControllerSettings settings) {
        PidController controller = new PidController(settings);
        TickWork work = new TickWork();
        for (int k = 0; k < WARM_UP_TICKS; k++) {
            work.tick(controller);
        }
    }

    /** The loop name of the runner with a wait strategy: {@code runner, park-then-spin} and so on. */
    public static String runnerLoop(WaitStrategy wait) {
        return "runner, " + wait.word();
    }

    /**
     * Times the {@link LoopRunner}.
     *
     * @param settings        the controller, whose sample period is the loop's
     * @param wait            how the runner waits
     * @param spinMarginNanos the park-then-spin margin (ignored by the other strategies)
     * @param duration        how long to measure
     * @return the figures and the histogram
     * @throws InterruptedException when interrupted while waiting for the loop
     */
    public static TimedRun runner(ControllerSettings settings, WaitStrategy wait, long spinMarginNanos,
            Duration duration) throws InterruptedException {
        PidController controller = new PidController(settings);
        TickWork work = new TickWork();
        RunnerSettings runnerSettings = RunnerSettings.builder().waitStrategy(wait).spinMarginNanos(spinMarginNanos)
                .threadName("loopwright-timing").daemon(true).build();
        PeriodErrorRecorder recorder = new PeriodErrorRecorder(Math.round(settings.samplePeriodSeconds() * 1e9),
                duration.toNanos());
        LoopRunner runner = new LoopRunner(runnerSettings, controller, work, work, work, recorder);
        recorder.stopRunnerWhenDone(runner);
        runner.start();
        while (!runner.awaitStop(Duration.ofSeconds(1))) {
            // the recorder stops the runner once the duration has passed
        }
        if (runner.stopReason() != StopReason.STOP_REQUESTED) {
            throw new IllegalStateException("the timed runner stopped early: " + runner.stopReason(),
                    runner.lastFailureCause());
        }
        return recorder.result(runnerLoop(wait), wait == WaitStrategy.PARK_THEN_SPIN ? spinMarginNanos : 0,
                runner.skippedTickCount(), work.meanUpdateNanos());
    }

    /**
     * Times the baseline: the same tick, with nothing but a spin on the clock between ticks, skipping
     * missed deadlines as the runner does by default.
     *
     * @param settings the controller, whose sample period is the loop's
     * @param duration how long to measure
     * @return the figures and the histogram
     * @throws InterruptedException when interrupted while waiting for the loop
     */
    public static TimedRun baseline(ControllerSettings settings, Duration duration) throws InterruptedException {
        PidController controller = new PidController(settings);
        long period = Math.round(settings.samplePeriodSeconds() * 1e9);
        PeriodErrorRecorder recorder = new PeriodErrorRecorder(period, duration.toNanos());
        TickWork work = new TickWork();
        long[] skipped = {0};
        Thread loop = new Thread(() -> skipped[0] = busyWait(controller, work, period, recorder),
                "loopwright-baseline");
        loop.setDaemon(true);
        loop.start();
        loop.join();
        return recorder.result(BASELINE, 0, skipped[0], work.meanUpdateNanos());
    }

    private static long busyWait(PidController controller, TickWork work, long period, PeriodErrorRecorder recorder) {
        long origin = System.nanoTime();
        long k = 0;
        long skipped = 0;
        while (!recorder.finished()) {
            long scheduled = origin + k * period;
            while (System.nanoTime() - scheduled < 0) {
                Thread.onSpinWait();
            }
            long start = System.nanoTime();
            work.tick(controller);
            long end = System.nanoTime();
            boolean overrun = end - scheduled > period;
            recorder.onTick(scheduled, start, end, overrun);
            k++;
            if (overrun) {
                long resume = (System.nanoTime() - origin) / period + 1;
                skipped += resume - k;
                k = resume;
            }
        }
        return skipped;
    }
}
