package org.loopwright.sim.design;

import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;

/**
 * The recommended gains with one integral (and derivative) method at the design's period: the
 * sampled loop's phase margin, Ms and stability.
 *
 * @param integralMethod    the integral's method
 * @param derivativeMethod  the derivative's method, null for PI
 * @param chosen            whether this is the design's own pair
 * @param phaseMarginDegrees PM, NaN without a gain crossover or when not applicable
 * @param ms                Ms, NaN when not applicable
 * @param stable            whether every closed-loop pole lies inside the unit circle
 * @param note              why the pair does not apply, or empty
 */
public record DiscretisationCheck(IntegralMethod integralMethod, DerivativeMethod derivativeMethod, boolean chosen,
        double phaseMarginDegrees, double ms, boolean stable, String note) {
}
