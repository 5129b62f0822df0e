package org.loopwright.sim.frequency;

import java.util.List;

import org.hipparchus.complex.Complex;

/**
 * The margins of a sampled loop, from its frequency response on 0 &lt; ω &le; π/h, and its
 * closed-loop poles, which decide stability: stable when every pole lies strictly inside the unit
 * circle (Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i>, 3rd ed., §3.2).
 * Thread-safe: immutable.
 *
 * @param margins          the margins of L(e^{jωh})
 * @param closedLoopPoles  the roots of the closed-loop characteristic polynomial
 */
public record SampledMargins(StabilityMargins margins, List<Complex> closedLoopPoles) {

    /** Copies the poles. */
    public SampledMargins {
        closedLoopPoles = List.copyOf(closedLoopPoles);
    }

    /** The largest pole magnitude (the spectral radius of the closed loop). */
    public double largestPoleMagnitude() {
        return closedLoopPoles.stream().mapToDouble(Complex::norm).max().orElse(0.0);
    }

    /** Whether every closed-loop pole lies strictly inside the unit circle. */
    public boolean stable() {
        return largestPoleMagnitude() < 1.0;
    }
}
