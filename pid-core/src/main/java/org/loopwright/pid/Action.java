package org.loopwright.pid;

/** Which way the output moves when the measurement moves away from the setpoint. */
public enum Action {
    /** e = r − y: the output rises when the measurement falls below the setpoint (a heater). */
    REVERSE,
    /** e = y − r: the output rises when the measurement rises above the setpoint (a cooler). */
    DIRECT;

    /** {@return +1 for reverse action, −1 for direct action} */
    public double sign() {
        return this == REVERSE ? 1.0 : -1.0;
    }
}
