package org.loopwright.sim.nonideal;

import java.util.SplittableRandom;

/**
 * The running state of a {@link SensorModel}: the delay line and the seeded random streams (one for
 * noise, one for dropouts, one for jitter, so turning one on does not change the others).
 * Allocation-free; not thread-safe.
 */
public final class Sensor {

    private final SensorModel model;
    private final long seed;
    private final double[] delayLine;
    private int next;
    private SplittableRandom noise;
    private SplittableRandom dropouts;
    private SplittableRandom jitter;

    /** A sensor whose delay line holds the initial process value. */
    public Sensor(SensorModel model, long seed) {
        this.model = model;
        this.seed = seed;
        this.delayLine = new double[model.delaySamples() + 1];
        reset(0.0);
    }

    /** Back to the start: the same random streams again, the delay line filled with {@code processValue}. */
    public void reset(double processValue) {
        java.util.Arrays.fill(delayLine, processValue);
        next = 0;
        SplittableRandom root = new SplittableRandom(seed);
        noise = root.split();
        dropouts = root.split();
        jitter = root.split();
    }

    /**
     * The measurement of one sample.
     *
     * @param processValue the true process output at the sample instant
     * @return what the controller reads (NaN for a dropout)
     */
    public double read(double processValue) {
        delayLine[next] = processValue;
        next = (next + 1) % delayLine.length;
        double y = delayLine[next];
        if (model.noiseStdDev() > 0.0) {
            y += model.noiseStdDev() * noise.nextGaussian();
        }
        double q = model.quantisationStep();
        if (q > 0.0) {
            y = q * Math.rint(y / q);
        }
        if (model.dropoutProbability() > 0.0 && dropouts.nextDouble() < model.dropoutProbability()) {
            return Double.NaN;
        }
        return y;
    }

    /** How late the next sample instant is, in seconds (0 without jitter). */
    public double nextSampleDelaySeconds() {
        if (model.jitterSeconds() == 0.0) {
            return 0.0;
        }
        int level = jitter.nextInt(SensorModel.JITTER_LEVELS + 1);
        return model.jitterSeconds() * level / SensorModel.JITTER_LEVELS;
    }
}
