package org.loopwright.pid.form;

import org.loopwright.pid.InvalidSettingException;

/** Shared validation of gain values, so every form reports errors in one shape. */
final class GainChecks {

    private GainChecks() {
    }

    static void nonNegativeFinite(String field, double value) {
        if (!Double.isFinite(value) || value < 0.0) {
            throw new InvalidSettingException(field, value, "must be finite and >= 0");
        }
    }

    static void positiveOrInfinite(String field, double value) {
        if (Double.isNaN(value) || value <= 0.0) {
            throw new InvalidSettingException(field, value, "must be > 0 (infinity for no integral action)");
        }
    }
}
