package org.loopwright.sim.plant;

import java.util.Arrays;
import java.util.Optional;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;

/**
 * A rational transfer function with a dead time, G(s) = N(s)/D(s)·e^(−sL), coefficients in
 * descending powers of s. Proper (deg N &le; deg D), with a non-zero leading denominator coefficient,
 * and of order at most {@link #MAX_ORDER}.
 *
 * <p>Example: 1/(s+1)³ is {@code new TransferFunction(new double[] {1}, new double[] {1, 3, 3, 1}, 0)};
 * the factories build the common process models, for example {@code TransferFunction.fopdt(2.0, 30.0, 5.0)}
 * for 2·e^(−5s)/(30s+1). Errors name the field: {@code "timeConstantSeconds must be finite and > 0:
 * timeConstantSeconds=-1.0"}.
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
            throw new InvalidSettingException("denominator", "order " + (denominator.length - 1),
                    "must be of order <= " + MAX_ORDER);
        }
        if (denominator[0] == 0.0) {
            throw new InvalidSettingException("denominator", Arrays.toString(denominator),
                    "must have a non-zero leading coefficient");
        }
        if (numerator.length > denominator.length) {
            throw new InvalidSettingException("numerator", Arrays.toString(numerator),
                    "must not have more coefficients than denominator (denominator=" + Arrays.toString(denominator)
                            + ")");
        }
        SettingChecks.nonNegative("deadTimeSeconds", deadTimeSeconds);
    }

    /** K/(Ts+1). */
    public static TransferFunction firstOrder(double gain, double timeConstantSeconds) {
        return fopdt(gain, timeConstantSeconds, 0.0);
    }

    /** K·e^(−Ls)/(Ts+1): first order plus dead time. */
    public static TransferFunction fopdt(double gain, double timeConstantSeconds, double deadTimeSeconds) {
        return new TransferFunction(new double[] {SettingChecks.finite("gain", gain)},
                new double[] {SettingChecks.positive("timeConstantSeconds", timeConstantSeconds), 1.0}, deadTimeSeconds);
    }

    /** K·e^(−Ls)/((T1·s+1)(T2·s+1)): second order plus dead time from two time constants. */
    public static TransferFunction sopdt(double gain, double firstTimeConstantSeconds,
            double secondTimeConstantSeconds, double deadTimeSeconds) {
        double t1 = SettingChecks.positive("timeConstantsSeconds", firstTimeConstantSeconds);
        double t2 = SettingChecks.positive("timeConstantsSeconds", secondTimeConstantSeconds);
        return new TransferFunction(new double[] {SettingChecks.finite("gain", gain)}, new double[] {t1 * t2, t1 + t2, 1.0},
                deadTimeSeconds);
    }

    /** K·ωn²·e^(−Ls)/(s² + 2ζωn·s + ωn²): second order plus dead time from natural frequency and damping. */
    public static TransferFunction sopdtOscillatory(double gain, double naturalFrequencyRadPerSecond,
            double damping, double deadTimeSeconds) {
        double wn = SettingChecks.positive("naturalFrequencyRadPerSecond", naturalFrequencyRadPerSecond);
        double zeta = SettingChecks.positive("damping", damping);
        return new TransferFunction(new double[] {SettingChecks.finite("gain", gain) * wn * wn},
                new double[] {1.0, 2.0 * zeta * wn, wn * wn}, deadTimeSeconds);
    }

    /** K·e^(−Ls)/s: integrating plus dead time (a level, a position). */
    public static TransferFunction integrating(double gain, double deadTimeSeconds) {
        return new TransferFunction(new double[] {SettingChecks.finite("gain", gain)}, new double[] {1.0, 0.0}, deadTimeSeconds);
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
    public PlantType type() {
        return PlantType.TRANSFER_FUNCTION;
    }

    @Override
    public Optional<TransferFunction> linear() {
        return Optional.of(this);
    }

    private static double[] finiteCopy(String field, double[] values) {
        if (values == null || values.length == 0) {
            throw new InvalidSettingException(field, "[]", "must have at least one coefficient");
        }
        for (double v : values) {
            if (!Double.isFinite(v)) {
                throw new InvalidSettingException(field, Arrays.toString(values), "must have finite coefficients");
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
