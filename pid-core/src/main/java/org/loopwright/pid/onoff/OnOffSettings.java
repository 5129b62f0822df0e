package org.loopwright.pid.onoff;

import java.util.Objects;

import org.loopwright.pid.Action;
import org.loopwright.pid.SettingChecks;

/**
 * The settings of an {@link OnOffController}. With reverse action (a heater) the output switches on
 * when the measurement falls below setpoint − hysteresis/2 and off when it rises above
 * setpoint + hysteresis/2; direct action (a cooler) mirrors this. A switch waits until the output
 * has been in its present state for at least the minimum on or off time (protecting a compressor or
 * a contactor).
 *
 * <p>Example: a 2 kW bath heater with a 0.5 °C band and at least 20 s between switches:
 * {@code new OnOffSettings(0.0, 2000.0, 0.5, 20.0, 20.0, Action.REVERSE)}.
 *
 * <p>Thread-safe: immutable.
 *
 * @param offOutput         the output when off
 * @param onOutput          the output when on
 * @param hysteresis        the full width of the switching band, finite and &ge; 0, process units
 * @param minimumOnSeconds  the shortest time on, finite and &ge; 0
 * @param minimumOffSeconds the shortest time off, finite and &ge; 0
 * @param action            reverse (on below the band) or direct (on above it)
 */
public record OnOffSettings(double offOutput, double onOutput, double hysteresis, double minimumOnSeconds,
        double minimumOffSeconds, Action action) {

    /**
     * Validates every value; messages have the shape {@code "<field> <rule>: <field>=<value>"}.
     *
     * @param offOutput the output when off
     * @param onOutput the output when on
     * @param hysteresis the full width of the switching band, finite and &ge; 0, process units
     * @param minimumOnSeconds the shortest time on, finite and &ge; 0
     * @param minimumOffSeconds the shortest time off, finite and &ge; 0
     * @param action reverse (on below the band) or direct (on above it)
     */
    public OnOffSettings {
        SettingChecks.finite("offOutput", offOutput);
        SettingChecks.finite("onOutput", onOutput);
        SettingChecks.nonNegative("hysteresis", hysteresis);
        SettingChecks.nonNegative("minimumOnSeconds", minimumOnSeconds);
        SettingChecks.nonNegative("minimumOffSeconds", minimumOffSeconds);
        Objects.requireNonNull(action, "action");
    }
}
