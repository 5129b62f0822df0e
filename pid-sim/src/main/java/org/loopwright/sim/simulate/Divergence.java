package org.loopwright.sim.simulate;

/**
 * When a run is taken to have diverged, the one rule that simulate, compare, sweep, tune and replay
 * share: a value that is not finite, or whose size is beyond {@value #FACTOR} times the run's scale.
 * The scale of a closed loop is the largest of 1, the process output at rest and the size of every
 * setpoint and load value in the scenario; a loop that stays stable never comes near a million times
 * its own setpoints, while one that diverges passes the bound within a few dozen growth periods, long
 * before the numbers overflow (common practice: a growth test with a wide bound, not an overflow test).
 *
 * <p>A run that diverges is stopped at that sample, which is not recorded, and is reported as
 * diverged: none of its figures is used. Thread-safe: stateless.
 */
public final class Divergence {

    /** How many times the run's scale a value may reach before the run counts as diverged. */
    public static final double FACTOR = 1e6;

    /** The rule in a sentence, for help texts and reports. */
    public static final String RULE = "a run has diverged when the process output is not finite or its size exceeds"
            + " 1e6 times the largest of 1, the output at rest and every setpoint and load value";

    private Divergence() {
    }

    /** The bound for values of {@code scale} (taken as at least 1). */
    public static double bound(double scale) {
        return FACTOR * Math.max(1.0, Math.abs(scale));
    }

    /** Whether {@code value} is not finite or beyond {@code bound} in size. */
    public static boolean beyond(double value, double bound) {
        return !(Math.abs(value) <= bound);
    }
}
