package org.loopwright.pid.runner;

/** Which period the controller receives on each tick. */
public enum PeriodMode {
    /** The controller's configured sample period ({@code update(r, y)}); it must equal the runner's period. */
    FIXED,
    /**
     * The measured time between the starts of this tick and the previous one
     * ({@code update(r, y, h)}); the first tick gets the nominal period.
     */
    MEASURED
}
