package org.loopwright.pid.runner;

/** The life cycle of a runner: each one starts at most once. */
public enum RunnerState {
    /** Built, not started. */
    NEW,
    /** The loop thread is ticking. */
    RUNNING,
    /** The loop thread has finished its last tick (or the runner was stopped before it started). */
    STOPPED
}
