package org.loopwright.pid.runner;

import java.time.Duration;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.monitor.LoopMonitor;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Runs read-measurement → update → write-output at a fixed period on a thread of its own. Tick k is
 * due at start + k·h on the runner's clock (absolute deadlines: a late tick never shifts the ones
 * after it). After a tick that ends past the next deadline (an overrun) the
 * {@link OverrunPolicy} either skips the missed deadlines or runs them late.
 *
 * <p>Failures: a setpoint or measurement callback that throws or returns a non-finite value is fed to
 * the controller as NaN, so the controller's {@link org.loopwright.pid.FaultPolicy} chooses the output
 * and its fault counter counts it; an output callback that throws makes the runner feed the controller
 * a faulty sample too, and write the policy's output once more when it differs. Either way the tick
 * counts as failed; after {@link RunnerSettings#maxConsecutiveFailures()} failed ticks in a row the
 * runner stops and {@link #stopReason()} says why.
 *
 * <p>A runner built with a {@link LoopMonitor} feeds it once per tick, after the output is written, with
 * the setpoint, the measurement, the output the actuator was given and whether the controller is in
 * automatic.
 *
 * <p>Per tick the runner allocates nothing, takes no lock and logs nothing (as long as the callbacks
 * and the listener do the same); it logs once at start and once at stop.
 *
 * <p>Example, a water bath heater at 10 Hz:
 * <pre>
 *   LoopRunner runner = new LoopRunner(settings, controller, () -&gt; 60.0, probe::celsius,
 *           heater::dutyPercent, TimingListener.NONE);
 *   runner.start();
 *   ...
 *   runner.stop();   // returns after the last tick has written its output
 * </pre>
 *
 * <p>Thread-safe: {@link #start()}, {@link #stop()} and the status accessors may be called from any
 * thread; the callbacks and the controller's update run on the loop thread only. While the runner
 * runs, only the controller's thread-safe {@code retune} may be called from other threads.
 */
public final class LoopRunner {

    private static final Logger LOG = LoggerFactory.getLogger(LoopRunner.class);

    private final RunnerSettings settings;
    private final PidController controller;
    private final SetpointSource setpointSource;
    private final MeasurementSource measurementSource;
    private final OutputSink outputSink;
    private final TimingListener listener;
    private final LoopMonitor monitor; // null: none
    private final LoopClock clock;
    private final long periodNanos;
    private final long spinMarginNanos;

    private volatile boolean running;
    private volatile RunnerState state = RunnerState.NEW;
    private volatile StopReason stopReason = StopReason.NOT_STOPPED;
    private volatile Thread thread;

    // written by the loop thread only, read by any
    private volatile long tickCount;
    private volatile long overrunCount;
    private volatile long skippedTickCount;
    private volatile long failedTickCount;
    private volatile int consecutiveFailures;
    private volatile LoopCallback lastFailedCallback = LoopCallback.NONE;
    private volatile Throwable lastFailureCause;

    // loop-thread state of the tick being run
    private LoopCallback tickFailure;

    /**
     * A runner that has not started.
     *
     * @param settings          timing, failure tolerance and thread
     * @param controller        the controller this runner alone updates
     * @param setpointSource    the setpoint per tick
     * @param measurementSource the process variable per tick
     * @param outputSink        where each output goes
     * @param listener          per-tick timing, or {@link TimingListener#NONE}
     * @throws InvalidSettingException when the period mode is {@link PeriodMode#FIXED} and the runner's
     *                                 period differs from the controller's sample period
     */
    public LoopRunner(RunnerSettings settings, PidController controller, SetpointSource setpointSource,
            MeasurementSource measurementSource, OutputSink outputSink, TimingListener listener) {
        this(settings, controller, setpointSource, measurementSource, outputSink, listener, null);
    }

    /**
     * A runner that has not started and feeds {@code monitor} on every tick.
     *
     * @param settings          timing, failure tolerance and thread
     * @param controller        the controller this runner alone updates
     * @param setpointSource    the setpoint per tick
     * @param measurementSource the process variable per tick
     * @param outputSink        where each output goes
     * @param listener          per-tick timing, or {@link TimingListener#NONE}
     * @param monitor           the loop monitor this runner alone feeds
     * @throws InvalidSettingException as the constructor without a monitor
     */
    public static LoopRunner monitored(RunnerSettings settings, PidController controller,
            SetpointSource setpointSource, MeasurementSource measurementSource, OutputSink outputSink,
            TimingListener listener, LoopMonitor monitor) {
        return new LoopRunner(settings, controller, setpointSource, measurementSource, outputSink, listener,
                Objects.requireNonNull(monitor, "monitor"));
    }

    private LoopRunner(RunnerSettings settings, PidController controller, SetpointSource setpointSource,
            MeasurementSource measurementSource, OutputSink outputSink, TimingListener listener,
            LoopMonitor monitor) {
        this.monitor = monitor;
        this.settings = Objects.requireNonNull(settings, "settings");
        this.controller = Objects.requireNonNull(controller, "controller");
        this.setpointSource = Objects.requireNonNull(setpointSource, "setpointSource");
        this.measurementSource = Objects.requireNonNull(measurementSource, "measurementSource");
        this.outputSink = Objects.requireNonNull(outputSink, "outputSink");
        this.listener = Objects.requireNonNull(listener, "listener");
        this.clock = settings.clock();
        this.periodNanos = settings.periodNanos();
        this.spinMarginNanos = switch (settings.waitStrategy()) {
            case PARK -> 0L;
            case SPIN -> Long.MAX_VALUE;
            case HYBRID -> settings.spinMarginNanos();
        };
        double controllerPeriod = controller.settings().samplePeriodSeconds();
        if (settings.periodMode() == PeriodMode.FIXED
                && Math.abs(controllerPeriod - settings.periodSeconds()) > 1e-9 * controllerPeriod) {
            throw new InvalidSettingException("periodNanos", periodNanos,
                    "must equal the controller's samplePeriodSeconds (" + controllerPeriod
                            + ") in FIXED period mode");
        }
    }

    /**
     * Starts the loop thread; the first tick is due at once.
     *
     * @throws IllegalStateException when the runner has been started or stopped before
     */
    public synchronized void start() {
        if (state != RunnerState.NEW) {
            throw new IllegalStateException("a runner starts once; this one is " + state);
        }
        Thread loop = new Thread(this::runLoop, settings.threadName());
        loop.setDaemon(settings.daemon());
        running = true;
        state = RunnerState.RUNNING;
        thread = loop;
        LOG.info("loop runner '{}' starting: period {} ns, {} wait, {}", settings.threadName(), periodNanos,
                settings.waitStrategy(), settings.overrunPolicy());
        loop.start();
    }

    /**
     * Asks the loop to stop and, unless called from the loop thread itself (a callback or the listener),
     * waits until the last tick has completed. Stopping a runner that never started makes it
     * {@link RunnerState#STOPPED}; stopping a stopped one does nothing.
     *
     * @return why the runner stopped (a runner that stopped itself keeps its own reason); called from
     *         the loop thread, {@link StopReason#NOT_STOPPED}, since the current tick is still running
     */
    public StopReason stop() {
        Thread loop;
        synchronized (this) {
            running = false;
            if (state == RunnerState.NEW) {
                state = RunnerState.STOPPED;
                stopReason = StopReason.STOP_REQUESTED;
                return stopReason;
            }
            loop = thread;
        }
        if (loop != Thread.currentThread()) {
            LockSupport.unpark(loop);
            joinUninterruptibly(loop);
        }
        return stopReason;
    }

    /**
     * Waits until the loop thread has finished, for at most the timeout.
     *
     * @return true when the runner has stopped
     * @throws InterruptedException when this thread is interrupted while waiting
     */
    public boolean awaitStop(Duration timeout) throws InterruptedException {
        Thread loop = thread;
        if (loop != null) {
            TimeUnit.NANOSECONDS.timedJoin(loop, timeout.toNanos());
        }
        return state == RunnerState.STOPPED;
    }

    private static void joinUninterruptibly(Thread loop) {
        boolean interrupted = false;
        while (loop.isAlive()) {
            try {
                loop.join();
            } catch (InterruptedException e) {
                interrupted = true;
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
    }

    private void runLoop() {
        StopReason reason = StopReason.STOP_REQUESTED;
        try {
            reason = tickUntilStopped();
        } catch (Throwable t) {
            lastFailureCause = t;
            reason = StopReason.UNEXPECTED_ERROR;
            LOG.error("loop runner '{}' stopped by an unexpected error", settings.threadName(), t);
        } finally {
            running = false;
            stopReason = reason;
            state = RunnerState.STOPPED;
        }
        if (reason == StopReason.CONSECUTIVE_FAILURES) {
            LOG.warn("loop runner '{}' stopped after {} failed ticks in a row; last failed callback: {}",
                    settings.threadName(), consecutiveFailures, lastFailedCallback, lastFailureCause);
        } else {
            LOG.info("loop runner '{}' stopped: {} ticks, {} overruns, {} skipped, {} failed", settings.threadName(),
                    tickCount, overrunCount, skippedTickCount, failedTickCount);
        }
    }

    /** The loop: wait for tick k's deadline, run it, account for it, choose the next k. */
    private StopReason tickUntilStopped() {
        final boolean skipMissed = settings.overrunPolicy() == OverrunPolicy.SKIP_MISSED;
        final boolean measuredPeriod = settings.periodMode() == PeriodMode.MEASURED;
        final int failureLimit = settings.maxConsecutiveFailures();
        final long origin = clock.nanoTime();
        long k = 0;
        long previousStart = 0;
        long ticks = 0;
        long overruns = 0;
        long skipped = 0;
        long failed = 0;
        int inARow = 0;
        while (true) {
            long scheduled = origin + k * periodNanos;
            awaitDeadline(scheduled);
            if (!running) {
                return StopReason.STOP_REQUESTED;
            }
            long start = clock.nanoTime();
            double periodSeconds = ticks == 0 ? settings.periodSeconds() : (start - previousStart) * 1e-9;
            runTick(measuredPeriod, periodSeconds);
            long end = clock.nanoTime();
            boolean overrun = end - scheduled > periodNanos;
            previousStart = start;

            ticks++;
            if (overrun) {
                overruns++;
                overrunCount = overruns;
            }
            if (tickFailure == LoopCallback.NONE) {
                inARow = 0;
            } else {
                failed++;
                inARow++;
                failedTickCount = failed;
                lastFailedCallback = tickFailure;
            }
            consecutiveFailures = inARow;
            tickCount = ticks;
            listener.onTick(scheduled, start, end, overrun);
            if (inARow >= failureLimit) {
                return StopReason.CONSECUTIVE_FAILURES;
            }

            k++;
            if (overrun && skipMissed) {
                long next = Math.floorDiv(clock.nanoTime() - origin, periodNanos) + 1;
                skipped += next - k;
                skippedTickCount = skipped;
                k = next;
            }
        }
    }

    /** Parks until the spin margin before the deadline, then spins; returns early when stopping. */
    private void awaitDeadline(long deadline) {
        long remaining = deadline - clock.nanoTime();
        while (remaining > spinMarginNanos && running) {
            clock.parkNanos(remaining - spinMarginNanos);
            remaining = deadline - clock.nanoTime();
        }
        while (remaining > 0 && running) {
            Thread.onSpinWait();
            remaining = deadline - clock.nanoTime();
        }
    }

    /** One read → update → write; records in {@link #tickFailure} which callback failed, if any. */
    private void runTick(boolean measuredPeriod, double periodSeconds) {
        tickFailure = LoopCallback.NONE;
        double setpoint;
        try {
            setpoint = setpointSource.setpoint();
            if (!Double.isFinite(setpoint)) {
                failed(LoopCallback.SETPOINT, null);
            }
        } catch (Exception e) {
            setpoint = Double.NaN;
            failed(LoopCallback.SETPOINT, e);
        }
        double measurement;
        try {
            measurement = measurementSource.readMeasurement();
            if (!Double.isFinite(measurement)) {
                failed(LoopCallback.MEASUREMENT, null);
            }
        } catch (Exception e) {
            measurement = Double.NaN;
            failed(LoopCallback.MEASUREMENT, e);
        }
        double output = measuredPeriod
                ? controller.update(setpoint, measurement, periodSeconds)
                : controller.update(setpoint, measurement);
        double written = output;
        try {
            outputSink.writeOutput(output);
        } catch (Exception e) {
            failed(LoopCallback.OUTPUT, e);
            // the controller's fault policy decides what the actuator should get instead
            double fallback = measuredPeriod
                    ? controller.update(setpoint, Double.NaN, periodSeconds)
                    : controller.update(setpoint, Double.NaN);
            if (Double.compare(fallback, output) != 0) {
                written = fallback;
                try {
                    outputSink.writeOutput(fallback);
                } catch (Exception again) {
                    // already counted: one failed tick, reported with the first exception
                }
            }
        }
        if (monitor != null) {
            monitor.sample(setpoint, measurement, written, controller.mode() == Mode.AUTOMATIC);
        }
    }

    /** Records the first failure of a tick; later ones in the same tick add nothing. */
    private void failed(LoopCallback callback, Throwable cause) {
        if (tickFailure == LoopCallback.NONE) {
            tickFailure = callback;
            lastFailureCause = cause;
        }
    }

    /** The settings this runner was built with. */
    public RunnerSettings settings() {
        return settings;
    }

    /** The monitor this runner feeds on every tick, if it was built with one. */
    public Optional<LoopMonitor> monitor() {
        return Optional.ofNullable(monitor);
    }

    /** New, running or stopped. */
    public RunnerState state() {
        return state;
    }

    /** Why the runner stopped; {@link StopReason#NOT_STOPPED} while it has not. */
    public StopReason stopReason() {
        return stopReason;
    }

    /** Ticks run so far. */
    public long tickCount() {
        return tickCount;
    }

    /** Ticks that ended after the next deadline. */
    public long overrunCount() {
        return overrunCount;
    }

    /** Deadlines dropped by {@link OverrunPolicy#SKIP_MISSED} (always 0 with {@link OverrunPolicy#RUN_LATE}). */
    public long skippedTickCount() {
        return skippedTickCount;
    }

    /** Ticks in which at least one callback failed. */
    public long failedTickCount() {
        return failedTickCount;
    }

    /** Failed ticks in a row up to the last tick (0 after a good tick). */
    public int consecutiveFailures() {
        return consecutiveFailures;
    }

    /** The callback of the last failed tick (the first to fail in it), or {@link LoopCallback#NONE}. */
    public LoopCallback lastFailedCallback() {
        return lastFailedCallback;
    }

    /**
     * What the last failing callback threw, or the unexpected error that stopped the loop; null when
     * the last failure was a non-finite value or nothing has failed.
     */
    public Throwable lastFailureCause() {
        return lastFailureCause;
    }
}
