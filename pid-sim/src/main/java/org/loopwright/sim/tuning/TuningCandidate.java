package org.loopwright.sim.tuning;

import java.util.Objects;
import java.util.Optional;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.form.SeriesGains;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.metrics.ResponseMetrics;

/**
 * One rule's settings and what they do: the margins of the loop on the model and the
 * figures of a setpoint step and a load step in simulation. Margins and figures are empty when
 * there was no model to check them on.
 *
 * @param tuning            the rule's result
 * @param settings          controller settings carrying the gains (ideal form)
 * @param margins           margins and Ms of the loop on the model
 * @param sampledMargins    whether those are of the sampled loop (true) or of the continuous design (false)
 * @param sampled           margins and closed-loop poles of the sampled loop the settings will run in (period,
 *                          methods, sensor delay), whenever there is a linear plant: the stability verdict
 * @param setpointResponse  figures of a unit setpoint step
 * @param loadResponse      figures of a unit load step at the plant input (IAE, peak deviation)
 */
public record TuningCandidate(TunedGains tuning, ControllerSettings settings, Optional<StabilityMargins> margins,
                              boolean sampledMargins, Optional<SampledMargins> sampled,
                              Optional<ResponseMetrics> setpointResponse, Optional<LoadResponse> loadResponse) {

    /** Checks that nothing is null. */
    public TuningCandidate {
        Objects.requireNonNull(tuning, "tuning");
        Objects.requireNonNull(settings, "settings");
        Objects.requireNonNull(margins, "margins");
        Objects.requireNonNull(sampled, "sampled");
        Objects.requireNonNull(setpointResponse, "setpointResponse");
        Objects.requireNonNull(loadResponse, "loadResponse");
    }

    /**
     * Whether the sampled closed loop is stable (every pole inside the unit circle); empty when there
     * is no plant to judge it on. An unstable candidate must never be offered as a choice.
     */
    public Optional<Boolean> stable() {
        return sampled.map(SampledMargins::stable);
    }

    /** The gains in ideal form. */
    public IdealGains ideal() {
        return tuning.gains();
    }

    /** The gains in parallel form. */
    public ParallelGains parallel() {
        return tuning.gains().toParallel();
    }

    /** The gains in series form, empty when none exists (Ti &lt; 4·Td). */
    public Optional<SeriesGains> series() {
        try {
            return Optional.of(tuning.gains().toSeries());
        } catch (InvalidSettingException e) {
            return Optional.empty();
        }
    }

    /**
     * The response to a load step.
     *
     * @param iae           ∫|r − y| dt after the step, process units·s
     * @param peakDeviation the largest |r − y| after the step
     */
    public record LoadResponse(double iae, double peakDeviation) {
    }
}
