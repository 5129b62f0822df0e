package org.loopwright.sim.scenario;

import org.loopwright.pid.SettingChecks;

/**
 * A load disturbance: from {@code atSeconds} on, {@code value} is added to the plant's input
 * (replacing the level of any earlier load step; 0 before the first). It takes effect at its own
 * time, inside a sample period if need be.
 *
 * @param atSeconds when, finite and &ge; 0
 * @param value     the disturbance level, finite, in the plant's input units
 */
public record LoadStep(double atSeconds, double value) {

    /** Validates every value; errors name the scenario file's keys. */
    public LoadStep {
        SettingChecks.nonNegative("atSeconds", atSeconds);
        SettingChecks.finite("value", value);
    }
}
