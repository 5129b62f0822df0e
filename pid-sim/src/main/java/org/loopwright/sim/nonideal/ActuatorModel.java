package org.loopwright.sim.nonideal;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;

/**
 * What the actuator does to the controller's output before the plant sees it, in this order: a dead
 * zone (commands within ±deadZone give 0; outside it the command is shifted toward 0 by deadZone,
 * so the characteristic is continuous), saturation to [min, max], and a slew (rate) limit.
 *
 * <p>Example: a heater that delivers 0–2000 W and ramps at most 500 W/s:
 * {@code new ActuatorModel(0, 2000, 500, 0)}. {@link #IDEAL} passes the command through.
 *
 * @param min            the lowest deliverable input (−infinity for none)
 * @param max            the highest deliverable input (+infinity for none), &ge; min
 * @param slewPerSecond  the largest change per second, &gt; 0 (infinity for none)
 * @param deadZone       the half-width of the dead zone around 0, &ge; 0
 */
public record ActuatorModel(double min, double max, double slewPerSecond, double deadZone) {

    /** An actuator that delivers exactly what it is told. */
    public static final ActuatorModel IDEAL = new ActuatorModel(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY,
            Double.POSITIVE_INFINITY, 0.0);

    /** Validates every value; errors name the fields. */
    public ActuatorModel {
        if (Double.isNaN(min) || min == Double.POSITIVE_INFINITY) {
            throw new InvalidSettingException("min", min, "must be a number below +infinity");
        }
        if (Double.isNaN(max) || max == Double.NEGATIVE_INFINITY) {
            throw new InvalidSettingException("max", max, "must be a number above -infinity");
        }
        if (min > max) {
            throw new InvalidSettingException("min", min, "must be <= max (max=" + max + ")");
        }
        SettingChecks.positiveOrInfinite("slewPerSecond", slewPerSecond, "no limit");
        SettingChecks.nonNegative("deadZone", deadZone);
    }

    /** This actuator with another range. */
    public ActuatorModel withRange(double newMin, double newMax) {
        return new ActuatorModel(newMin, newMax, slewPerSecond, deadZone);
    }
}
