package org.loopwright.sim.frequency;

/**
 * The largest magnitude of a closed-loop transfer function over frequency and where it occurs.
 * The frequency is 0 when the largest value is approached at steady state (for example |T| → 1
 * in a loop with integral action and no resonance).
 *
 * @param value                 the largest magnitude
 * @param frequencyRadPerSecond where it occurs
 */
public record Peak(double value, double frequencyRadPerSecond) {
}
