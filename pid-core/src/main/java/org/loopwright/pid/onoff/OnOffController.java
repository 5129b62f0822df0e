package org.loopwright.pid.onoff;

import java.util.Objects;

/**
 * A two-position (on-off) controller with hysteresis and minimum on and off times, for
 * thermostat-style loops. Time is passed in: each update gives the present time in seconds on any
 * monotonic clock.
 *
 * <p>A non-finite setpoint, measurement or time switches the output off at once, whatever the
 * minimum on time (off is the safe state of a heater), and counts a fault.
 *
 * <p>Example: {@code double watts = thermostat.update(60.0, bathCelsius, nowSeconds);}
 *
 * <p>Allocation-free. Not thread-safe: one loop thread calls {@code update}.
 */
public final class OnOffController {

    private final OnOffSettings settings;
    private boolean on;
    private double lastSwitchSeconds;
    private long faultCount;

    /**
     * A controller that is off and free to switch on at its first update.
     *
     * @param settings the outputs, band, minimum times and action
     */
    public OnOffController(OnOffSettings settings) {
        this.settings = Objects.requireNonNull(settings, "settings");
        reset();
    }

    /** Off, with no switching history and no faults. */
    public void reset() {
        on = false;
        lastSwitchSeconds = Double.NEGATIVE_INFINITY;
        faultCount = 0;
    }

    /**
     * One decision.
     *
     * @param setpoint    r, in process units
     * @param measurement y, in process units
     * @param nowSeconds  the present time
     * @return the on or the off output
     */
    public double update(double setpoint, double measurement, double nowSeconds) {
        if (!Double.isFinite(setpoint) || !Double.isFinite(measurement) || !Double.isFinite(nowSeconds)) {
            faultCount++;
            if (on) {
                on = false;
                lastSwitchSeconds = Double.isFinite(nowSeconds) ? nowSeconds : lastSwitchSeconds;
            }
            return settings.offOutput();
        }
        double excess = settings.action().sign() * (measurement - setpoint);
        double half = 0.5 * settings.hysteresis();
        double inState = nowSeconds - lastSwitchSeconds;
        if (on && excess > half && inState >= settings.minimumOnSeconds()) {
            on = false;
            lastSwitchSeconds = nowSeconds;
        } else if (!on && excess < -half && inState >= settings.minimumOffSeconds()) {
            on = true;
            lastSwitchSeconds = nowSeconds;
        }
        return on ? settings.onOutput() : settings.offOutput();
    }

    /** {@return whether the output is on now} */
    public boolean on() {
        return on;
    }

    /** {@return the present output} */
    public double output() {
        return on ? settings.onOutput() : settings.offOutput();
    }

    /** {@return the number of updates with a non-finite input since the last reset} */
    public long faultCount() {
        return faultCount;
    }

    /** {@return the settings this controller runs} */
    public OnOffSettings settings() {
        return settings;
    }
}
