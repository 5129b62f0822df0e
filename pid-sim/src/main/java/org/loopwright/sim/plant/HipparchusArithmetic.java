package org.loopwright.sim.plant;

/**
 * Hipparchus 3.1's dense matrix arithmetic on square matrices stored row-major in plain {@code double[]},
 * operation for operation, so each result is equal to the bit to what the Hipparchus objects give.
 *
 * <p>Hipparchus sums a matrix product in one of two orders, by the storage of the matrix on the left:
 * an {@code Array2DRowRealMatrix} (what {@code MatrixUtils.createRealMatrix} makes for small sizes) sums
 * the products of a row and a column one by one from zero; a {@code BlockRealMatrix} (what a QR solve
 * returns) sums them four at a time and adds the sum into a zeroed result. (That last addition, like
 * adding the zeros of c·I off the diagonal, changes no bit of a sum begun at +0, which is never −0.) The
 * methods here are named after that storage. The block ones hold for a matrix within one block
 * ({@link #MAX_BLOCK_DIMENSION} rows and columns); past it Hipparchus tiles the matrix and sums differently.
 *
 * <p>The sums are written as Hipparchus writes them: Java evaluates each {@code +} and {@code *} in
 * source order and never fuses them, so the same expression gives the same bits.
 * Hipparchus is under the Apache License 2.0.
 */
public final class HipparchusArithmetic {

    /** {@code BlockRealMatrix.BLOCK_SIZE}: the largest dimension these block-order methods follow. */
    public static final int MAX_BLOCK_DIMENSION = 52;

    private HipparchusArithmetic() {
    }

    /** a·b with a an {@code Array2DRowRealMatrix} ({@code AbstractRealMatrix.multiply}). */
    public static double[] rowsTimes(double[] a, double[] b, int n) {
        double[] product = new double[n * n];
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                double sum = 0;
                for (int i = 0; i < n; i++) {
                    sum += a[row * n + i] * b[i * n + col];
                }
                product[row * n + col] = sum;
            }
        }
        return product;
    }

    /** a·b with both {@code BlockRealMatrix} ({@code BlockRealMatrix.multiply(BlockRealMatrix)}). */
    public static double[] blockTimesBlock(double[] a, double[] b, int n) {
        double[] product = new double[n * n];
        for (int row = 0; row < n; row++) {
            int rowStart = row * n;
            for (int col = 0; col < n; col++) {
                double sum = 0;
                int i = 0;
                while (i < n - 3) {
                    sum += a[rowStart + i] * b[i * n + col]
                            + a[rowStart + i + 1] * b[(i + 1) * n + col]
                            + a[rowStart + i + 2] * b[(i + 2) * n + col]
                            + a[rowStart + i + 3] * b[(i + 3) * n + col];
                    i += 4;
                }
                while (i < n) {
                    sum += a[rowStart + i] * b[i * n + col];
                    i++;
                }
                product[rowStart + col] = 0.0 + sum; // into the zeroed block
            }
        }
        return product;
    }

    /**
     * a·b with a a {@code BlockRealMatrix} and b an {@code Array2DRowRealMatrix}
     * ({@code BlockRealMatrix.multiply(RealMatrix)}): the sums of {@link #rowsTimes}, one by one, which Hipparchus
     * then adds into a zeroed block, a step that changes no bit of a sum begun at +0.
     */
    public static double[] blockTimesRows(double[] a, double[] b, int n) {
        return rowsTimes(a, b, n);
    }

    /** a·v with a an {@code Array2DRowRealMatrix} ({@code Array2DRowRealMatrix.operate}). */
    public static double[] rowsTimesVector(double[] a, double[] v, int n) {
        double[] product = new double[n];
        for (int row = 0; row < n; row++) {
            double sum = 0;
            for (int i = 0; i < n; i++) {
                sum += a[row * n + i] * v[i];
            }
            product[row] = sum;
        }
        return product;
    }

    /** a·v with a a {@code BlockRealMatrix} ({@code BlockRealMatrix.operate}). */
    public static double[] blockTimesVector(double[] a, double[] v, int n) {
        double[] product = new double[n];
        for (int row = 0; row < n; row++) {
            int k = row * n;
            double sum = 0;
            int i = 0;
            while (i < n - 3) {
                sum += a[k] * v[i] + a[k + 1] * v[i + 1] + a[k + 2] * v[i + 2] + a[k + 3] * v[i + 3];
                k += 4;
                i += 4;
            }
            while (i < n) {
                sum += a[k++] * v[i++];
            }
            product[row] = 0.0 + sum; // into the zeroed result
        }
        return product;
    }

    /** a·b of two vectors ({@code ArrayRealVector.dotProduct}: one by one from zero). */
    public static double dotProduct(double[] a, double[] b) {
        double dot = 0;
        for (int i = 0; i < a.length; i++) {
            dot += a[i] * b[i];
        }
        return dot;
    }

    /** The sum of the diagonal ({@code AbstractRealMatrix.getTrace}). */
    public static double trace(double[] a, int n) {
        double trace = 0;
        for (int i = 0; i < n; i++) {
            trace += a[i * n + i];
        }
        return trace;
    }

    /**
     * a ← a + c·I in place, as {@code a.add(identity.scalarMultiply(c))}: every entry gets the identity's
     * entry times c added, so an off-diagonal −0 becomes +0 (or stays −0 when c &lt; 0) as there.
     */
    public static void addScaledIdentity(double[] a, int n, double c) {
        for (int row = 0; row < n; row++) {
            for (int col = 0; col < n; col++) {
                a[row * n + col] += (row == col ? 1.0 : 0.0) * c;
            }
        }
    }
}
