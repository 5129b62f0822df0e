package org.loopwright.pid.monitor;

/** What a {@link LoopMonitor} watches for; each has a {@link ConditionStatus}. */
public enum LoopCondition {
    /** The loop hunts: too many load-disturbance-sized excursions of the error (Hägglund 1995). */
    OSCILLATION,
    /** Load disturbances are rejected slowly: a high idle index (Hägglund 1999). */
    SLUGGISH,
    /** The output sits at a limit for a large share of the recent samples. */
    SATURATION,
    /** The measurement does not change while the output moves. */
    FROZEN_MEASUREMENT,
    /** The measurement's noise is large against the amplitude the loop may oscillate with. */
    NOISE;

    /** {@return the condition's name in reports: lower case, words joined by '-' ("frozen-measurement")} */
    public String label() {
        return name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
    }
}
