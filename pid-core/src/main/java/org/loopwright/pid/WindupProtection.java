package org.loopwright.pid;

/**
 * What keeps the integral from running away while the output is limited by its range or its slew
 * limit (Åström &amp; Murray, <i>Feedback Systems</i>, 2nd ed., 2021, §11.4).
 */
public enum WindupProtection {
    /** The integral integrates whatever happens (for comparison; never for a real plant). */
    NONE,
    /** Conditional integration: the integral holds while the output is limited and the error pushes further. */
    CLAMPING,
    /** Back-calculation: the integral is driven by (limited − unlimited output)/Tt. */
    BACK_CALCULATION,
    /** Back-calculation towards the actuator's measured position, when the caller supplies it. */
    ACTUATOR_TRACKING
}
