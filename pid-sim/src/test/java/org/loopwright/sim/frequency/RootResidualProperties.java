package org.loopwright.sim.frequency;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Assume;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.complex.Complex;
import org.hipparchus.exception.MathIllegalStateException;

/**
 * The check that accepts a polynomial's roots runs Horner's rule in two doubles instead of a {@link Complex}
 * per step: its figure must be exactly (bit for bit) the one {@link Complex#multiply(Complex)} and
 * {@link Complex#add(double)} give, since it decides which of two root sets a sweep reports. Checked on random
 * polynomials at their own roots (the residual's real use: rounding-sized) and at random points (large values),
 * and at candidates that are not finite.
 */
class RootResidualProperties {

    @Provide
    Arbitrary<List<Double>> coefficients() {
        return Arbitraries.doubles().between(-10.0, 10.0).list().ofMinSize(2).ofMaxSize(16)
                .filter(c -> Math.abs(c.get(0)) > 1e-3 && Math.abs(c.get(c.size() - 1)) > 1e-3);
    }

    @Provide
    Arbitrary<Double> parts() {
        return Arbitraries.doubles().between(-3.0, 3.0);
    }

    @Property(tries = 1000)
    void sameFigureAsComplexArithmeticAtTheRoots(@ForAll("coefficients") List<Double> ascending) {
        double[] c = ascending.stream().mapToDouble(Double::doubleValue).toArray();
        Complex[] roots;
        try {
            roots = PolynomialRoots.of(new PolynomialFunction(c)).toArray(Complex[]::new);
        } catch (MathIllegalStateException noConvergence) {
            // the Schur iteration (Hipparchus' and its port alike) gives up on a few random polynomials:
            // no roots to check at
            roots = null;
        }
        Assume.that(roots != null);
        assertThat(PolynomialRoots.worstResidual(c, roots)).isEqualTo(byComplex(c, roots));
    }

    @Property(tries = 1000)
    void sameFigureAsComplexArithmeticAnywhere(@ForAll("coefficients") List<Double> ascending,
            @ForAll("parts") double re, @ForAll("parts") double im) {
        double[] c = ascending.stream().mapToDouble(Double::doubleValue).toArray();
        Complex[] at = {new Complex(re, im), new Complex(re * 1e20, im), new Complex(re, im * 1e200)};
        assertThat(PolynomialRoots.worstResidual(c, at)).isEqualTo(byComplex(c, at));
    }

    @Property(tries = 100)
    void aCandidateThatIsNotFiniteFailsTheCheck(@ForAll("coefficients") List<Double> ascending) {
        double[] c = ascending.stream().mapToDouble(Double::doubleValue).toArray();
        for (Complex z : new Complex[] {Complex.NaN, Complex.INF, new Complex(Double.NaN, 0.5)}) {
            assertThat(PolynomialRoots.worstResidual(c, new Complex[] {z})).isEqualTo(byComplex(c, new Complex[] {z}))
                    .isEqualTo(Double.POSITIVE_INFINITY);
        }
    }

    /** The residual as the check first read it: one Complex per Horner step. */
    private static double byComplex(double[] ascending, Complex[] candidates) {
        double worst = 0.0;
        for (Complex z : candidates) {
            Complex value = Complex.ZERO;
            for (int i = ascending.length - 1; i >= 0; i--) {
                value = value.multiply(z).add(ascending[i]);
            }
            double scale = 0.0;
            double power = 1.0;
            for (double coefficient : ascending) {
                scale += Math.abs(coefficient) * power;
                power *= z.norm();
            }
            double relative = value.norm() / scale;
            worst = Double.isNaN(relative) ? Double.POSITIVE_INFINITY : Math.max(worst, relative);
        }
        return worst;
    }
}
