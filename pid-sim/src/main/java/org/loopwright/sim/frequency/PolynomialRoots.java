package org.loopwright.sim.frequency;

import java.util.ArrayList;
import java.util.List;

import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.complex.Complex;
import org.hipparchus.linear.EigenDecompositionNonSymmetric;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;

/**
 * All roots of a real polynomial, as the eigenvalues of its companion matrix (Hipparchus'
 * non-symmetric eigen-decomposition). Exact zero roots (vanishing low-order coefficients, as a pure
 * delay z^d gives) are split off first, exactly.
 */
final class PolynomialRoots {

    private PolynomialRoots() {
    }

    /** The roots of {@code polynomial}; none for a constant. */
    static List<Complex> of(PolynomialFunction polynomial) {
        double[] c = polynomial.getCoefficients(); // ascending, highest non-zero (or a lone zero)
        int degree = c.length - 1;
        List<Complex> roots = new ArrayList<>(Math.max(degree, 0));
        int lowest = 0;
        while (lowest < degree && c[lowest] == 0.0) {
            roots.add(Complex.ZERO);
            lowest++;
        }
        int m = degree - lowest;
        if (m == 0) {
            return roots;
        }
        RealMatrix companion = MatrixUtils.createRealMatrix(m, m);
        for (int j = 0; j < m; j++) {
            companion.setEntry(0, j, -c[degree - 1 - j] / c[degree]);
            if (j > 0) {
                companion.setEntry(j, j - 1, 1.0);
            }
        }
        for (Complex root : new EigenDecompositionNonSymmetric(companion).getEigenvalues()) {
            roots.add(root);
        }
        return roots;
    }

    /** The roots of a polynomial given in descending powers (as a transfer function holds it). */
    static List<Complex> ofDescending(double[] descending) {
        double[] ascending = new double[descending.length];
        for (int i = 0; i < descending.length; i++) {
            ascending[i] = descending[descending.length - 1 - i];
        }
        return of(new PolynomialFunction(ascending));
    }
}
