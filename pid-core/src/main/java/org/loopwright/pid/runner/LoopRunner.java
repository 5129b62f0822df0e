package org.loopwright.pid.runner;

import java.time.Duration;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.LockSupport;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.StateCapture;
import org.loopwright.pid.StateSnapshot;
import org.loopwright.pid.monitor.LoopCondition;
import org.loopwright.pid.monitor.LoopMonitor;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Runs read-measurement → update → write-output on a thread of its own, at the controller's sample
 * period ({@link ControllerSettings#samplePeriodSeconds()}, the one place the period is given).
 * Tick k is due at start + k·h on the runner's clock (absolute deadlines: a late tick never shifts
 * the ones after it). After a tick that ends past the next deadline (an overrun) the
 * {@link OverrunPolicy} either skips the missed deadlines or runs them late.
 *
 * <p>Talking to a running loop: commands go in through {@link #operator()} (mode, manual output,
 * setpoint, retune, capture, restore), applied at the next tick boundary in order, before the
 * update; the status comes out through {@link #readStatus(LoopStatus)}, one consistent view per
 * tick for any thread to read, and optionally over JMX ({@link LoopStatusRegistration}). Do not call
 * the controller's mode or input methods from other threads: they are not thread-safe.
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
 * <p>Restart: {@link #start()} may be called again once the runner has stopped (by {@link #stop()}
 * or by itself). The new run keeps the controller's state (so it resumes bumplessly), begins a new
 * schedule at once, reads the controller's sample period again (a retune made while stopped may
 * change it) and keeps counting ticks, overruns and commands from where the last run ended.
 *
 * <p>Per tick the runner allocates nothing, takes no lock and logs nothing (as long as the callbacks
 * and the listener do the same), with or without operator commands; it logs once at start and once
 * at stop.
 *
 * <p>Example, a water bath heater that owns its setpoint:
 * <pre>
 *   LoopRunner runner = new LoopRunner(settings, controller, 60.0, probe::celsius,
 *           heater::dutyPercent, TimingListener.NONE);
 *   runner.start();
 *   runner.operator().requestSetpoint(65.0);        // from any thread
 *   LoopStatus status = new LoopStatus();
 *   runner.readStatus(status);                       // from any thread
 *   runner.stop();   // returns after the last tick has written its output
 * </pre>
 *
 * <p>Thread-safe: {@link #start()}, {@link #stop()}, the operator channel and the status may be used
 * from any thread; the callbacks and the controller's update run on the loop thread only.
 */
public final class LoopRunner {

    private static final Logger LOG = LoggerFactory.getLogger(LoopRunner.class);
    private static final LoopCondition[] CONDITIONS = LoopCondition.values();

    private final RunnerSettings settings;
    private final PidController controller;
    private final SetpointSource setpointSource; // null when the runner owns its setpoint
    private final MeasurementSource measurementSource;
    private final OutputSink outputSink;
    private final TimingListener listener;
    private final LoopMonitor monitor; // null: none
    private final LoopClock clock;
    private final OperatorChannel channel;
    private final StatusBoard board = new StatusBoard();

    private volatile boolean running;
    private volatile RunnerState state = RunnerState.NEW;
    private volatile StopReason stopReason = StopReason.NOT_STOPPED;
    private volatile Thread thread;
    private volatile long periodNanos;
    private volatile LoopCallback lastFailedCallback = LoopCallback.NONE;
    private volatile Throwable lastFailureCause;
    private volatile IllegalArgumentException lastRejectedCommand;

    // loop-thread state; the counts run on across restarts and reach readers through publishStatus
    private LoopCallback tickFailure;
    private long ticks;
    private long overruns;
    private long skipped;
    private long failedTicks;
    private int inARow;
    private long rejectedCommands;
    private long appliedEnd; // commands applied by the loop, released to waiters after the status shows them
    private long lastPeriodError;
    private double ownSetpoint;
    private double tickSetpoint = Double.NaN;
    private double tickMeasurement = Double.NaN;
    private double tickOutput = Double.NaN;

    /**
     * A runner that has not started and reads its setpoint from a source every tick.
     *
     * @param settings          timing, failure tolerance and thread
     * @param controller        the controller this runner alone updates; its sample period is the runner's
     * @param setpointSource    the setpoint per tick
     * @param measurementSource the process variable per tick
     * @param outputSink        where each output goes
     * @param listener          per-tick timing, or {@link TimingListener#NONE}
     * @throws InvalidSettingException when the controller's sample period is not a whole number of
     *                                 nanoseconds of at least 1
     */
    public LoopRunner(RunnerSettings settings, PidController controller, SetpointSource setpointSource,
            MeasurementSource measurementSource, OutputSink outputSink, TimingListener listener) {
        this(settings, controller, Objects.requireNonNull(setpointSource, "setpointSource"), Double.NaN,
                measurementSource, outputSink, listener, null);
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
     * @return the new runner, not yet started
     * @throws InvalidSettingException as the constructor without a monitor
     */
    public static LoopRunner monitored(RunnerSettings settings, PidController controller,
            SetpointSource setpointSource, MeasurementSource measurementSource, OutputSink outputSink,
            TimingListener listener, LoopMonitor monitor) {
        return new LoopRunner(settings, controller, Objects.requireNonNull(setpointSource, "setpointSource"),
                Double.NaN, measurementSource, outputSink, listener, Objects.requireNonNull(monitor, "monitor"));
    }

    /**
     * A runner that has not started and owns its setpoint: it starts at {@code initialSetpoint} and
     * moves only by {@link OperatorChannel#requestSetpoint(double)}.
     *
     * @param settings          timing, failure tolerance and thread
     * @param controller        the controller this runner alone updates; its sample period is the runner's
     * @param initialSetpoint   the setpoint until an operator command changes it (finite)
     * @param measurementSource the process variable per tick
     * @param outputSink        where each output goes
     * @param listener          per-tick timing, or {@link TimingListener#NONE}
     * @throws InvalidSettingException when the initial setpoint is not finite, or the controller's
     *                                 sample period is shorter than 1 ns
     */
    public LoopRunner(RunnerSettings settings, PidController controller, double initialSetpoint,
            MeasurementSource measurementSource, OutputSink outputSink, TimingListener listener) {
        this(settings, controller, null, initialSetpoint, measurementSource, outputSink, listener, null);
        if (!Double.isFinite(initialSetpoint)) {
            throw new InvalidSettingException("initialSetpoint", initialSetpoint, "must be finite");
        }
    }

    private LoopRunner(RunnerSettings settings, PidController controller, SetpointSource setpointSource,
            double initialSetpoint, MeasurementSource measurementSource, OutputSink outputSink,
            TimingListener listener, LoopMonitor monitor) {
        this.monitor = monitor;
        this.settings = Objects.requireNonNull(settings, "settings");
        this.controller = Objects.requireNonNull(controller, "controller");
        this.setpointSource = setpointSource;
        this.ownSetpoint = initialSetpoint;
        this.measurementSource = Objects.requireNonNull(measurementSource, "measurementSource");
        this.outputSink = Objects.requireNonNull(outputSink, "outputSink");
        this.listener = Objects.requireNonNull(listener, "listener");
        this.clock = settings.clock();
        this.channel = new OperatorChannel(controller, setpointSource == null, settings.commandCapacity());
        this.periodNanos = periodOf(controller);
        board.current.mode = controller.mode();
    }

    /** The controller's sample period in whole nanoseconds, the runner's period. */
    private static long periodOf(PidController controller) {
        double seconds = controller.settings().samplePeriodSeconds();
        long nanos = Math.round(seconds * 1e9);
        if (nanos < 1) {
            throw new InvalidSettingException("samplePeriodSeconds", seconds,
                    "must be at least 1e-9 (one nanosecond) for the loop runner");
        }
        return nanos;
    }

    /**
     * Starts the loop thread; the first tick is due at once. A stopped runner may be started again
     * (see the class comment).
     *
     * @throws IllegalStateException   when the runner is running
     * @throws InvalidSettingException when the controller's sample period is shorter than 1 ns
     */
    public synchronized void start() {
        if (state == RunnerState.RUNNING) {
            throw new IllegalStateException("the runner is running already; stop() it before starting it again");
        }
        periodNanos = periodOf(controller);
        Thread loop = new Thread(this::runLoop, settings.threadName());
        loop.setDaemon(settings.daemon());
        running = true;
        stopReason = StopReason.NOT_STOPPED;
        state = RunnerState.RUNNING;
        thread = loop;
        channel.open();
        LOG.info("loop runner '{}' starting: period {} ns, {} wait, {}", settings.threadName(), periodNanos,
                settings.waitStrategy().word(),
                settings.overrunPolicy() == OverrunPolicy.SKIP_MISSED ? "missed ticks skipped" : "late ticks run");
        loop.start();
    }

    /**
     * Asks the loop to stop and, unless called from the loop thread itself (a callback or the listener),
     * waits until the last tick has completed and the commands taken before this call have been
     * applied. Stopping a runner that never started makes it {@link RunnerState#STOPPED}; stopping a
     * stopped one does nothing.
     *
     * @return why the runner stopped (a runner that stopped itself keeps its own reason); called from
     *         the loop thread, {@link StopReason#NOT_STOPPED}, since the current tick is still running
     */
    public StopReason stop() {
        Thread loop;
        synchronized (this) {
            running = false;
            channel.close();
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
     * @param timeout the longest wait
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
            channel.close();
            applyCommands(); // what was taken before the close is applied, never dropped
            publishStatus();
            releaseApplied();
        }
        if (reason == StopReason.CONSECUTIVE_FAILURES) {
            LOG.warn("loop runner '{}' stopped after {} failed ticks in a row; last failed callback: {}",
                    settings.threadName(), inARow, lastFailedCallback, lastFailureCause);
        } else {
            LOG.info("loop runner '{}' stopped: {} ticks, {} overruns, {} skipped, {} failed", settings.threadName(),
                    ticks, overruns, skipped, failedTicks);
        }
        synchronized (this) {
            stopReason = reason;
            state = RunnerState.STOPPED;
        }
    }

    /** The loop: wait for tick k's deadline, apply commands, run it, account for it, choose the next k. */
    private StopReason tickUntilStopped() {
        final boolean skipMissed = settings.overrunPolicy() == OverrunPolicy.SKIP_MISSED;
        final boolean measuredPeriod = settings.periodMode() == PeriodMode.MEASURED;
        final int failureLimit = settings.maxConsecutiveFailures();
        final long period = periodNanos;
        final long spinMargin = switch (settings.waitStrategy()) {
            case PARK -> 0L;
            case SPIN -> Long.MAX_VALUE;
            case PARK_THEN_SPIN -> settings.spinMarginNanos();
        };
        final long origin = clock.nanoTime();
        inARow = 0;
        long k = 0;
        long previousStart = 0;
        while (true) {
            long scheduled = origin + k * period;
            awaitDeadline(scheduled, spinMargin);
            if (!running) {
                return StopReason.STOP_REQUESTED;
            }
            long start = clock.nanoTime();
            lastPeriodError = k == 0 ? 0L : start - previousStart - period;
            applyCommands();
            runTick(measuredPeriod, k == 0 ? period * 1e-9 : (start - previousStart) * 1e-9);
            long end = clock.nanoTime();
            boolean overrun = end - scheduled > period;
            previousStart = start;

            if (overrun) {
                overruns++;
            }
            if (tickFailure == LoopCallback.NONE) {
                inARow = 0;
            } else {
                failedTicks++;
                inARow++;
                lastFailedCallback = tickFailure;
            }
            ticks++;
            publishStatus();
            releaseApplied();
            listener.onTick(scheduled, start, end, overrun);
            if (inARow >= failureLimit) {
                return StopReason.CONSECUTIVE_FAILURES;
            }

            k++;
            if (overrun && skipMissed) {
                long next = Math.floorDiv(clock.nanoTime() - origin, period) + 1;
                skipped += next - k;
                k = next;
            }
        }
    }

    /** Publishes the last tick's figures, the monitor's conditions included, as one view (the only writes to the board). */
    private void publishStatus() {
        LoopStatus s = board.current;
        board.beginWrite();
        s.tickCount = ticks;
        s.overrunCount = overruns;
        s.skippedTickCount = skipped;
        s.failedTickCount = failedTicks;
        s.consecutiveFailures = inARow;
        s.rejectedCommandCount = rejectedCommands;
        s.setpoint = tickSetpoint;
        s.measurement = tickMeasurement;
        s.output = tickOutput;
        s.mode = controller.mode();
        s.fault = controller.fault();
        s.faultCount = controller.faultCount();
        s.lastPeriodErrorNanos = lastPeriodError;
        s.appliedCommandCount = appliedEnd;
        if (monitor != null) {
            for (LoopCondition c : CONDITIONS) {
                s.conditions[c.ordinal()] = monitor.status(c);
            }
        }
        board.endWrite();
    }

    /** Parks until the spin margin before the deadline, then spins; returns early when stopping. */
    private void awaitDeadline(long deadline, long spinMargin) {
        long remaining = deadline - clock.nanoTime();
        while (remaining > spinMargin && running) {
            clock.parkNanos(remaining - spinMargin);
            remaining = deadline - clock.nanoTime();
        }
        while (remaining > 0 && running) {
            Thread.onSpinWait();
            remaining = deadline - clock.nanoTime();
        }
    }

    /** Applies the operator commands taken so far, in order; loop thread only. */
    private void applyCommands() {
        long end = channel.takenCount();
        long n = channel.nextToApply();
        if (n == end) {
            return;
        }
        for (; n < end; n++) {
            Object reference = channel.reference(n);
            switch (channel.kind(n)) {
                case MODE -> switchMode((Mode) reference);
                case MANUAL_OUTPUT -> controller.manualOutput(channel.value(n));
                case SETPOINT -> ownSetpoint = channel.value(n);
                case RETUNE -> controller.retune((ControllerSettings) reference);
                case CAPTURE -> controller.captureState((StateCapture) reference);
                case RESTORE -> restore((StateSnapshot) reference);
                default -> throw new IllegalStateException("unknown operator command " + channel.kind(n));
            }
        }
        appliedEnd = end;
    }

    /**
     * Tells waiting operators what the tick applied, only after its status is published: a status read
     * after {@code awaitApplied} returns then shows the command's effect, never the tick before it.
     */
    private void releaseApplied() {
        if (appliedEnd != channel.nextToApply()) {
            channel.appliedUpTo(appliedEnd);
        }
    }

    private void switchMode(Mode mode) {
        switch (mode) {
            case AUTOMATIC -> controller.switchToAutomatic();
            case MANUAL -> controller.switchToManual();
            case TRACKING -> controller.switchToTracking();
            default -> throw new IllegalStateException("unknown mode " + mode);
        }
    }

    private void restore(StateSnapshot snapshot) {
        try {
            controller.restore(snapshot);
        } catch (IllegalArgumentException e) {
            rejectedCommands++;
            lastRejectedCommand = e;
        }
    }

    /** One read → update → write; records in {@link #tickFailure} which callback failed, if any. */
    private void runTick(boolean measuredPeriod, double periodSeconds) {
        tickFailure = LoopCallback.NONE;
        double setpoint;
        if (setpointSource == null) {
            setpoint = ownSetpoint;
        } else {
            try {
                setpoint = setpointSource.setpoint();
                if (!Double.isFinite(setpoint)) {
                    failed(LoopCallback.SETPOINT, null);
                }
            } catch (Exception e) {
                setpoint = Double.NaN;
                failed(LoopCallback.SETPOINT, e);
            }
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
        tickSetpoint = setpoint;
        tickMeasurement = measurement;
        tickOutput = output;
        try {
            outputSink.writeOutput(output);
        } catch (Exception e) {
            failed(LoopCallback.OUTPUT, e);
            // the controller's fault policy decides what the actuator should get instead
            double fallback = measuredPeriod
                    ? controller.update(setpoint, Double.NaN, periodSeconds)
                    : controller.update(setpoint, Double.NaN);
            if (Double.compare(fallback, output) != 0) {
                tickOutput = fallback;
                try {
                    outputSink.writeOutput(fallback);
                } catch (Exception again) {
                    // already counted: one failed tick, reported with the first exception
                }
            }
        }
        if (monitor != null) {
            monitor.sample(setpoint, measurement, tickOutput, controller.mode() == Mode.AUTOMATIC);
        }
    }

    /** Records the first failure of a tick; later ones in the same tick add nothing. */
    private void failed(LoopCallback callback, Throwable cause) {
        if (tickFailure == LoopCallback.NONE) {
            tickFailure = callback;
            lastFailureCause = cause;
        }
    }

    /** {@return the way to send commands into the running loop} */
    public OperatorChannel operator() {
        return channel;
    }

    /**
     * Copies the status the last tick published into the holder: one consistent view, never a mix
     * of two ticks. No allocation; may spin for the few nanoseconds the loop thread takes to publish.
     * The callbacks and the listener may call it too.
     *
     * @param into the holder to overwrite
     * @return the holder, filled
     */
    public LoopStatus readStatus(LoopStatus into) {
        board.readInto(into);
        return into;
    }

    /** {@return a new holder with the status the last tick published} Allocates; see {@link #readStatus}. */
    public LoopStatus status() {
        return readStatus(new LoopStatus());
    }

    /** {@return the settings this runner was built with} */
    public RunnerSettings settings() {
        return settings;
    }

    /** {@return the monitor this runner feeds on every tick, if it was built with one} */
    public Optional<LoopMonitor> monitor() {
        return Optional.ofNullable(monitor);
    }

    /** {@return the period of the current (or last) run in nanoseconds: the controller's sample period} */
    public long periodNanos() {
        return periodNanos;
    }

    /** {@return new, running or stopped} */
    public RunnerState state() {
        return state;
    }

    /** {@return why the runner stopped; {@link StopReason#NOT_STOPPED} while it has not} */
    public StopReason stopReason() {
        return stopReason;
    }

    /** {@return ticks run so far} The other counts are in {@link #status()}. */
    public long tickCount() {
        return status().tickCount();
    }

    /** {@return ticks that ended after the next deadline} */
    public long overrunCount() {
        return status().overrunCount();
    }

    /**
     * {@return deadlines dropped by {@link OverrunPolicy#SKIP_MISSED} (always 0 with {@link OverrunPolicy#RUN_LATE})}
     */
    public long skippedTickCount() {
        return status().skippedTickCount();
    }

    /** {@return ticks in which at least one callback failed} */
    public long failedTickCount() {
        return status().failedTickCount();
    }

    /** {@return failed ticks in a row up to the last tick (0 after a good tick)} */
    public int consecutiveFailures() {
        return status().consecutiveFailures();
    }

    /** {@return the callback of the last failed tick (the first to fail in it), or {@link LoopCallback#NONE}} */
    public LoopCallback lastFailedCallback() {
        return lastFailedCallback;
    }

    /**
     * What the last failing callback threw, or the unexpected error that stopped the loop; null when
     * the last failure was a non-finite value or nothing has failed.
     *
     * @return the cause of the last failure, or null
     */
    public Throwable lastFailureCause() {
        return lastFailureCause;
    }

    /** {@return why the last rejected operator command (a restore that did not fit) was rejected; null if none was} */
    public IllegalArgumentException lastRejectedCommand() {
        return lastRejectedCommand;
    }
}
