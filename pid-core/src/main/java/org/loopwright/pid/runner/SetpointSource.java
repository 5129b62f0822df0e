package org.loopwright.pid.runner;

/**
 * Supplies the setpoint r once per tick, on the loop thread. A non-finite value or an exception counts
 * as a failed tick and the controller applies its fault policy. Must not allocate or block.
 */
@FunctionalInterface
public interface SetpointSource {

    /** {@return the setpoint for this tick, in process units} */
    double setpoint();
}
