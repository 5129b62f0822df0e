package org.loopwright.pid.runner;

/** Why the runner stopped, readable after it has. */
public enum StopReason {
    /** The runner has not stopped (it has not started, or is running). */
    NOT_STOPPED,
    /** {@link LoopRunner#stop()} was called. */
    STOP_REQUESTED,
    /** {@link RunnerSettings#maxConsecutiveFailures()} ticks in a row had a failed callback. */
    CONSECUTIVE_FAILURES,
    /** Something outside the callbacks' failure handling threw (an Error, or the timing listener). */
    UNEXPECTED_ERROR
}
