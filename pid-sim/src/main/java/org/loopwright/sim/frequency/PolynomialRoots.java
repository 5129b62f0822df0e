package org.loopwright.sim.frequency;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.complex.Complex;
import org.hipparchus.util.FastMath;
import org.hipparchus.util.MathArrays;

/**
 * All roots of a real polynomial, as the eigenvalues of its companion matrix ({@link SchurEigenvalues}: to the
 * bit those of Hipparchus' non-symmetric eigen-decomposition). Exact zero roots (vanishing low-order
 * coefficients, as a pure delay z^d gives) are split off first, exactly.
 */
final class PolynomialRoots {

    /** Largest |p(z)| accepted for a root, relative to Σ|c_i|·|z|^i (double rounding is ~1e-16 of it). */
    private static final double ROOT_RESIDUAL = 1e-9;

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
        double[][] companion = new double[m][m];
        for (int j = 0; j < m; j++) {
            companion[0][j] = -c[degree - 1 - j] / c[degree];
            if (j > 0) {
                companion[j][j - 1] = 1.0;
            }
        }
        double[] reduced = new double[m + 1];
        System.arraycopy(c, lowest, reduced, 0, m + 1);
        // Hipparchus' decomposition can settle on wrong eigenvalues for some companion matrices (seen:
        // a cubic with roots -1, 0.689, -0.205 came out as -0.156 +/- 0.844i, -0.205); the candidates
        // are checked against the polynomial itself, and when they fail the transpose (same eigenvalues,
        // another path through the iteration) is tried and the better of the two kept
        Complex[] found = SchurEigenvalues.of(companion);
        double residual = worstResidual(reduced, found);
        if (residual > ROOT_RESIDUAL) {
            Complex[] again = SchurEigenvalues.of(transpose(companion));
            if (worstResidual(reduced, again) < residual) {
                found = again;
            }
        }
        roots.addAll(Arrays.asList(found));
        return roots;
    }

    /** The transpose of a square matrix: the same eigenvalues, another path through the iteration. */
    private static double[][] transpose(double[][] matrix) {
        int n = matrix.length;
        double[][] transposed = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                transposed[j][i] = matrix[i][j];
            }
        }
        return transposed;
    }

    /**
     * The largest |p(z)| over the candidates, relative to the size of the terms Σ|c_i|·|z|^i. Horner's rule in
     * two doubles, each step as {@link Complex#multiply(Complex)} then {@link Complex#add(double)} take it (the
     * same {@link MathArrays#linearCombination} products, so the same figure) without a {@link Complex} per step:
     * a sweep asks for the poles of every run, and those were a sixth of a run's fixed cost. A value that is not
     * finite, which {@link Complex} would carry as NaN or infinity, gives an infinite residual either way.
     */
    static double worstResidual(double[] ascending, Complex[] candidates) {
        double worst = 0.0;
        for (Complex z : candidates) {
            double x = z.getReal();
            double y = z.getImaginary();
            double re = 0.0;
            double im = 0.0;
            for (int i = ascending.length - 1; i >= 0; i--) {
                double product = MathArrays.linearCombination(re, x, -im, y);
                im = MathArrays.linearCombination(re, y, im, x);
                re = product + ascending[i];
            }
            double size = z.norm();
            double scale = 0.0;
            double power = 1.0;
            for (double coefficient : ascending) {
                scale += Math.abs(coefficient) * power;
                power *= size;
            }
            double relative = Double.isFinite(re) && Double.isFinite(im) ? FastMath.hypot(re, im) / scale
                    : Double.POSITIVE_INFINITY;
            worst = Double.isNaN(relative) ? Double.POSITIVE_INFINITY : Math.max(worst, relative);
        }
        return worst;
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
