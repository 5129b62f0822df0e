package org.loopwright.sim.frequency;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Comparator;
import java.util.List;

import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;

class PolynomialRootsTest {

    /**
     * The characteristic polynomial of a PI loop on a sampled first-order-plus-dead-time plant scaled by
     * its gain margin at the Nyquist frequency (found by a jqwik run of MarginProperties): Hipparchus'
     * decomposition of its companion matrix alone returns -0.156 +/- 0.844i and -0.205. Reference roots
     * from NumPy's numpy.roots on the same coefficients: -1, 0.68882139, -0.2054394.
     */
    @Test
    void rootsOfACubicTheEigenDecompositionAloneGetsWrong() {
        PolynomialFunction p = new PolynomialFunction(new double[] {
            -0.14151105601457406, -0.6248930404008958, 0.5166180156136786, 1.0});

        List<Complex> roots = PolynomialRoots.of(p);

        assertThat(roots).hasSize(3);
        List<Complex> sorted = roots.stream().sorted(Comparator.comparingDouble(Complex::getReal)).toList();
        assertThat(sorted.get(0).subtract(new Complex(-1.0)).norm()).isLessThan(1e-9);
        assertThat(sorted.get(1).subtract(new Complex(-0.2054394)).norm()).isLessThan(1e-7);
        assertThat(sorted.get(2).subtract(new Complex(0.68882139)).norm()).isLessThan(1e-7);
    }

    /** Exact zero roots are split off: z²·(z − 0.5) has roots 0, 0, 0.5 (by inspection). */
    @Test
    void zeroRootsOfADelayAreExact() {
        List<Complex> roots = PolynomialRoots.of(new PolynomialFunction(new double[] {0.0, 0.0, -0.5, 1.0}));

        assertThat(roots).hasSize(3);
        assertThat(roots.subList(0, 2)).containsOnly(Complex.ZERO);
        assertThat(roots.get(2).subtract(new Complex(0.5)).norm()).isLessThan(1e-12);
    }

    /**
     * Source: analytic. (z − 0.5)(z + 0.25)(z² − z + 0.5) = z⁴ − 1.25z³ + 0.625z² − 0.0625 has the roots 0.5,
     * −0.25 and 0.5 ± 0.5i.
     */
    @Test
    void rootsOfAQuarticWithKnownRoots() {
        List<Complex> roots = PolynomialRoots.of(
                new PolynomialFunction(new double[] {-0.0625, 0.0, 0.625, -1.25, 1.0}));

        assertThat(roots).hasSize(4);
        for (Complex known : List.of(new Complex(0.5), new Complex(-0.25), new Complex(0.5, 0.5),
                new Complex(0.5, -0.5))) {
            assertThat(roots).anySatisfy(root -> assertThat(root.subtract(known).norm()).isLessThan(1e-14));
        }
    }
}
