package org.loopwright.pid.runner;

/**
 * A running loop's status as JMX sees it, for the JDK's own tools (JConsole, VisualVM,
 * {@code jcmd}) and monitoring agents. Each attribute is read from one consistent status; two
 * attributes read one after the other may come from different ticks. Registered by
 * {@link LoopStatusRegistration}.
 */
public interface LoopStatusMXBean {

    /** {@link RunnerState} in words: new, running or stopped. */
    String getState();

    /** {@link StopReason} in words. */
    String getStopReason();

    /** The runner's period in nanoseconds. */
    long getPeriodNanos();

    /** See {@link LoopStatus#tickCount()}. */
    long getTickCount();

    /** See {@link LoopStatus#setpoint()}. */
    double getSetpoint();

    /** See {@link LoopStatus#measurement()}. */
    double getMeasurement();

    /** See {@link LoopStatus#output()}. */
    double getOutput();

    /** {@link LoopStatus#mode()} in words. */
    String getMode();

    /** {@link LoopStatus#fault()} in words. */
    String getFault();

    /** See {@link LoopStatus#faultCount()}. */
    long getFaultCount();

    /** See {@link LoopStatus#overrunCount()}. */
    long getOverrunCount();

    /** See {@link LoopStatus#skippedTickCount()}. */
    long getSkippedTickCount();

    /** See {@link LoopStatus#failedTickCount()}. */
    long getFailedTickCount();

    /** See {@link LoopStatus#lastPeriodErrorNanos()}. */
    long getLastPeriodErrorNanos();

    /** See {@link LoopStatus#appliedCommandCount()}. */
    long getAppliedCommandCount();

    /** See {@link LoopStatus#rejectedCommandCount()}. */
    long getRejectedCommandCount();

    /**
     * The monitor's condition statuses, {@code condition=status} joined by commas (for example
     * {@code oscillation=ok, sluggish=warn, ...}); empty for a runner without a monitor.
     */
    String getConditions();

    /** The worst of the monitor's condition statuses in words; empty without a monitor. */
    String getWorstCondition();
}
