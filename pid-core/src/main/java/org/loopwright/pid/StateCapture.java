package org.loopwright.pid;

/**
 * A reusable holder that a controller copies its whole dynamic state into without allocating, so a
 * loop thread can take a snapshot at a caller's request and the caller turns it into a
 * {@link StateSnapshot} on its own thread (the allocation happens there). Used by the runner's
 * operator channel; see {@code LoopRunner#operator()}. Like {@link PidController#snapshot()}, it
 * holds only a state the controller itself reached, so the snapshot it makes is as valid as one
 * taken directly.
 *
 * <p>Thread-safe for one writer and one reader at a time: {@link PidController#captureState} writes
 * the fields and then bumps {@link #captureCount()} (a volatile write); a reader that has seen the
 * count rise reads the fields that belong to it, as long as no new capture into the same holder is
 * in flight.
 */
public final class StateCapture {

    private volatile long captureCount;

    private Action action;
    private OutputKind outputKind;
    private double outputMin;
    private double outputMax;
    private double wrapSpan;
    private Mode mode;
    private boolean started;
    private double integral;
    private double derivativeState;
    private double previousError;
    private double previousSetpoint;
    private double previousMeasurement;
    private double previousUnlimited;
    private double previousOutput;
    private double previousFeedforward;
    private boolean feedforwardApplied;
    private double manualValue;
    private long faultCount;

    /** An empty holder (nothing captured yet). */
    public StateCapture() {
    }

    /** {@return how many captures have been written into this holder; 0 until the first} */
    public long captureCount() {
        return captureCount;
    }

    /**
     * The last capture as an immutable snapshot (allocated on the calling thread).
     *
     * @return a new snapshot of the last capture
     * @throws IllegalStateException when nothing has been captured yet
     */
    public StateSnapshot toSnapshot() {
        if (captureCount == 0) {
            throw new IllegalStateException("nothing captured yet: captureCount=0");
        }
        return new StateSnapshot(new StateSnapshot.Values(action, outputKind, outputMin, outputMax, wrapSpan, mode,
                started, integral, derivativeState, previousError, previousSetpoint, previousMeasurement,
                previousUnlimited, previousOutput, previousFeedforward, feedforwardApplied, manualValue, faultCount));
    }

    void write(ControllerSettings s, Mode mode, boolean started, double integral, double derivativeState,
            double previousError, double previousSetpoint, double previousMeasurement, double previousUnlimited,
            double previousOutput, double previousFeedforward, boolean feedforwardApplied, double manualValue,
            long faultCount) {
        this.action = s.action();
        this.outputKind = s.outputKind();
        this.outputMin = s.outputMin();
        this.outputMax = s.outputMax();
        this.wrapSpan = s.wrapSpan();
        this.mode = mode;
        this.started = started;
        this.integral = integral;
        this.derivativeState = derivativeState;
        this.previousError = previousError;
        this.previousSetpoint = previousSetpoint;
        this.previousMeasurement = previousMeasurement;
        this.previousUnlimited = previousUnlimited;
        this.previousOutput = previousOutput;
        this.previousFeedforward = previousFeedforward;
        this.feedforwardApplied = feedforwardApplied;
        this.manualValue = manualValue;
        this.faultCount = faultCount;
        captureCount = captureCount + 1; // single writer; the volatile write publishes the fields above
    }
}
