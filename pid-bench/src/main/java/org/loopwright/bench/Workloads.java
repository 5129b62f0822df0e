package org.loopwright.bench;

import java.util.SplittableRandom;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ControllerForm;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.PidGains;

/**
 * The configurations and input sequences every benchmark shares: a water bath heater (output in
 * percent of heater power, process variable in °C) whose setpoint steps between 50 and 60 °C while
 * the measured temperature swings around it, so the limits, the slew limit and back-calculation are
 * all active part of the time. The numbers are a demo scenario, not a tuning.
 */
public final class Workloads {

    /** The length of every input sequence (a power of two, indexed with {@link #MASK}). */
    public static final int LENGTH = 1024;
    /** Index mask for the input sequences. */
    public static final int MASK = LENGTH - 1;
    /** The sample period h of the benchmarked controllers. */
    public static final double PERIOD_SECONDS = 0.1;
    /** The bath heater's gains in ideal form: Kc = 8 %/°C, Ti = 30 s, Td = 5 s. */
    public static final IdealGains BATH_GAINS = new IdealGains(8.0, 30.0, 5.0);

    private Workloads() {
    }

    /** The bath heater's gains expressed in the given form (all three give the same controller). */
    public static PidGains gainsIn(ControllerForm form) {
        return switch (form) {
            case PARALLEL -> BATH_GAINS.toParallel();
            case IDEAL -> BATH_GAINS;
            case SERIES -> BATH_GAINS.toSeries();
        };
    }

    /**
     * Every feature the full-featured target names: derivative filter (N = 10), setpoint weights
     * b = 0.7 and c = 0.2, output range 0–100 %, output slew 100 %/s, back-calculation.
     */
    public static ControllerSettings fullFeatured(PidGains gains, IntegralMethod integral, DerivativeMethod derivative) {
        return ControllerSettings.builder()
                .gains(gains)
                .samplePeriodSeconds(PERIOD_SECONDS)
                .derivativeFilterRatio(10.0)
                .setpointWeights(0.7, 0.2)
                .integralMethod(integral)
                .derivativeMethod(derivative)
                .outputRange(0.0, 100.0)
                .outputSlewPerSecond(100.0)
                .windupProtection(WindupProtection.BACK_CALCULATION)
                .faultPolicy(FaultPolicy.HOLD, 0.0)
                .build();
    }

    /** {@link #fullFeatured} with the bath gains, Tustin integral and backward-Euler derivative. */
    public static ControllerSettings fullFeatured() {
        return fullFeatured(BATH_GAINS, IntegralMethod.TUSTIN, DerivativeMethod.BACKWARD_EULER);
    }

    /** Setpoints: 50 °C and 60 °C alternating every 256 samples. */
    public static double[] setpoints() {
        double[] r = new double[LENGTH];
        for (int k = 0; k < LENGTH; k++) {
            r[k] = (k / 256) % 2 == 0 ? 50.0 : 60.0;
        }
        return r;
    }

    /** Measurements: 55 °C ± 8 °C over 341 samples plus seeded noise of 0.05 °C, different per seed. */
    public static double[] measurements(long seed) {
        SplittableRandom noise = new SplittableRandom(seed);
        double phase = noise.nextDouble(2.0 * Math.PI);
        double[] y = new double[LENGTH];
        for (int k = 0; k < LENGTH; k++) {
            y[k] = 55.0 + 8.0 * Math.sin(2.0 * Math.PI * k / 341.0 + phase) + 0.05 * noise.nextGaussian();
        }
        return y;
    }

    /** Measured periods for the variable-period update: h ± 2 % jitter, seeded. */
    public static double[] jitteredPeriods(long seed) {
        SplittableRandom jitter = new SplittableRandom(seed);
        double[] h = new double[LENGTH];
        for (int k = 0; k < LENGTH; k++) {
            h[k] = PERIOD_SECONDS * (1.0 + 0.02 * (2.0 * jitter.nextDouble() - 1.0));
        }
        return h;
    }
}
