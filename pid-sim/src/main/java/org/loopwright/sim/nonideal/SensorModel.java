package org.loopwright.sim.nonideal;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;

/**
 * What stands between the process and the controller's measurement, applied in this order: a delay
 * of whole samples, additive Gaussian noise (seeded), quantisation to a step, and dropouts (a sample
 * replaced by NaN, as a failed read). Sample jitter moves the instant at which each sample is taken
 * to k·h + δ with δ drawn uniformly from {0, J/16, 2J/16, …, J} (a grid, so the exact plant
 * discretisation can be cached); the controller still assumes the nominal period.
 *
 * <p>A transport delay that is not a whole number of samples belongs in the plant's dead time,
 * which is exact.
 *
 * <p>Example: ±0.05 °C noise, 0.01 °C resolution and 1 % failed reads:
 * {@code new SensorModel(0.05, 0.01, 0, 0, 0.01)}. {@link #IDEAL} reads the process exactly.
 *
 * @param noiseStdDev          the noise's standard deviation, &ge; 0, process units
 * @param quantisationStep     the resolution, &ge; 0 (0 for none), process units
 * @param delaySamples         the measurement delay in whole samples, 0 to {@link #MAX_DELAY_SAMPLES}
 * @param jitterSeconds        the largest delay of a sample instant, &ge; 0 and below the sample period
 * @param dropoutProbability   the chance that a sample is NaN, in [0, 1)
 */
public record SensorModel(double noiseStdDev, double quantisationStep, int delaySamples, double jitterSeconds,
        double dropoutProbability) {

    /**
     * The longest measurement delay, in samples: the sampled-loop analysis carries one state per
     * sample of delay, and a longer transport delay belongs in the plant's dead time, which is exact.
     */
    public static final int MAX_DELAY_SAMPLES = 100;

    /** The number of steps in the jitter grid. */
    public static final int JITTER_LEVELS = 16;

    /** A sensor that reads the process exactly, on time. */
    public static final SensorModel IDEAL = new SensorModel(0.0, 0.0, 0, 0.0, 0.0);

    /** Validates every value; errors name the fields. */
    public SensorModel {
        SettingChecks.nonNegative("noiseStdDev", noiseStdDev);
        SettingChecks.nonNegative("quantisationStep", quantisationStep);
        SettingChecks.atLeast("delaySamples", delaySamples, 0);
        if (delaySamples > MAX_DELAY_SAMPLES) {
            throw new InvalidSettingException("delaySamples", delaySamples, "must be <= " + MAX_DELAY_SAMPLES
                    + " (a longer delay belongs in the plant's dead-time)");
        }
        SettingChecks.nonNegative("jitterSeconds", jitterSeconds);
        if (!(dropoutProbability >= 0.0 && dropoutProbability < 1.0)) {
            throw new InvalidSettingException("dropoutProbability", dropoutProbability, "must be >= 0 and < 1");
        }
    }
}
