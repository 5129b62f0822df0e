package org.loopwright.pid.testing;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;

/** Value distributions the property tests share, as jqwik arbitraries (shrinkable, with edge cases). */
public final class Draws {

    private Draws() {
    }

    /** Grid points across a range: fine enough for any property here, and integers draw fast. */
    private static final int GRID = 1 << 20;

    /**
     * A value uniform between two bounds on a grid of 2²⁰ steps. Drawn as an integer and scaled:
     * jqwik's own double arbitrary goes through BigDecimal and costs several times more per value,
     * which the 10⁵ values of a 1,000-try run of operation sequences feel.
     *
     * @param min the smallest value
     * @param max the largest value
     * @return an arbitrary that shrinks towards the value nearest zero
     */
    public static Arbitrary<Double> between(double min, double max) {
        double step = (max - min) / GRID;
        return Arbitraries.integers().between((int) Math.ceil(min / step), (int) Math.floor(max / step))
                .map(i -> Math.min(max, Math.max(min, i * step)));
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
        return between(0.0, 1.0).map(u -> min * Math.pow(max / min, u));
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
