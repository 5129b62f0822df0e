package org.loopwright.sim.plant;

import java.util.Arrays;

/**
 * A rational transfer function with a dead time, G(s) = N(s)/D(s)·e^(−sL), coefficients in
 * descending powers of s. Proper (deg N &le; deg D), with a non-zero leading denominator coefficient.
 *
 * <p>Example: 1/(s+1)³ is {@code new TransferFunction(new double[] {1}, new double[] {1, 3, 3, 1}, 0)}.
 *
 * @param numerator        N(s), descending powers of s
 * @param denominator      D(s), descending powers of s
 * @param deadTimeSeconds  L &ge; 0
 */
public record TransferFunction(double[] numerator, double[] denominator, double deadTimeSeconds) {

    /** Validates and copies the coefficients. */
    public TransferFunction {
        numerator = finiteCopy("numerator", numerator);
        denominator = finiteCopy("denominator", denominator);
        if (denominator[0] == 0.0) {
            throw new IllegalArgumentException("denominator leading coefficient must be non-zero: denominator="
                    + Arrays.toString(denominator));
        }
        if (numerator.length > denominator.length) {
            throw new IllegalArgumentException("numerator degree must not exceed the denominator's: numerator="
                    + Arrays.toString(numerator) + ", denominator=" + Arrays.toString(denominator));
        }
        if (!Double.isFinite(deadTimeSeconds) || deadTimeSeconds < 0.0) {
            throw new IllegalArgumentException("dead-time must be finite and >= 0: dead-time=" + deadTimeSeconds);
        }
    }

    private static double[] finiteCopy(String field, double[] values) {
        if (values == null || values.length == 0) {
            throw new IllegalArgumentException(field + " must have at least one coefficient: " + field + "=[]");
        }
        for (double v : values) {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException(field + " coefficients must be finite: " + field + "="
                        + Arrays.toString(values));
            }
        }
        return values.clone();
    }

    @Override
    public double[] numerator() {
        return numerator.clone();
    }

    @Override
    public double[] denominator() {
        return denominator.clone();
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof TransferFunction t && Arrays.equals(numerator, t.numerator)
                && Arrays.equals(denominator, t.denominator) && deadTimeSeconds == t.deadTimeSeconds;
    }

    @Override
    public int hashCode() {
        return 31 * (31 * Arrays.hashCode(numerator) + Arrays.hashCode(denominator)) + Double.hashCode(deadTimeSeconds);
    }

    @Override
    public String toString() {
        return "TransferFunction[numerator=" + Arrays.toString(numerator) + ", denominator="
                + Arrays.toString(denominator) + ", deadTimeSeconds=" + deadTimeSeconds + "]";
    }
}
