package org.loopwright.sim.config;

/** What a number read from a file must satisfy; the description is what an error message says is allowed. */
public enum NumberRule {
    /** Any number, including infinities ({@code .inf}, {@code -.inf}) where YAML gives them. */
    ANY(""),
    /** A finite number. */
    FINITE("finite"),
    /** A finite number &gt; 0. */
    POSITIVE("finite and > 0"),
    /** A finite number &ge; 0. */
    NON_NEGATIVE("finite and >= 0"),
    /** A number from 0 to 1. */
    FRACTION("between 0 and 1");

    private final String description;

    NumberRule(String description) {
        this.description = description;
    }

    /** Whether the value satisfies the rule. */
    public boolean accepts(double value) {
        return switch (this) {
            case ANY -> !Double.isNaN(value);
            case FINITE -> Double.isFinite(value);
            case POSITIVE -> Double.isFinite(value) && value > 0.0;
            case NON_NEGATIVE -> Double.isFinite(value) && value >= 0.0;
            case FRACTION -> value >= 0.0 && value <= 1.0;
        };
    }

    /** What is allowed, as it follows "must be": "finite and &gt; 0"; empty for {@link #ANY}. */
    public String description() {
        return description;
    }

    /** "a number" with the rule in parentheses when there is one: "a number (finite and &gt; 0)". */
    public String describeNumber() {
        return description.isEmpty() ? "a number" : "a number (" + description + ")";
    }
}
