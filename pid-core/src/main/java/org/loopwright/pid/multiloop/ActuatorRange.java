package org.loopwright.pid.multiloop;

/**
 * The range of one actuator of a split range, in its own units: idle at {@code min}, full at
 * {@code max} (for example 0–100 % valve opening, or 0–2000 W). Checked by {@link SplitRange}.
 *
 * @param min the actuator's value at rest
 * @param max the actuator's value at full effort
 */
public record ActuatorRange(double min, double max) {
}
