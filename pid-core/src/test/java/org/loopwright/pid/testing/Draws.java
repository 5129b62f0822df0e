package org.loopwright.pid.testing;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;

/** Value distributions the property tests share, as jqwik arbitraries (shrinkable, with edge cases). */
public final class Draws {

    private Draws() {
    }

    /**
     * A value log-uniform between two positive bounds: every decade equally likely, for gains and
     * times that span several.
     *
     * @param min the smallest value, &gt; 0
     * @param max the largest value
     * @return an arbitrary that shrinks towards {@code min}
     */
    public static Arbitrary<Double> logUniform(double min, double max) {
        return Arbitraries.doubles().between(0.0, 1.0).ofScale(6).map(u -> min * Math.pow(max / min, u));
    }

    /**
     * Zero a quarter of the time, else log-uniform between two positive bounds (a term switched off).
     *
     * @param min the smallest non-zero value, &gt; 0
     * @param max the largest value
     * @return an arbitrary that shrinks towards zero
     */
    public static Arbitrary<Double> zeroOrLogUniform(double min, double max) {
        return Arbitraries.frequencyOf(net.jqwik.api.Tuple.of(1, Arbitraries.just(0.0)),
                net.jqwik.api.Tuple.of(3, logUniform(min, max)));
    }
}
