package org.loopwright.pid.runner;

/**
 * Reads the process variable y once per tick, on the loop thread (for example a temperature probe on
 * the water bath). A non-finite reading or an exception counts as a failed tick and the controller
 * applies its fault policy. Must not allocate; should return well within the period.
 */
@FunctionalInterface
public interface MeasurementSource {

    /** {@return the measurement for this tick, in process units} */
    double readMeasurement();
}
