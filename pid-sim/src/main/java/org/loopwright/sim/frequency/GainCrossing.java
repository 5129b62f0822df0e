package org.loopwright.sim.frequency;

/**
 * A frequency where the loop gain |L| crosses 1, with the phase margin there: the angle by which
 * L lies above the negative real axis, in (−180°, 180°].
 *
 * @param frequencyRadPerSecond ω where |L(ω)| = 1
 * @param phaseMarginDegrees    180° + arg L(ω), wrapped to (−180°, 180°]
 */
public record GainCrossing(double frequencyRadPerSecond, double phaseMarginDegrees) {

    /**
     * The extra dead time that would rotate this crossing onto −1: PM/ω in seconds (phase margin in
     * radians), and 0 when the phase margin is not positive (Åström &amp; Murray, <i>Feedback Systems</i>,
     * 2nd ed., §10.3).
     */
    public double delayMarginSeconds() {
        return phaseMarginDegrees <= 0.0 ? 0.0 : Math.toRadians(phaseMarginDegrees) / frequencyRadPerSecond;
    }
}
