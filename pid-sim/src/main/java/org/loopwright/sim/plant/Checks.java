package org.loopwright.sim.plant;

/** Parameter checks with messages in the project's one shape, naming the scenario file's key. */
final class Checks {

    private Checks() {
    }

    static double finite(String key, double value) {
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException(key + " must be finite: " + key + "=" + value);
        }
        return value;
    }

    static double positive(String key, double value) {
        if (!Double.isFinite(value) || value <= 0.0) {
            throw new IllegalArgumentException(key + " must be finite and > 0: " + key + "=" + value);
        }
        return value;
    }

    static double nonNegative(String key, double value) {
        if (!Double.isFinite(value) || value < 0.0) {
            throw new IllegalArgumentException(key + " must be finite and >= 0: " + key + "=" + value);
        }
        return value;
    }

    static double positiveOrInfinite(String key, double value) {
        if (Double.isNaN(value) || value <= 0.0) {
            throw new IllegalArgumentException(key + " must be > 0 (infinity for no limit): " + key + "=" + value);
        }
        return value;
    }
}
