package org.loopwright.sim.frequency;

import org.hipparchus.complex.Complex;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The frequency response of a plant G(s) = N(s)/D(s)·e^(−sL) at s = jω, dead time included.
 *
 * <p>Example: 1/(s+1)³ at ω = √3 is −1/8 (phase −180°). Thread-safe: immutable.
 */
public final class ContinuousPlant implements FrequencyResponse {

    private final double[] numerator;
    private final double[] denominator;
    private final double deadTimeSeconds;

    /** The response of {@code plant}. */
    public ContinuousPlant(TransferFunction plant) {
        numerator = plant.numerator();
        denominator = plant.denominator();
        deadTimeSeconds = plant.deadTimeSeconds();
    }

    @Override
    public Complex at(double omegaRadPerSecond) {
        Complex s = new Complex(0.0, omegaRadPerSecond);
        Complex rational = horner(numerator, s).divide(horner(denominator, s));
        return rational.multiply(Complex.valueOf(0.0, -omegaRadPerSecond * deadTimeSeconds).exp());
    }

    /** A polynomial with coefficients in descending powers, evaluated at {@code x}. */
    static Complex horner(double[] descending, Complex x) {
        Complex sum = Complex.ZERO;
        for (double c : descending) {
            sum = sum.multiply(x).add(c);
        }
        return sum;
    }
}
