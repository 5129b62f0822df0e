package org.loopwright.pid.multiloop;

/** Where a cascade's inner loop takes its setpoint from. */
public enum CascadeMode {
    /** From the outer controller's output. */
    CASCADE,
    /** From its own local setpoint; the outer controller tracks it. */
    LOCAL
}
