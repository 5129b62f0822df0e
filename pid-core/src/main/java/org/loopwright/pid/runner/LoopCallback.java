package org.loopwright.pid.runner;

/** The callback that failed, as {@link LoopRunner#lastFailedCallback()} reports it. */
public enum LoopCallback {
    /** None has failed yet. */
    NONE,
    /** The {@link SetpointSource}. */
    SETPOINT,
    /** The {@link MeasurementSource}. */
    MEASUREMENT,
    /** The {@link OutputSink}. */
    OUTPUT
}
