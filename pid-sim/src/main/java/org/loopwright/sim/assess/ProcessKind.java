package org.loopwright.sim.assess;

import java.util.Locale;

/**
 * How the measurement behaves while the actuator holds still — what decides whether the stiction test
 * applies ({@link HorchStiction}).
 */
public enum ProcessKind {
    /** The measurement settles while the actuator holds still (flow, pressure, temperature). */
    SELF_REGULATING,
    /** The measurement ramps while the actuator holds still away from balance (a level). */
    INTEGRATING,
    /**
     * A position loop on a drive: when the drive sticks, the position itself holds still, as a flow does
     * behind a stuck valve (though without friction the process integrates).
     */
    POSITION_DRIVE;

    /** As on the command line: self-regulating, integrating, position-drive. */
    public String label() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }
}
