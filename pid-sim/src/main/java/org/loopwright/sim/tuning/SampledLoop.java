package org.loopwright.sim.tuning;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The one place where tuning and design ask for the margins and closed-loop poles of a sampled loop
 * with a sensor delay: n whole samples of measurement delay act on the loop as n·h more dead time,
 * the same account {@code sweep} takes of them (see {@link org.loopwright.sim.sweep.Sweep}).
 *
 * <p>Thread-safe: stateless.
 */
public final class SampledLoop {

    private SampledLoop() {
    }

    /**
     * The sampled loop's margins and poles at the settings' own period and methods.
     *
     * @param sensorDelaySamples whole samples of measurement delay, &ge; 0
     */
    public static SampledMargins margins(TransferFunction plant, ControllerSettings settings, int sensorDelaySamples) {
        double h = settings.samplePeriodSeconds();
        return LoopAnalysis.sampled(plant.withDeadTime(plant.deadTimeSeconds() + sensorDelaySamples * h), settings);
    }
}
