package org.loopwright.sim.sweep;

import java.util.SplittableRandom;

import org.loopwright.sim.plant.TransferFunction;

/**
 * The factors one sweep run applies to the nominal plant G(s) = N(s)/D(s)·e^(−Ls):
 * <ul>
 * <li>gain factor k: N(s) times k;</li>
 * <li>time-constant factor f: every pole and zero time constant times f with the low-frequency
 *     behaviour kept, G_f(s) = f^m·G(f·s) where m is the number of integrators (so K/(Ts+1) becomes
 *     K/(f·T·s+1), ωn becomes ωn/f, and a pure integrator K/s is unchanged);</li>
 * <li>dead-time factor d: L times d (no effect when L = 0).</li>
 * </ul>
 * Factors of exactly 1 give back the nominal plant bit for bit.
 *
 * @param gainFactor         k &gt; 0
 * @param timeConstantFactor f &gt; 0
 * @param deadTimeFactor     d &gt; 0
 */
public record PlantDraw(double gainFactor, double timeConstantFactor, double deadTimeFactor) {

    /** The nominal plant. */
    public static final PlantDraw NOMINAL = new PlantDraw(1.0, 1.0, 1.0);

    /** Validates the factors. */
    public PlantDraw {
        if (!(gainFactor > 0.0 && timeConstantFactor > 0.0 && deadTimeFactor > 0.0)
                || !Double.isFinite(gainFactor + timeConstantFactor + deadTimeFactor)) {
            throw new IllegalArgumentException("plant factors must be finite and > 0: gainFactor=" + gainFactor
                    + ", timeConstantFactor=" + timeConstantFactor + ", deadTimeFactor=" + deadTimeFactor);
        }
    }

    /**
     * Draws the three factors, each uniform on [1 − s, 1 + s] for its spread s, in the order gain,
     * time constant, dead time (three numbers are always drawn, so a run's stream does not depend on
     * which spreads are zero).
     */
    public static PlantDraw draw(Spread spread, SplittableRandom random) {
        double gain = factor(spread.gain(), random.nextDouble());
        double timeConstant = factor(spread.timeConstant(), random.nextDouble());
        double deadTime = factor(spread.deadTime(), random.nextDouble());
        return new PlantDraw(gain, timeConstant, deadTime);
    }

    private static double factor(double spread, double uniform) {
        return spread == 0.0 ? 1.0 : 1.0 + spread * (2.0 * uniform - 1.0);
    }

    /** The nominal plant with these factors applied. */
    public TransferFunction apply(TransferFunction nominal) {
        double[] numerator = nominal.numerator();
        double[] denominator = nominal.denominator();
        int integrators = trailingZeros(denominator) - trailingZeros(numerator);
        scaleTime(numerator);
        scaleTime(denominator);
        double lowFrequencyKeep = Math.pow(timeConstantFactor, integrators);
        for (int i = 0; i < numerator.length; i++) {
            numerator[i] *= gainFactor * lowFrequencyKeep;
        }
        return new TransferFunction(numerator, denominator, nominal.deadTimeSeconds() * deadTimeFactor);
    }

    /** Replaces s by f·s: the coefficient of s^p is multiplied by f^p. */
    private void scaleTime(double[] descending) {
        int degree = descending.length - 1;
        for (int i = 0; i <= degree; i++) {
            descending[i] *= Math.pow(timeConstantFactor, degree - i);
        }
    }

    private static int trailingZeros(double[] descending) {
        int zeros = 0;
        for (int i = descending.length - 1; i > 0 && descending[i] == 0.0; i--) {
            zeros++;
        }
        return zeros;
    }
}
