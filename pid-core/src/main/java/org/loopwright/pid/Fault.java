package org.loopwright.pid;

/** The condition of the last sample, as the controller's status reports it. */
public enum Fault {
    /** A normal sample. */
    NONE,
    /** The setpoint was NaN or infinite. */
    SETPOINT_NOT_FINITE,
    /** The measurement was NaN or infinite. */
    MEASUREMENT_NOT_FINITE,
    /** The period was NaN, infinite, zero or negative. */
    PERIOD_NOT_VALID,
    /** The feedforward input was NaN or infinite. */
    FEEDFORWARD_NOT_FINITE,
    /**
     * The inputs were finite but so large that the law overflowed (an error, a term or the output
     * beyond the range of a double, in automatic mode); the sample is dropped like any other faulty
     * one, and the next sample starts the law again as a first sample does, bumpless from the last
     * output. Manual and tracking outputs never overflow: the operator is always obeyed.
     */
    ARITHMETIC_OVERFLOW
}
