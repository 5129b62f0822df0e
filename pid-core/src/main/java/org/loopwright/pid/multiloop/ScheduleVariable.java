package org.loopwright.pid.multiloop;

/** What a gain schedule is indexed by. */
public enum ScheduleVariable {
    /** The process variable at each update. */
    MEASUREMENT,
    /** The setpoint at each update (moves only when the operator or an outer loop moves it). */
    SETPOINT,
    /** A value the caller supplies, such as a flow or a valve position. */
    EXTERNAL
}
