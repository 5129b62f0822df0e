package org.loopwright.sim.frequency;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;
import java.util.Random;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Assume;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.complex.Complex;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.exception.MathRuntimeException;
import org.hipparchus.linear.EigenDecompositionNonSymmetric;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.SchurTransformer;
import org.hipparchus.util.FastMath;
import org.hipparchus.util.Precision;

/**
 * The poles are read from a real Schur form computed on plain arrays: the eigenvalues must be exactly (bit for
 * bit: {@link Complex#equals} compares the parts as {@link Double#equals} does) the ones Hipparchus 3.1 gives,
 * checked against its full non-symmetric eigen-decomposition on the companion matrices the pole computation
 * builds, and against its {@link SchurTransformer} on general square matrices (the transpose retry feeds it
 * transposed companions), where it must also fail where Hipparchus fails.
 */
class SchurEigenvaluesProperties {

    @Provide
    Arbitrary<List<Double>> coefficients() {
        return Arbitraries.doubles().between(-10.0, 10.0).list().ofMinSize(2).ofMaxSize(16)
                .filter(c -> Math.abs(c.get(0)) > 1e-3 && Math.abs(c.get(c.size() - 1)) > 1e-3);
    }

    /**
     * Source: Hipparchus 3.1 {@link EigenDecompositionNonSymmetric#getEigenvalues()}, on companion matrices of
     * random polynomials with non-zero lowest and highest coefficients (the pole computation splits exact zero
     * roots off first).
     */
    @Property(tries = 500)
    void sameEigenvaluesAsTheFullDecomposition(@ForAll("coefficients") List<Double> ascending) {
        int m = ascending.size() - 1;
        double lead = ascending.get(m);
        double[][] companion = new double[m][m];
        for (int j = 0; j < m; j++) {
            companion[0][j] = -ascending.get(m - 1 - j) / lead;
            if (j > 0) {
                companion[j][j - 1] = 1.0;
            }
        }
        Complex[] full;
        try {
            full = new EigenDecompositionNonSymmetric(MatrixUtils.createRealMatrix(companion)).getEigenvalues();
        } catch (MathRuntimeException noEigenvectors) {
            // the full decomposition fails on some defective matrices (repeated roots) in its eigenvector step,
            // which the Schur reading does not take: nothing to compare with
            full = null;
        }
        Assume.that(full != null);
        assertThat(SchurEigenvalues.of(companion)).containsExactly(full);
    }

    /**
     * Square matrices of size 1 to 16: dense with exact zeros and small integers among the entries, integer
     * matrices (often singular, with repeated eigenvalues), triangular ones with repeated diagonal values
     * hidden by a permutation similarity (exact in floating point), and companions and transposed companions
     * of polynomials with a repeated root.
     */
    @Provide
    Arbitrary<double[][]> squareMatrices() {
        Arbitrary<Double> entries = Arbitraries.frequencyOf(
                Tuple.of(6, Arbitraries.doubles().between(-10.0, 10.0)),
                Tuple.of(2, Arbitraries.just(0.0)),
                Tuple.of(1, Arbitraries.integers().between(-3, 3).map(Integer::doubleValue)));
        Arbitrary<Integer> sizes = Arbitraries.integers().between(1, 16);
        Arbitrary<double[][]> dense = sizes.flatMap(n -> entries.array(double[].class).ofSize(n)
                .array(double[][].class).ofSize(n));
        Arbitrary<double[][]> integers = sizes.flatMap(n -> Arbitraries.integers().between(-1, 1)
                .map(Integer::doubleValue).array(double[].class).ofSize(n).array(double[][].class).ofSize(n));
        Arbitrary<double[][]> repeatedDiagonal = Combinators.combine(dense,
                Arbitraries.of(0.0, 0.5, -1.0, 2.0).list().ofSize(3), Arbitraries.longs())
                .as(SchurEigenvaluesProperties::triangularWithRepeatsPermuted);
        Arbitrary<double[][]> repeatedRoot = Combinators.combine(coefficients(),
                Arbitraries.doubles().between(-2.0, 2.0), Arbitraries.integers().between(2, 4),
                Arbitraries.of(true, false))
                .as(SchurEigenvaluesProperties::companionWithRepeatedRoot)
                .filter(c -> c.length <= 16);
        return Arbitraries.oneOf(dense, integers, repeatedDiagonal, repeatedRoot);
    }

    /** Source: Hipparchus 3.1 {@link SchurTransformer#getT()}, its 1×1 and 2×2 blocks read as before the port. */
    @Property(tries = 1000)
    void sameEigenvaluesAsHipparchusSchurForm(@ForAll("squareMatrices") double[][] matrix) {
        double[][] before = copy(matrix);
        Complex[] expected;
        try {
            expected = readTheHipparchusWay(matrix);
        } catch (MathIllegalStateException noConvergence) {
            assertThatThrownBy(() -> SchurEigenvalues.of(matrix))
                    .isInstanceOf(MathIllegalStateException.class)
                    .hasMessage(noConvergence.getMessage());
            return;
        }
        assertThat(SchurEigenvalues.of(matrix)).containsExactly(expected);
        assertThat(matrix).isDeepEqualTo(before);
    }

    /** What PolynomialRoots did before the port: Hipparchus' Schur form, the blocks read with its norm test. */
    private static Complex[] readTheHipparchusWay(double[][] data) {
        RealMatrix matrix = MatrixUtils.createRealMatrix(data);
        double epsilon = EigenDecompositionNonSymmetric.DEFAULT_EPSILON;
        double[][] t = new SchurTransformer(matrix, epsilon).getT().getData();
        double negligible = matrix.getNorm1() * epsilon;
        Complex[] values = new Complex[t.length];
        for (int i = 0; i < t.length; i++) {
            if (i == t.length - 1 || Precision.equals(t[i + 1][i], 0.0, negligible)) {
                values[i] = new Complex(t[i][i]);
            } else {
                double x = t[i + 1][i + 1];
                double p = 0.5 * (t[i][i] - x);
                double z = FastMath.sqrt(FastMath.abs(p * p + t[i + 1][i] * t[i][i + 1]));
                values[i] = new Complex(x + p, z);
                values[++i] = new Complex(x + p, -z);
            }
        }
        return values;
    }

    /** Upper triangle of {@code upper}, diagonal cycling through {@code diagonal}, rows and columns permuted. */
    private static double[][] triangularWithRepeatsPermuted(double[][] upper, List<Double> diagonal, long seed) {
        int n = upper.length;
        double[][] triangular = new double[n][n];
        for (int i = 0; i < n; i++) {
            triangular[i][i] = diagonal.get(i % diagonal.size());
            System.arraycopy(upper[i], i + 1, triangular[i], i + 1, n - i - 1);
        }
        int[] order = new Random(seed).ints(0, n).distinct().limit(n).toArray();
        double[][] permuted = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                permuted[i][j] = triangular[order[i]][order[j]];
            }
        }
        return permuted;
    }

    /** The companion (or its transpose) of the polynomial times (z - root)^power. */
    private static double[][] companionWithRepeatedRoot(List<Double> ascending, double root, int power,
            boolean transposed) {
        PolynomialFunction p = new PolynomialFunction(ascending.stream().mapToDouble(Double::doubleValue).toArray());
        for (int k = 0; k < power; k++) {
            p = p.multiply(new PolynomialFunction(new double[] {-root, 1.0}));
        }
        double[] c = p.getCoefficients();
        int m = c.length - 1;
        double[][] companion = new double[m][m];
        for (int j = 0; j < m; j++) {
            companion[0][j] = -c[m - 1 - j] / c[m];
            if (j > 0) {
                companion[j][j - 1] = 1.0;
            }
        }
        if (!transposed) {
            return companion;
        }
        double[][] flipped = new double[m][m];
        for (int i = 0; i < m; i++) {
            for (int j = 0; j < m; j++) {
                flipped[j][i] = companion[i][j];
            }
        }
        return flipped;
    }

    private static double[][] copy(double[][] matrix) {
        double[][] copy = new double[matrix.length][];
        for (int i = 0; i < matrix.length; i++) {
            copy[i] = matrix[i].clone();
        }
        return copy;
    }
}
