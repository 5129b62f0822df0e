package org.loopwright.pid.runner;

/**
 * Writes the controller output to the actuator once per tick, on the loop thread (for example the
 * heater's duty cycle). An exception counts as a failed tick. Must not allocate; should return well
 * within the period.
 */
@FunctionalInterface
public interface OutputSink {

    /**
     * Applies the output (or increment, for incremental controllers) of this tick.
     *
     * @param output the position, or the increment for incremental output, in output units
     */
    void writeOutput(double output);
}
