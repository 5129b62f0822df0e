package org.loopwright.pid;

/**
 * The one set of value checks behind every settings type in Loopwright (controller, gains, relay
 * experiment, on-off controller, and the simulator's plant, actuator and sensor models). Each check
 * returns the value it accepts and otherwise throws {@link InvalidSettingException} naming the Java
 * field, the value and the rule, for example {@code "hysteresis must be finite and >= 0: hysteresis=-1.0"};
 * file readers map the field back to their own key.
 *
 * <p>Thread-safe: stateless.
 */
public final class SettingChecks {

    private SettingChecks() {
    }

    /**
     * A finite number.
     *
     * @param field the field's name, as the caller's API spells it
     * @param value the value to check
     * @return the value
     * @throws InvalidSettingException when the value is infinite or NaN
     */
    public static double finite(String field, double value) {
        if (!Double.isFinite(value)) {
            throw new InvalidSettingException(field, value, "must be finite");
        }
        return value;
    }

    /**
     * A finite number &gt; 0.
     *
     * @param field the field's name, as the caller's API spells it
     * @param value the value to check
     * @return the value
     * @throws InvalidSettingException when the value is not finite or not &gt; 0
     */
    public static double positive(String field, double value) {
        if (!Double.isFinite(value) || value <= 0.0) {
            throw new InvalidSettingException(field, value, "must be finite and > 0");
        }
        return value;
    }

    /**
     * A finite number &ge; 0.
     *
     * @param field the field's name, as the caller's API spells it
     * @param value the value to check
     * @return the value
     * @throws InvalidSettingException when the value is not finite or is negative
     */
    public static double nonNegative(String field, double value) {
        if (!Double.isFinite(value) || value < 0.0) {
            throw new InvalidSettingException(field, value, "must be finite and >= 0");
        }
        return value;
    }

    /**
     * A number &gt; 0 where +infinity stands for "none" (no limit, no integral action).
     *
     * @param field             the field's name, as the caller's API spells it
     * @param value             the value to check
     * @param infinityMeans     what infinity stands for, as the message says it ("no limit")
     * @return the value
     * @throws InvalidSettingException when the value is NaN or not &gt; 0
     */
    public static double positiveOrInfinite(String field, double value, String infinityMeans) {
        if (Double.isNaN(value) || value <= 0.0) {
            throw new InvalidSettingException(field, value, "must be > 0 (infinity for " + infinityMeans + ")");
        }
        return value;
    }

    /**
     * A number from 0 to 1, both included.
     *
     * @param field the field's name, as the caller's API spells it
     * @param value the value to check
     * @return the value
     * @throws InvalidSettingException when the value is outside [0, 1] or NaN
     */
    public static double fraction(String field, double value) {
        if (!(value >= 0.0 && value <= 1.0)) {
            throw new InvalidSettingException(field, value, "must be between 0 and 1");
        }
        return value;
    }

    /**
     * A whole number no smaller than a bound.
     *
     * @param field the field's name, as the caller's API spells it
     * @param value the value to check
     * @param least the smallest value allowed
     * @return the value
     * @throws InvalidSettingException when the value is below the bound
     */
    public static int atLeast(String field, int value, int least) {
        if (value < least) {
            throw new InvalidSettingException(field, value, "must be >= " + least);
        }
        return value;
    }
}
