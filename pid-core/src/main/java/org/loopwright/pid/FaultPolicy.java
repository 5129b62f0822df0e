package org.loopwright.pid;

/**
 * What the controller outputs on a sample it cannot use (a non-finite input or a bad period) in
 * automatic or tracking mode; in manual the operator's output stands.
 */
public enum FaultPolicy {
    /** Keep the last output. */
    HOLD,
    /** Go to the configured safe output (within the output range). */
    SAFE_OUTPUT
}
