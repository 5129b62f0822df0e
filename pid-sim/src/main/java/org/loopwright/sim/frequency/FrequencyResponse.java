package org.loopwright.sim.frequency;

import org.hipparchus.complex.Complex;

/**
 * A linear system's response to a sinusoid: the complex gain at an angular frequency. For a
 * continuous system this is G(jω); for a sampled one H(e^{jωh}), meaningful up to the Nyquist
 * frequency π/h.
 */
@FunctionalInterface
public interface FrequencyResponse {

    /** The complex gain at {@code omegaRadPerSecond} (&gt; 0). */
    Complex at(double omegaRadPerSecond);

    /** This response times another (two blocks in series). */
    default FrequencyResponse times(FrequencyResponse other) {
        return omega -> at(omega).multiply(other.at(omega));
    }

    /** This response times a real constant (a loop gain or the controller's action sign). */
    default FrequencyResponse times(double factor) {
        return omega -> at(omega).multiply(factor);
    }
}
