package org.loopwright.pid.tuning;

/** Where a {@link RelayExperiment} stands. Every state but {@link #RUNNING} is final. */
public enum RelayStatus {
    /** Still switching the relay and measuring. */
    RUNNING,
    /** A stable limit cycle was measured; the ultimate point is available. */
    SUCCEEDED,
    /** Aborted: the process variable left the configured band around the setpoint. */
    ABORTED_EXCURSION,
    /** Aborted: no stable limit cycle within the configured time. */
    ABORTED_TIMEOUT,
    /** Aborted: the relay did not switch within the longest allowed half period. */
    ABORTED_NO_OSCILLATION,
    /** Aborted: a measurement or time step was not a finite number (h must also be &gt; 0). */
    ABORTED_INVALID_SAMPLE;

    /** {@return true for every state except {@link #RUNNING}} */
    public boolean finished() {
        return this != RUNNING;
    }
}
