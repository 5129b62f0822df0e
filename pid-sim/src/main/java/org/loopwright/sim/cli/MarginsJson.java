package org.loopwright.sim.cli;

import java.util.List;
import java.util.Optional;

import com.fasterxml.jackson.annotation.JsonUnwrapped;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.frequency.GainCrossing;
import org.loopwright.sim.frequency.GainRange;
import org.loopwright.sim.frequency.PhaseCrossing;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.report.JsonOutput;

/**
 * {@code margins --json}: records written by {@link JsonOutput} (snake_case keys, null for a figure
 * that does not exist or apply; frequencies in rad/s, times in s, phase in degrees).
 */
final class MarginsJson {

    private MarginsJson() {
    }

    /**
     * The margins of one loop, continuous or sampled.
     *
     * @param gainMargin     the smallest gain margin (null when the phase never reaches −180°)
     * @param gainMarginDb   the same in dB
     * @param phaseCrossover its frequency
     * @param phaseMarginDeg the smallest phase margin (null when |L| never crosses 1)
     * @param gainCrossover  its frequency
     * @param ms             the sensitivity peak
     * @param msFrequency    its frequency
     * @param mt             the complementary sensitivity peak
     * @param mtFrequency    its frequency
     * @param delayMargin    the delay margin
     * @param phaseCrossings every −180° crossing
     * @param gainCrossings  every |L| = 1 crossing
     */
    record Margins(double gainMargin, double gainMarginDb, double phaseCrossover, double phaseMarginDeg,
            double gainCrossover, double ms, double msFrequency, double mt, double mtFrequency, double delayMargin,
            List<PhaseCrossingJson> phaseCrossings, List<GainCrossingJson> gainCrossings) {

        static Margins of(StabilityMargins m, boolean meaningful) {
            Optional<PhaseCrossing> phase = m.phaseCrossover();
            Optional<GainCrossing> gain = m.gainCrossover();
            double nan = Double.NaN;
            return new Margins(phase.map(PhaseCrossing::gainMargin).orElse(nan),
                    phase.map(PhaseCrossing::gainMarginDb).orElse(nan),
                    phase.map(PhaseCrossing::frequencyRadPerSecond).orElse(nan),
                    gain.map(GainCrossing::phaseMarginDegrees).orElse(nan),
                    gain.map(GainCrossing::frequencyRadPerSecond).orElse(nan),
                    meaningful ? m.sensitivityPeak().value() : nan,
                    meaningful ? m.sensitivityPeak().frequencyRadPerSecond() : nan,
                    meaningful ? m.complementaryPeak().value() : nan,
                    meaningful ? m.complementaryPeak().frequencyRadPerSecond() : nan,
                    meaningful ? m.delayMarginSeconds().orElse(nan) : nan,
                    m.phaseCrossings().stream().map(c -> new PhaseCrossingJson(c.frequencyRadPerSecond(),
                            c.gainMargin(), c.gainMarginDb())).toList(),
                    m.gainCrossings().stream().map(c -> new GainCrossingJson(c.frequencyRadPerSecond(),
                            c.phaseMarginDegrees(), c.delayMarginSeconds())).toList());
        }
    }

    /** A −180° crossing: its frequency and the gain margin there. */
    record PhaseCrossingJson(double frequency, double gainMargin, double gainMarginDb) {
    }

    /** A |L| = 1 crossing: its frequency, the phase margin and the delay margin there. */
    record GainCrossingJson(double frequency, double phaseMarginDeg, double delayMargin) {
    }

    /**
     * The sampled loop: its margins (Ms, Mt and the delay margin null when the loop is unstable, with
     * the note saying why) and what decides them.
     *
     * @param margins              the margins, written at this object's level
     * @param stable               whether every closed-loop pole is inside the unit circle
     * @param sensorDelaySamples   whole samples of measurement delay in the loop
     * @param note                 why some figures are null, or null
     * @param stableGainRange      the loop-gain factors that keep the loop stable, or null
     * @param lowerGainMargin      the factor below which a stable loop goes unstable, or null
     * @param largestPoleMagnitude the largest closed-loop pole's |z|
     * @param samplePeriod         h, s
     * @param integralMethod       the controller file's word, null without integral action
     * @param derivativeMethod     the controller file's word, null without derivative action
     */
    record Sampled(@JsonUnwrapped Margins margins, boolean stable, int sensorDelaySamples, String note,
            GainRangeJson stableGainRange, double lowerGainMargin, double largestPoleMagnitude, double samplePeriod,
            String integralMethod, String derivativeMethod) {
    }

    /** A range of loop-gain factors. */
    record GainRangeJson(double low, double high) {
    }

    /** One loop: continuous and sampled. */
    record Loop(Margins continuous, Sampled sampled) {

        static Loop of(ControllerSettings settings, int sensorDelaySamples, StabilityMargins continuous,
                SampledMargins sampled, Optional<GainRange> range, String notMeaningful) {
            boolean stable = sampled.stable();
            return new Loop(Margins.of(continuous, true), new Sampled(Margins.of(sampled.margins(), stable), stable,
                    sensorDelaySamples, stable ? null : notMeaningful,
                    range.map(r -> new GainRangeJson(r.low(), r.high())).orElse(null),
                    stable && range.isPresent() && range.get().low() > 0.0 ? range.get().low() : Double.NaN,
                    sampled.largestPoleMagnitude(), settings.samplePeriodSeconds(),
                    settings.parallelGains().integralGain() > 0.0
                            ? ControllerFile.INTEGRAL_METHODS.word(settings.integralMethod()) : null,
                    settings.parallelGains().derivativeGain() > 0.0
                            ? ControllerFile.DERIVATIVE_METHODS.word(settings.derivativeMethod()) : null));
        }
    }

    /** A cascade: the inner loop alone and the outer loop with the inner one closed. */
    record Cascade(Loop inner, Loop outer) {
    }
}
