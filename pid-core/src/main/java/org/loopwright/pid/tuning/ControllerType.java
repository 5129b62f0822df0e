package org.loopwright.pid.tuning;

/** Which terms a tuning rule is asked for. */
public enum ControllerType {
    /** Proportional and integral action; derivative time 0. */
    PI,
    /** Proportional, integral and derivative action. */
    PID
}
