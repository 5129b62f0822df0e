package org.loopwright.sim.sweep;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.SplittableRandom;

import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.PlantParameters;
import org.loopwright.sim.plant.PlantType;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The factors one sweep run applies to the nominal plant, by spread key ({@link PlantType#spreadKeys()}).
 * A key left out has the factor 1; a factor of exactly 1 is not stored, so a draw with every factor 1
 * equals {@link #NOMINAL}.
 *
 * <p>On a linear plant G(s) = N(s)/D(s)·e^(−Ls):
 * <ul>
 * <li>{@code gain} k: N(s) times k;</li>
 * <li>{@code time-constant} f: every pole and zero time constant times f with the low-frequency
 *     behaviour kept, G_f(s) = f^m·G(f·s) where m is the number of integrators (so K/(Ts+1) becomes
 *     K/(f·T·s+1), ωn becomes ωn/f, and a pure integrator K/s is unchanged);</li>
 * <li>{@code dead-time} d: L times d (no effect when L = 0).</li>
 * </ul>
 * On a nonlinear plant each key's parameter is multiplied by its factor ({@link PlantParameters}).
 * Factors of exactly 1 give back the nominal plant bit for bit.
 *
 * @param factors factor per key, each finite and &gt; 0
 */
public record PlantDraw(Map<String, Double> factors) {

    /** The nominal plant. */
    public static final PlantDraw NOMINAL = new PlantDraw(Map.of());

    /** Validates the factors and drops those of exactly 1. */
    public PlantDraw {
        Map<String, Double> kept = new LinkedHashMap<>();
        factors.forEach((key, factor) -> {
            if (!(factor > 0.0 && Double.isFinite(factor))) {
                throw new IllegalArgumentException("plant factors must be finite and > 0: " + key + "=" + factor);
            }
            if (factor != 1.0) {
                kept.put(key, factor);
            }
        });
        factors = Collections.unmodifiableMap(kept);
    }

    /**
     * Draws one factor per spread key of the plant type, each uniform on [1 − s, 1 + s] for its spread s,
     * in the order of {@link PlantType#spreadKeys()} (for a linear plant gain, time constant, dead time).
     * One number is drawn for every key, so a run's stream does not depend on which spreads are zero.
     */
    public static PlantDraw draw(PlantType type, Spread spread, SplittableRandom random) {
        Map<String, Double> factors = new LinkedHashMap<>();
        for (FileKey<Double> key : type.spreadKeys()) {
            double s = spread.fraction(key.word());
            double uniform = random.nextDouble();
            factors.put(key.word(), s == 0.0 ? 1.0 : 1.0 + s * (2.0 * uniform - 1.0));
        }
        return new PlantDraw(factors);
    }

    /** The factor of one key: 1 when it was not drawn away from 1. */
    public double factor(String key) {
        return factors.getOrDefault(key, 1.0);
    }

    /**
     * The nominal plant with these factors applied.
     *
     * @throws org.loopwright.pid.InvalidSettingException when a nonlinear model refuses the scaled values
     */
    public PlantModel apply(PlantModel nominal) {
        if (nominal instanceof TransferFunction linear) {
            return apply(linear);
        }
        Map<FileKey<Double>, Double> byKey = new LinkedHashMap<>();
        for (FileKey<Double> key : nominal.type().spreadKeys()) {
            if (factors.containsKey(key.word())) {
                byKey.put(key, factors.get(key.word()));
            }
        }
        return PlantParameters.scaled(nominal, byKey);
    }

    /** The nominal transfer function with the {@code gain}, {@code time-constant} and {@code dead-time} factors applied. */
    public TransferFunction apply(TransferFunction nominal) {
        double gainFactor = factor("gain");
        double timeConstantFactor = factor("time-constant");
        double[] numerator = nominal.numerator();
        double[] denominator = nominal.denominator();
        int integrators = trailingZeros(denominator) - trailingZeros(numerator);
        scaleTime(numerator, timeConstantFactor);
        scaleTime(denominator, timeConstantFactor);
        double lowFrequencyKeep = Math.pow(timeConstantFactor, integrators);
        for (int i = 0; i < numerator.length; i++) {
            numerator[i] *= gainFactor * lowFrequencyKeep;
        }
        return new TransferFunction(numerator, denominator, nominal.deadTimeSeconds() * factor("dead-time"));
    }

    /** Replaces s by f·s: the coefficient of s^p is multiplied by f^p. */
    private static void scaleTime(double[] descending, double factor) {
        int degree = descending.length - 1;
        for (int i = 0; i <= degree; i++) {
            descending[i] *= Math.pow(factor, degree - i);
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
