package org.loopwright.sim.scenario;

import org.loopwright.pid.SettingChecks;

/**
 * One entry of a setpoint profile: from {@code atSeconds} the setpoint moves to {@code value}, at
 * once (a step, {@code rampSeconds = 0}) or linearly over {@code rampSeconds} from wherever it was.
 *
 * @param atSeconds   when the change starts, finite and &ge; 0
 * @param value       the new setpoint, finite, process units
 * @param rampSeconds how long the ramp takes, finite and &ge; 0 (0 for a step)
 */
public record SetpointChange(double atSeconds, double value, double rampSeconds) {

    /** Validates every value; errors name the scenario file's keys. */
    public SetpointChange {
        SettingChecks.nonNegative("atSeconds", atSeconds);
        SettingChecks.finite("value", value);
        SettingChecks.nonNegative("rampSeconds", rampSeconds);
    }

    /** A step to {@code value} at {@code atSeconds}. */
    public static SetpointChange step(double atSeconds, double value) {
        return new SetpointChange(atSeconds, value, 0.0);
    }
}
