package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import net.jqwik.api.statistics.Statistics;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;

/**
 * The plain-array exponential is Hipparchus 3.1's {@code MatrixUtils.matrixExponential} to the bit (raw
 * bits compared, so even the sign of a zero counts), on random matrices of sizes 1 to 9 (from 8 on, the
 * squarings' block-order sums take a second group of four) whose 1-norms span 1e-4 to 1e3 and so reach
 * every Padé degree and up to seven squarings (branch points θ3…θ13: Higham, "The scaling and
 * squaring method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl. 26(4), 2005, Table
 * 2.3), and on the augmented [[A·t, B·t], [0, 0]] that the exact discretisation builds.
 */
class MatrixExponentialProperties {

    private static final double[] BRANCH_NORMS = {1.495585217958292e-2, 2.539398330063230e-1,
        9.504178996162932e-1, 2.097847961257068};
    private static final int[] BRANCH_DEGREES = {3, 5, 7, 9, 13};

    /** Full-precision entries in [−1, 1], with exact zeros of either sign mixed in. */
    private static Arbitrary<Double> entries() {
        return Arbitraries.frequencyOf(
                Tuple.of(6, Arbitraries.randomValue(random -> 2.0 * random.nextDouble() - 1.0)),
                Tuple.of(1, Arbitraries.of(0.0, -0.0, 1.0)));
    }

    /** 10^e with e uniform in [low, high]: every decade as likely. */
    private static Arbitrary<Double> logUniform(double lowExponent, double highExponent) {
        return Arbitraries.randomValue(random -> Math.pow(10.0,
                lowExponent + (highExponent - lowExponent) * random.nextDouble()));
    }

    @Provide
    Arbitrary<double[]> matrices() {
        return Arbitraries.integers().between(1, 9).flatMap(n -> entries().array(double[].class).ofSize(n * n))
                .flatMap(m -> logUniform(-4.0, 3.0).map(norm -> scaledToNorm(m, norm)));
    }

    @Property(tries = 1000)
    void equalsHipparchusToTheBit(@ForAll("matrices") double[] matrix) {
        int n = (int) Math.round(Math.sqrt(matrix.length));
        Statistics.label("Padé degree").collect(padeDegree(matrix, n));
        Statistics.label("Padé degree").coverage(check -> {
            for (int degree : BRANCH_DEGREES) {
                check.check(degree).count(count -> count >= 20);
            }
        });
        assertThat(rawBits(MatrixExponential.of(matrix, n))).containsExactly(rawBits(hipparchus(matrix, n)));
    }

    @Provide
    Arbitrary<double[]> augmented() {
        Arbitrary<Double> seconds = logUniform(-3.0, 2.0);
        return Arbitraries.integers().between(1, 4).flatMap(order -> Arbitraries.randomValue(random -> {
            // A from a random monic denominator of roots in [−3, 1], in LinearPlant's companion form, and its B
            double[] a = new double[order * order];
            double[] coefficients = {1.0};
            for (int i = 0; i < order; i++) {
                coefficients = DescendingPolynomials.timesLinear(coefficients, -3.0 + 4.0 * random.nextDouble());
            }
            for (int j = 0; j + 1 < order; j++) {
                a[j * order + j + 1] = 1.0;
            }
            for (int j = 0; j < order; j++) {
                a[(order - 1) * order + j] = -coefficients[order - j];
            }
            return a;
        }).flatMap(a -> seconds.map(t -> {
            int size = order + 1;
            double[] m = new double[size * size];
            for (int i = 0; i < order; i++) {
                for (int j = 0; j < order; j++) {
                    m[i * size + j] = a[i * order + j] * t;
                }
                m[i * size + order] = (i == order - 1 ? 1.0 : 0.0) * t;
            }
            return m;
        })));
    }

    @Property(tries = 1000)
    void equalsHipparchusToTheBitOnTheAugmentedHoldMatrix(@ForAll("augmented") double[] matrix) {
        int n = (int) Math.round(Math.sqrt(matrix.length));
        Statistics.label("Padé degree").collect(padeDegree(matrix, n));
        assertThat(rawBits(MatrixExponential.of(matrix, n))).containsExactly(rawBits(hipparchus(matrix, n)));
    }

    private static double[] hipparchus(double[] matrix, int n) {
        double[][] rows = new double[n][];
        for (int i = 0; i < n; i++) {
            rows[i] = Arrays.copyOfRange(matrix, i * n, (i + 1) * n);
        }
        RealMatrix exponential = MatrixUtils.matrixExponential(MatrixUtils.createRealMatrix(rows));
        double[] flat = new double[n * n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                flat[i * n + j] = exponential.getEntry(i, j);
            }
        }
        return flat;
    }

    private static double[] scaledToNorm(double[] matrix, double norm) {
        double current = norm1(matrix, (int) Math.round(Math.sqrt(matrix.length)));
        if (current == 0.0) {
            return matrix;
        }
        double[] scaled = new double[matrix.length];
        for (int k = 0; k < matrix.length; k++) {
            scaled[k] = matrix[k] * (norm / current);
        }
        return scaled;
    }

    private static int padeDegree(double[] matrix, int n) {
        double norm = norm1(matrix, n);
        int branch = 0;
        while (branch < BRANCH_NORMS.length && norm >= BRANCH_NORMS[branch]) {
            branch++;
        }
        return BRANCH_DEGREES[branch];
    }

    private static double norm1(double[] matrix, int n) {
        double largest = 0.0;
        for (int col = 0; col < n; col++) {
            double sum = 0.0;
            for (int row = 0; row < n; row++) {
                sum += Math.abs(matrix[row * n + col]);
            }
            largest = Math.max(largest, sum);
        }
        return largest;
    }

    private static long[] rawBits(double[] values) {
        long[] bits = new long[values.length];
        for (int i = 0; i < values.length; i++) {
            bits[i] = Double.doubleToRawLongBits(values[i]);
        }
        return bits;
    }
}
