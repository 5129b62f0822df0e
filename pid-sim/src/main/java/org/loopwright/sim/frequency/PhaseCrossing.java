package org.loopwright.sim.frequency;

/**
 * A frequency where the loop L crosses the negative real axis (phase −180° modulo 360°), with the
 * gain margin there: the factor by which the loop gain may grow before the Nyquist curve passes
 * through −1. A margin below 1 means the loop is only conditionally stable at that crossing: it
 * fails if the gain falls by that factor.
 *
 * @param frequencyRadPerSecond ω where L(ω) is real and negative
 * @param gainMargin            1/|L(ω)|
 */
public record PhaseCrossing(double frequencyRadPerSecond, double gainMargin) {

    /** The gain margin in decibels, 20·log10(gain margin). */
    public double gainMarginDb() {
        return 20.0 * Math.log10(gainMargin);
    }
}
