package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.BlockRealMatrix;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;

/**
 * Each plain-array operation equals, bit for bit, the Hipparchus 3.1 operation on the storage it is named
 * after, for sizes 1 to 12 (so the block sums take one, two and three groups of four), with exact zeros of
 * either sign among the entries.
 */
class HipparchusArithmeticProperties {

    /** Three n×n matrices' and one vector's entries, and a scalar, in one flat array: a, b, v, c. */
    @Provide
    Arbitrary<double[]> operands() {
        Arbitrary<Double> entries = Arbitraries.frequencyOf(
                Tuple.of(6, Arbitraries.randomValue(random -> 20.0 * random.nextDouble() - 10.0)),
                Tuple.of(1, Arbitraries.of(0.0, -0.0)));
        return Arbitraries.integers().between(1, 12)
                .flatMap(n -> entries.array(double[].class).ofSize(2 * n * n + n + 1));
    }

    @Property(tries = 1000)
    void operationsEqualHipparchusToTheBit(@ForAll("operands") double[] operands) {
        int n = dimension(operands.length);
        double[] a = Arrays.copyOfRange(operands, 0, n * n);
        double[] b = Arrays.copyOfRange(operands, n * n, 2 * n * n);
        double[] v = Arrays.copyOfRange(operands, 2 * n * n, 2 * n * n + n);
        double c = operands[operands.length - 1];
        RealMatrix rowsA = new Array2DRowRealMatrix(rows(a, n));
        RealMatrix rowsB = new Array2DRowRealMatrix(rows(b, n));
        RealMatrix blockA = new BlockRealMatrix(rows(a, n));
        RealMatrix blockB = new BlockRealMatrix(rows(b, n));

        assertThat(bits(HipparchusArithmetic.rowsTimes(a, b, n))).containsExactly(bits(rowsA.multiply(rowsB)));
        assertThat(bits(HipparchusArithmetic.blockTimesBlock(a, b, n)))
                .containsExactly(bits(blockA.multiply(blockB)));
        assertThat(bits(HipparchusArithmetic.blockTimesRows(a, b, n)))
                .containsExactly(bits(blockA.multiply(rowsB)));
        assertThat(bits(HipparchusArithmetic.rowsTimesVector(a, v, n))).containsExactly(bits(rowsA.operate(v)));
        assertThat(bits(HipparchusArithmetic.blockTimesVector(a, v, n))).containsExactly(bits(blockA.operate(v)));
        assertThat(Double.doubleToRawLongBits(HipparchusArithmetic.dotProduct(a, b)))
                .isEqualTo(Double.doubleToRawLongBits(new ArrayRealVector(a).dotProduct(new ArrayRealVector(b))));
        assertThat(Double.doubleToRawLongBits(HipparchusArithmetic.trace(a, n)))
                .isEqualTo(Double.doubleToRawLongBits(rowsA.getTrace()));
        double[] shifted = a.clone();
        HipparchusArithmetic.addScaledIdentity(shifted, n, c);
        assertThat(bits(shifted))
                .containsExactly(bits(rowsA.add(MatrixUtils.createRealIdentityMatrix(n).scalarMultiply(c))));
    }

    private static int dimension(int length) {
        int n = 1;
        while (2 * n * n + n + 1 != length) {
            n++;
        }
        return n;
    }

    private static double[][] rows(double[] matrix, int n) {
        double[][] rows = new double[n][];
        for (int i = 0; i < n; i++) {
            rows[i] = Arrays.copyOfRange(matrix, i * n, (i + 1) * n);
        }
        return rows;
    }

    private static long[] bits(RealMatrix matrix) {
        int n = matrix.getRowDimension();
        double[] flat = new double[n * matrix.getColumnDimension()];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < matrix.getColumnDimension(); j++) {
                flat[i * matrix.getColumnDimension() + j] = matrix.getEntry(i, j);
            }
        }
        return bits(flat);
    }

    private static long[] bits(double[] values) {
        long[] bits = new long[values.length];
        for (int i = 0; i < values.length; i++) {
            bits[i] = Double.doubleToRawLongBits(values[i]);
        }
        return bits;
    }
}
