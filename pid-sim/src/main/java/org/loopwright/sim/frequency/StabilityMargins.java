package org.loopwright.sim.frequency;

import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The robustness of one loop L: every crossing of the negative real axis and of the unit circle,
 * each refined by a root finder, and the peaks of the sensitivity S = 1/(1 + L) and the
 * complementary sensitivity T = L/(1 + L).
 *
 * <p>The headline values are the worst ones: the smallest gain margin and the smallest phase margin.
 * Common practice (Åström &amp; Hägglund, <i>Advanced PID Control</i>, 2006, §4.5, from memory):
 * Ms between 1.4 and 2, gain margin above 2, phase margin above 30°–45°.
 * Thread-safe: immutable.
 *
 * @param phaseCrossings           every phase crossover whose gain margin is within 20 dB of the smallest, by
 *                                 rising frequency (a dead time makes endless ones of ever larger margin)
 * @param gainCrossings            every gain crossover, by rising frequency
 * @param sensitivityPeak          Ms and its frequency
 * @param complementaryPeak        Mt and its frequency
 */
public record StabilityMargins(List<PhaseCrossing> phaseCrossings, List<GainCrossing> gainCrossings,
        Peak sensitivityPeak, Peak complementaryPeak) {

    /** Copies the lists. */
    public StabilityMargins {
        phaseCrossings = List.copyOf(phaseCrossings);
        gainCrossings = List.copyOf(gainCrossings);
    }

    /** The phase crossover with the smallest gain margin; empty when the phase never reaches −180°. */
    public Optional<PhaseCrossing> phaseCrossover() {
        return phaseCrossings.stream().min(Comparator.comparingDouble(PhaseCrossing::gainMargin));
    }

    /** The gain crossover with the smallest phase margin; empty when |L| never crosses 1. */
    public Optional<GainCrossing> gainCrossover() {
        return gainCrossings.stream().min(Comparator.comparingDouble(GainCrossing::phaseMarginDegrees));
    }

    /**
     * The smallest extra dead time that makes the loop reach −1: the least PM/ω over all gain
     * crossovers, 0 when any phase margin is not positive, empty when there is no gain crossover.
     */
    public OptionalDouble delayMarginSeconds() {
        return gainCrossings.stream().mapToDouble(GainCrossing::delayMarginSeconds).min();
    }
}
