package org.loopwright.sim.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Numbers as reports, tables and CSV files print them: to a number of significant digits, with no
 * float noise ({@code 19.99}, not {@code 19.990000000000002}), no trailing zeros, {@code 0} for
 * {@code -0.0} and for anything that rounds to zero, plain notation from 1e-4 to below 1e7 and
 * {@code 1.5e-06} style outside it; a value that is not finite prints as {@link #MISSING}.
 *
 * <p>Thread-safe: stateless.
 */
public final class NumberText {

    /** The one word for a figure that does not exist or does not apply, in every text output. */
    public static final String MISSING = "n/a";

    /** The significant digits a figure gets unless its column says otherwise. */
    public static final int DEFAULT_DIGITS = 4;

    private NumberText() {
    }

    /**
     * A value to {@value #DEFAULT_DIGITS} significant digits.
     *
     * @param value the value
     * @return its text, or {@link #MISSING} when it is not finite
     */
    public static String of(double value) {
        return of(value, DEFAULT_DIGITS);
    }

    /**
     * A value to some significant digits.
     *
     * @param value  the value
     * @param digits significant digits, 1 to 17
     * @return its text, or {@link #MISSING} when it is not finite
     */
    public static String of(double value, int digits) {
        if (!Double.isFinite(value)) {
            return MISSING;
        }
        if (value == 0.0) {
            return "0";
        }
        BigDecimal rounded = new BigDecimal(value).round(new MathContext(digits, RoundingMode.HALF_EVEN))
                .stripTrailingZeros();
        if (rounded.signum() == 0) {
            return "0";
        }
        double magnitude = Math.abs(rounded.doubleValue());
        if (magnitude >= 1e-4 && magnitude < 1e7) {
            return rounded.toPlainString();
        }
        int exponent = rounded.precision() - rounded.scale() - 1;
        BigDecimal mantissa = rounded.movePointLeft(exponent).stripTrailingZeros();
        return mantissa.toPlainString() + "e" + (exponent < 0 ? "-" : "+") + String.format("%02d", Math.abs(exponent));
    }
}
