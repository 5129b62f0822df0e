package org.loopwright.pid.runner;

/**
 * A running loop's status as JMX sees it, for the JDK's own tools (JConsole, VisualVM,
 * {@code jcmd}) and monitoring agents. Each attribute is read from one consistent status; two
 * attributes read one after the other may come from different ticks. Registered by
 * {@link LoopStatusRegistration}.
 */
public interface LoopStatusMXBean {

    /** {@return {@link RunnerState} in words: new, running or stopped} */
    String getState();

    /** {@return {@link StopReason} in words} */
    String getStopReason();

    /** {@return the runner's period in nanoseconds} */
    long getPeriodNanos();

    /** {@return the same as {@link LoopStatus#tickCount()}} */
    long getTickCount();

    /** {@return the same as {@link LoopStatus#setpoint()}} */
    double getSetpoint();

    /** {@return the same as {@link LoopStatus#measurement()}} */
    double getMeasurement();

    /** {@return the same as {@link LoopStatus#output()}} */
    double getOutput();

    /** {@return {@link LoopStatus#mode()} in words} */
    String getMode();

    /** {@return {@link LoopStatus#fault()} in words} */
    String getFault();

    /** {@return the same as {@link LoopStatus#faultCount()}} */
    long getFaultCount();

    /** {@return the same as {@link LoopStatus#overrunCount()}} */
    long getOverrunCount();

    /** {@return the same as {@link LoopStatus#skippedTickCount()}} */
    long getSkippedTickCount();

    /** {@return the same as {@link LoopStatus#failedTickCount()}} */
    long getFailedTickCount();

    /** {@return the same as {@link LoopStatus#lastPeriodErrorNanos()}} */
    long getLastPeriodErrorNanos();

    /** {@return the same as {@link LoopStatus#appliedCommandCount()}} */
    long getAppliedCommandCount();

    /** {@return the same as {@link LoopStatus#rejectedCommandCount()}} */
    long getRejectedCommandCount();

    /**
     * The monitor's condition statuses, {@code condition=status} joined by commas (for example
     * {@code oscillation=ok, sluggish=warn, ...}); empty for a runner without a monitor.
     *
     * @return the statuses as text, or an empty string
     */
    String getConditions();

    /** {@return the worst of the monitor's condition statuses in words; empty without a monitor} */
    String getWorstCondition();
}
