package org.loopwright.sim.frequency;

import java.util.Objects;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.plant.TransferFunction;

/**
 * Everything linear in a loop as it runs sampled, the one description every sampled analysis
 * (margins, closed-loop poles, the discretisation study, sweeps, tuning checks) takes, so the loop
 * analysed is the loop simulated: the plant with its dead time, the controller discretised at the
 * period with its own integral and derivative methods, and the whole samples of measurement delay
 * between the process and the controller (a scenario's {@code sensor: {delay-samples: N}}).
 *
 * <p>What is not here is not linear: limits, slew, dead zone, quantisation, noise, dropouts and
 * jitter are left to the simulation.
 *
 * <p>Example: a scenario's loop with 3 samples of sensor delay,
 * {@code new SampledLoop(plant, settings, settings.samplePeriodSeconds(), 3)}. Thread-safe: immutable.
 *
 * @param plant              the plant, dead time included
 * @param controller         the PID settings (gains, form, methods, action)
 * @param periodSeconds      the sample period h the controller runs at, finite and &gt; 0
 * @param sensorDelaySamples whole samples of measurement delay, &ge; 0
 */
public record SampledLoop(TransferFunction plant, ControllerSettings controller, double periodSeconds,
        int sensorDelaySamples) {

    /**
     * The most samples of delay (plant dead time over h, plus the sensor's) an analysis takes: the
     * closed-loop poles are eigenvalues of a companion matrix of about that order, O(n³) work, which is
     * about a second at this size.
     */
    public static final int MAX_DELAY_SAMPLES = 1000;

    /** Checks the parts. */
    public SampledLoop {
        Objects.requireNonNull(plant, "plant");
        Objects.requireNonNull(controller, "controller");
        if (!Double.isFinite(periodSeconds) || periodSeconds <= 0.0) {
            throw new IllegalArgumentException("sample period must be finite and > 0: sample-period="
                    + periodSeconds);
        }
        if (sensorDelaySamples < 0) {
            throw new IllegalArgumentException("delay-samples must be >= 0: delay-samples=" + sensorDelaySamples);
        }
    }

    /** All the delay in the loop in samples of the period: the plant's dead time over h, plus the sensor's. */
    public double delaySamples() {
        return plant.deadTimeSeconds() / periodSeconds + sensorDelaySamples;
    }

    /** The loop at the controller's own period with an ideal, undelayed sensor. */
    public static SampledLoop of(TransferFunction plant, ControllerSettings controller) {
        return new SampledLoop(plant, controller, controller.samplePeriodSeconds(), 0);
    }

    /** The same loop with the controller sampled at {@code seconds} (the sensor delay stays in samples). */
    public SampledLoop atPeriod(double seconds) {
        return new SampledLoop(plant, controller, seconds, sensorDelaySamples);
    }

    /** The same loop with another controller (the period stays). */
    public SampledLoop withController(ControllerSettings settings) {
        return new SampledLoop(plant, settings, periodSeconds, sensorDelaySamples);
    }

    /** The same loop around another plant. */
    public SampledLoop withPlant(TransferFunction other) {
        return new SampledLoop(other, controller, periodSeconds, sensorDelaySamples);
    }

    /** All the dead time in the loop, in seconds: the plant's and the sensor's. */
    public double totalDelaySeconds() {
        return plant.deadTimeSeconds() + sensorDelaySamples * periodSeconds;
    }
}
