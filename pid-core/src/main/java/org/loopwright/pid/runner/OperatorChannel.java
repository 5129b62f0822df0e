package org.loopwright.pid.runner;

import java.time.Duration;
import java.util.Objects;
import java.util.concurrent.locks.LockSupport;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.StateCapture;
import org.loopwright.pid.StateSnapshot;

/**
 * The way into a running loop: operator commands from any thread, applied by the loop thread at the
 * next tick boundary, in the order they were taken, before that tick's update. Every request returns
 * its command number (1, 2, 3, … over the runner's life); the command has been applied once
 * {@link #appliedCount()} reaches it ({@link #awaitApplied} waits for that).
 *
 * <p>How the commands are held: a ring of preallocated slots of primitives (a kind, a double and
 * one reference to an object the caller made, such as new settings). Callers take a small lock among
 * themselves to fill a slot; the loop thread never takes it: once per tick it reads one volatile
 * count, applies the slots up to it and publishes how far it got. So a tick allocates nothing and
 * never waits, with or without commands pending. A ring rather than one mailbox per kind, because a
 * mailbox keeps only the last value of its kind and loses the order between kinds ("manual, set the
 * output, automatic" must arrive as sent).
 *
 * <p>Refusals, never silent and never blocking: a request while the runner is not running, or while
 * {@link #capacity()} commands are waiting, throws {@link CommandRefusedException} and queues nothing.
 * A command taken before {@code stop()} is applied before the loop thread ends, so an accepted
 * command is never lost. A restore whose snapshot does not fit the controller's configuration when
 * it is applied is counted in {@link LoopStatus#rejectedCommandCount()} and kept in
 * {@link LoopRunner#lastRejectedCommand()}.
 *
 * <p>Example, from an operator thread:
 * <pre>
 *   OperatorChannel operator = runner.operator();
 *   operator.requestMode(Mode.MANUAL);
 *   long n = operator.requestManualOutput(35.0);
 *   operator.awaitApplied(n, Duration.ofSeconds(1));
 * </pre>
 *
 * <p>Thread-safe: any number of threads may request; the runner's loop thread alone applies.
 */
public final class OperatorChannel {

    /** What a slot asks for. */
    enum Kind { MODE, MANUAL_OUTPUT, SETPOINT, RETUNE, CAPTURE, RESTORE }

    private final Object requestLock = new Object();
    private final PidController controller;
    private final boolean ownsSetpoint;
    private final Kind[] kinds;
    private final double[] values;
    private final Object[] references;

    private volatile long takenCount;   // written under requestLock, after the slot
    private volatile long appliedCount; // written by the loop thread after applying
    private boolean accepting;          // guarded by requestLock

    OperatorChannel(PidController controller, boolean ownsSetpoint, int capacity) {
        this.controller = controller;
        this.ownsSetpoint = ownsSetpoint;
        this.kinds = new Kind[capacity];
        this.values = new double[capacity];
        this.references = new Object[capacity];
    }

    /** {@return how many commands may wait for the next tick at once} */
    public int capacity() {
        return kinds.length;
    }

    /**
     * Switches the controller's mode (bumpless, as {@link PidController#switchToManual()} and its
     * siblings describe).
     *
     * @param mode the mode to switch to
     * @return the command's number
     * @throws CommandRefusedException when the runner is not running or the queue is full
     */
    public long requestMode(Mode mode) {
        return take(Kind.MODE, 0.0, Objects.requireNonNull(mode, "mode"), "mode");
    }

    /**
     * Sets the operator's output for manual mode.
     *
     * @param value the output to hold in manual mode, finite
     * @return the command's number
     * @throws IllegalArgumentException when the value is not finite
     * @throws CommandRefusedException  when the runner is not running or the queue is full
     */
    public long requestManualOutput(double value) {
        requireFinite("manualOutput", value);
        return take(Kind.MANUAL_OUTPUT, value, null, "manual output");
    }

    /**
     * Sets the setpoint of a runner that owns its setpoint (one built with an initial setpoint).
     *
     * @param value the new setpoint, finite, in process units
     * @return the command's number
     * @throws IllegalArgumentException when the value is not finite
     * @throws CommandRefusedException  when the runner reads its setpoint from a {@link SetpointSource},
     *                                  is not running, or the queue is full
     */
    public long requestSetpoint(double value) {
        requireFinite("setpoint", value);
        if (!ownsSetpoint) {
            throw new CommandRefusedException(CommandRefusedException.Reason.NOT_APPLICABLE,
                    "setpoint refused: this runner reads its setpoint from its SetpointSource; build the runner"
                            + " with an initial setpoint to set it through the operator channel: setpoint=" + value);
        }
        return take(Kind.SETPOINT, value, null, "setpoint");
    }

    /**
     * Retunes the controller at the next tick (bumpless). The sample period cannot change while the
     * loop runs, since it is the runner's period too: stop, retune, start again for that.
     *
     * @param settings the new settings, with the same sample period
     * @return the command's number
     * @throws IllegalArgumentException when the settings change the sample period
     * @throws CommandRefusedException  when the runner is not running or the queue is full
     */
    public long requestRetune(ControllerSettings settings) {
        Objects.requireNonNull(settings, "settings");
        double running = controller.settings().samplePeriodSeconds();
        if (settings.samplePeriodSeconds() != running) {
            throw new IllegalArgumentException("retune refused: samplePeriodSeconds must stay " + running
                    + " while the loop runs (stop, retune and start again to change it): samplePeriodSeconds="
                    + settings.samplePeriodSeconds());
        }
        return take(Kind.RETUNE, 0.0, settings, "retune");
    }

    /**
     * Copies the controller's state into the holder at the next tick boundary, without allocating on
     * the loop thread; when the command has been applied, {@link StateCapture#toSnapshot()} gives the
     * snapshot on the caller's thread. Do not reuse the holder before then.
     *
     * @param into the holder the loop thread overwrites
     * @return the command's number
     * @throws CommandRefusedException when the runner is not running or the queue is full
     */
    public long requestCapture(StateCapture into) {
        return take(Kind.CAPTURE, 0.0, Objects.requireNonNull(into, "into"), "capture");
    }

    /**
     * Restores a snapshot at the next tick boundary (bumpless, see {@link PidController#restore}).
     * A snapshot that does not fit the controller's configuration at that moment is not applied: it
     * counts in {@link LoopStatus#rejectedCommandCount()} and {@link LoopRunner#lastRejectedCommand()}
     * says why.
     *
     * @param snapshot the state to restore
     * @return the command's number
     * @throws CommandRefusedException when the runner is not running or the queue is full
     */
    public long requestRestore(StateSnapshot snapshot) {
        return take(Kind.RESTORE, 0.0, Objects.requireNonNull(snapshot, "snapshot"), "restore");
    }

    /** {@return commands applied so far (the number of the last one applied)} */
    public long appliedCount() {
        return appliedCount;
    }

    /**
     * Waits until command {@code number} has been applied, for at most the timeout. The runner counts a
     * command as applied only once the status of its tick is published, so a status read after this
     * returns true shows the command's effect.
     *
     * @param number a number that a {@code request} method returned
     * @param timeout the longest wait
     * @return true when it has been applied
     * @throws InterruptedException when this thread is interrupted while waiting
     */
    public boolean awaitApplied(long number, Duration timeout) throws InterruptedException {
        long deadline = System.nanoTime() + timeout.toNanos();
        while (appliedCount < number) {
            if (Thread.interrupted()) {
                throw new InterruptedException("waiting for operator command " + number);
            }
            if (System.nanoTime() - deadline >= 0) {
                return false;
            }
            LockSupport.parkNanos(100_000L);
        }
        return true;
    }

    private static void requireFinite(String field, double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException(field + " must be finite: " + field + "=" + value);
        }
    }

    private long take(Kind kind, double value, Object reference, String what) {
        synchronized (requestLock) {
            if (!accepting) {
                throw new CommandRefusedException(CommandRefusedException.Reason.NOT_RUNNING,
                        what + " refused: the runner is not running (commands are taken only between start()"
                                + " and stop())");
            }
            long n = takenCount;
            if (n - appliedCount >= kinds.length) {
                throw new CommandRefusedException(CommandRefusedException.Reason.QUEUE_FULL,
                        what + " refused: " + kinds.length + " commands are already waiting for the next tick");
            }
            int slot = slot(n);
            kinds[slot] = kind;
            values[slot] = value;
            references[slot] = reference;
            takenCount = n + 1; // publishes the slot to the loop thread
            return n + 1;
        }
    }

    /** From start(): requests are taken from now on. */
    void open() {
        synchronized (requestLock) {
            accepting = true;
        }
    }

    /** From stop() or the loop's end: requests are refused from now on. */
    void close() {
        synchronized (requestLock) {
            accepting = false;
        }
    }

    // loop thread only, below: one volatile read per tick, and one write when something was applied

    long takenCount() {
        return takenCount;
    }

    long nextToApply() {
        return appliedCount;
    }

    Kind kind(long index) {
        return kinds[slot(index)];
    }

    double value(long index) {
        return values[slot(index)];
    }

    Object reference(long index) {
        return references[slot(index)];
    }

    private int slot(long index) {
        return (int) (index % kinds.length);
    }

    /** Frees the slots before {@code end} (dropping their references) and publishes the count. */
    void appliedUpTo(long end) {
        for (long n = appliedCount; n < end; n++) {
            references[slot(n)] = null;
        }
        appliedCount = end;
    }
}
