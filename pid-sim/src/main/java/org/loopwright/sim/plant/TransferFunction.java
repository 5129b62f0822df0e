package org.loopwright.sim.plant;

import java.util.Arrays;
import java.util.Optional;

/**
 * A rational transfer function with a dead time, G(s) = N(s)/D(s)·e^(−sL), coefficients in
 * descending powers of s. Proper (deg N &le; deg D), with a non-zero leading denominator coefficient,
 * and of order at most {@link #MAX_ORDER}.
 *
 * <p>Example: 1/(s+1)³ is {@code new TransferFunction(new double[] {1}, new double[] {1, 3, 3, 1}, 0)};
 * the factories build the common process models, for example {@code TransferFunction.fopdt(2.0, 30.0, 5.0)}
 * for 2·e^(−5s)/(30s+1). Errors name the scenario file's key: {@code "time-constant must be finite and > 0:
 * time-constant=-1.0"}.
 *
 * @param numerator        N(s), descending powers of s
 * @param denominator      D(s), descending powers of s
 * @param deadTimeSeconds  L &ge; 0
 */
public record TransferFunction(double[] numerator, double[] denominator, double deadTimeSeconds)
        implements PlantModel {

    /**
     * The highest denominator order: the work of the exact discretisation and of the pole and margin
     * analysis grows with the cube of the order, and process models of practice stay far below it.
     */
    public static final int MAX_ORDER = 20;

    /** Validates and copies the coefficients. */
    public TransferFunction {
        numerator = finiteCopy("numerator", numerator);
        denominator = finiteCopy("denominator", denominator);
        if (denominator.length > MAX_ORDER + 1) {
            throw new IllegalArgumentException("denominator must be of order <= " + MAX_ORDER + " (at most "
                    + (MAX_ORDER + 1) + " coefficients): denominator has " + denominator.length + " coefficients");
        }
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

    /** K/(Ts+1). */
    public static TransferFunction firstOrder(double gain, double timeConstantSeconds) {
        return fopdt(gain, timeConstantSeconds, 0.0);
    }

    /** K·e^(−Ls)/(Ts+1): first order plus dead time. */
    public static TransferFunction fopdt(double gain, double timeConstantSeconds, double deadTimeSeconds) {
        return new TransferFunction(new double[] {Checks.finite("gain", gain)},
                new double[] {Checks.positive("time-constant", timeConstantSeconds), 1.0}, deadTimeSeconds);
    }

    /** K·e^(−Ls)/((T1·s+1)(T2·s+1)): second order plus dead time from two time constants. */
    public static TransferFunction sopdt(double gain, double firstTimeConstantSeconds,
            double secondTimeConstantSeconds, double deadTimeSeconds) {
        double t1 = Checks.positive("time-constants", firstTimeConstantSeconds);
        double t2 = Checks.positive("time-constants", secondTimeConstantSeconds);
        return new TransferFunction(new double[] {Checks.finite("gain", gain)}, new double[] {t1 * t2, t1 + t2, 1.0},
                deadTimeSeconds);
    }

    /** K·ωn²·e^(−Ls)/(s² + 2ζωn·s + ωn²): second order plus dead time from natural frequency and damping. */
    public static TransferFunction sopdtOscillatory(double gain, double naturalFrequencyRadPerSecond,
            double damping, double deadTimeSeconds) {
        double wn = Checks.positive("natural-frequency", naturalFrequencyRadPerSecond);
        double zeta = Checks.positive("damping", damping);
        return new TransferFunction(new double[] {Checks.finite("gain", gain) * wn * wn},
                new double[] {1.0, 2.0 * zeta * wn, wn * wn}, deadTimeSeconds);
    }

    /** K·e^(−Ls)/s: integrating plus dead time (a level, a position). */
    public static TransferFunction integrating(double gain, double deadTimeSeconds) {
        return new TransferFunction(new double[] {Checks.finite("gain", gain)}, new double[] {1.0, 0.0}, deadTimeSeconds);
    }

    /** The same rational part with another dead time. */
    public TransferFunction withDeadTime(double seconds) {
        return new TransferFunction(numerator, denominator, seconds);
    }

    /** G(0) = N(0)/D(0): infinite (signed by N(0)) for an integrating plant. */
    public double staticGain() {
        return numerator[numerator.length - 1] / denominator[denominator.length - 1];
    }

    @Override
    public Plant newPlant() {
        return new LinearPlant(this);
    }

    @Override
    public Optional<TransferFunction> linear() {
        return Optional.of(this);
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
