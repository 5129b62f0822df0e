package org.loopwright.sim.plant;

import java.util.Arrays;

import org.hipparchus.exception.LocalizedCoreFormats;
import org.hipparchus.exception.MathIllegalArgumentException;
import org.hipparchus.util.FastMath;

/**
 * e^M of a small square matrix M, given and returned row-major in a plain {@code double[]}.
 *
 * <p>Method: Padé approximation with scaling and squaring (Higham, "The scaling and squaring method for
 * the matrix exponential revisited", <i>SIAM J. Matrix Anal. Appl.</i> 26(4), 2005; Golub &amp; Van Loan,
 * <i>Matrix Computations</i>, 4th ed., §9.3). The 1-norm of M picks the Padé degree (3, 5, 7, 9 or 13);
 * past degree 9's range M is scaled by 2^−s. The numerator U + V and denominator U − V come from Horner's
 * scheme in M², F solves (U − V)·F = (U + V) by Householder QR, and F is squared s times.
 *
 * <p>The arithmetic follows Hipparchus 3.1's {@code MatrixUtils.matrixExponential} (Apache License 2.0)
 * operation for operation — the norm walk, the Horner products, the QR decomposition and its block solve,
 * the squarings in block order (see {@link HipparchusArithmetic}) — so the result is equal to the bit to
 * what it gives, which {@code MatrixExponentialProperties} checks; it only spares the matrix objects.
 */
public final class MatrixExponential {

    private static final double[] PADE_3 = {120.0, 60.0, 12.0, 1.0};
    private static final double[] PADE_5 = {30240.0, 15120.0, 3360.0, 420.0, 30.0, 1.0};
    private static final double[] PADE_7 = {17297280.0, 8648640.0, 1995840.0, 277200.0, 25200.0, 1512.0, 56.0,
        1.0};
    private static final double[] PADE_9 = {17643225600.0, 8821612800.0, 2075673600.0, 302702400.0, 30270240.0,
        2162160.0, 110880.0, 3960.0, 90.0, 1.0};
    private static final double[] PADE_13 = {6.476475253248e+16, 3.238237626624e+16, 7.7717703038976e+15,
        1.1873537964288e+15, 129060195264000.0, 10559470521600.0, 670442572800.0, 33522128640.0,
        1323241920.0, 40840800.0, 960960.0, 16380.0, 182.0, 1.0};

    /**
     * θ13 (Higham 2005, Table 2.3), the largest 1-norm that degree 13 takes to unit roundoff. Hipparchus
     * scales by 2^−s with s the binary exponent of ‖M‖₁/θ13, which leaves the scaled norm in [θ13, 2·θ13)
     * where Higham takes s one larger; kept, as the results must be Hipparchus' to the bit.
     */
    private static final double THETA_13 = 5.371920351148152;

    private MatrixExponential() {
    }

    /**
     * e^M for the {@code dimension}×{@code dimension} matrix {@code matrix} (row-major; left unchanged).
     *
     * @throws IllegalArgumentException when the array is not dimension² long, or the dimension is not
     *         1..{@link HipparchusArithmetic#MAX_BLOCK_DIMENSION} (past it Hipparchus sums in another order)
     * @throws MathIllegalArgumentException when U − V is singular, as Hipparchus throws
     */
    public static double[] of(double[] matrix, int dimension) {
        if (dimension < 1 || dimension > HipparchusArithmetic.MAX_BLOCK_DIMENSION
                || matrix.length != dimension * dimension) {
            throw new IllegalArgumentException("a square matrix of dimension 1.."
                    + HipparchusArithmetic.MAX_BLOCK_DIMENSION + " is needed: dimension=" + dimension
                    + ", entries=" + matrix.length);
        }
        int n = dimension;
        double norm = norm1(matrix, n);
        double[] pade;
        int squarings = 0;
        double[] scaled = matrix.clone();
        // θ3, θ5, θ7, θ9 of Higham 2005, Table 2.3, as Hipparchus writes them
        if (norm < 1.495585217958292e-2) {
            pade = PADE_3;
        } else if (norm < 2.539398330063230e-1) {
            pade = PADE_5;
        } else if (norm < 9.504178996162932e-1) {
            pade = PADE_7;
        } else if (norm < 2.097847961257068) {
            pade = PADE_9;
        } else {
            pade = PADE_13;
            squarings = Math.max(0, Math.getExponent(norm / THETA_13));
            for (int k = 0; k < scaled.length; k++) {
                scaled[k] = Math.scalb(scaled[k], -squarings);
            }
        }
        double[] square = HipparchusArithmetic.rowsTimes(scaled, scaled, n);
        // V: the odd part, M·(c1·I + M²·(c3·I + …)); U: the even part, c0·I + M²·(c2·I + …)
        double[] odd = horner(square, pade, pade.length - 1, n);
        HipparchusArithmetic.addScaledIdentity(odd, n, pade[1]);
        double[] v = HipparchusArithmetic.rowsTimes(scaled, odd, n);
        double[] u = horner(square, pade, pade.length - 2, n);
        HipparchusArithmetic.addScaledIdentity(u, n, pade[0]);
        double[] numerator = new double[n * n];
        double[] denominator = new double[n * n];
        for (int k = 0; k < numerator.length; k++) {
            numerator[k] = u[k] + v[k];
            denominator[k] = u[k] - v[k];
        }
        double[] result = HouseholderSolve.solve(denominator, numerator, n);
        for (int i = 0; i < squarings; i++) {
            // the solve returns a BlockRealMatrix, so Hipparchus squares in block order
            result = HipparchusArithmetic.blockTimesBlock(result, result, n);
        }
        return result;
    }

    /**
     * The zero-order-hold integrals of ẋ = Ax + Bu over {@code seconds}, both from one exponential (Van Loan's
     * block form): e^([[A, B], [0, 0]]·t) = [[e^(At), ∫₀^t e^(As) ds·B], [0, 1]], row-major (n+1)×(n+1).
     *
     * @param dynamics A, row-major n×n
     * @param input    B, n entries
     */
    public static double[] ofHold(double[] dynamics, double[] input, int n, double seconds) {
        int size = n + 1;
        double[] augmented = new double[size * size];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                augmented[i * size + j] = dynamics[i * n + j] * seconds;
            }
            augmented[i * size + n] = input[i] * seconds;
        }
        return of(augmented, size);
    }

    /** The largest column sum of absolute values, summed down each column as Hipparchus' getNorm1 walks. */
    private static double norm1(double[] matrix, int n) {
        double largest = 0;
        for (int col = 0; col < n; col++) {
            double columnSum = 0;
            for (int row = 0; row < n; row++) {
                columnSum += FastMath.abs(matrix[row * n + col]);
            }
            largest = FastMath.max(largest, columnSum);
        }
        return largest;
    }

    /** P ← M²·(P + c_i·I) from P = 0 for i = first, first − 2, … down to 2. */
    private static double[] horner(double[] square, double[] pade, int first, int n) {
        double[] p = new double[n * n];
        for (int i = first; i > 1; i -= 2) {
            HipparchusArithmetic.addScaledIdentity(p, n, pade[i]);
            p = HipparchusArithmetic.rowsTimes(square, p, n);
        }
        return p;
    }

    /**
     * Hipparchus' {@code QRDecomposition} (threshold 0) and its solver's {@code solve(RealMatrix)}, for a
     * right-hand side of at most one block of columns.
     */
    private static final class HouseholderSolve {

        private HouseholderSolve() {
        }

        /** X with a·X = b, a and b row-major n×n. */
        static double[] solve(double[] a, double[] b, int n) {
            // qrt holds aᵀ: row k is column k of a, the vector each reflection works on
            double[] qrt = new double[n * n];
            for (int row = 0; row < n; row++) {
                for (int col = 0; col < n; col++) {
                    qrt[col * n + row] = a[row * n + col];
                }
            }
            double[] rDiagonal = new double[n];
            for (int minor = 0; minor < n; minor++) {
                reflect(qrt, rDiagonal, minor, n);
            }
            for (double d : rDiagonal) {
                if (FastMath.abs(d) <= 0.0) {
                    throw new MathIllegalArgumentException(LocalizedCoreFormats.SINGULAR_MATRIX);
                }
            }
            double[] y = b.clone();
            applyReflections(qrt, rDiagonal, y, n);
            solveTriangular(qrt, rDiagonal, y, n);
            return y;
        }

        /** QRDecomposition.performHouseholderReflection. */
        private static void reflect(double[] qrt, double[] rDiagonal, int minor, int n) {
            int m = minor * n;
            double xNormSqr = 0;
            for (int row = minor; row < n; row++) {
                double c = qrt[m + row];
                xNormSqr += c * c;
            }
            double a = qrt[m + minor] > 0 ? -FastMath.sqrt(xNormSqr) : FastMath.sqrt(xNormSqr);
            rDiagonal[minor] = a;
            if (a != 0.0) {
                qrt[m + minor] -= a;
                for (int col = minor + 1; col < n; col++) {
                    int c = col * n;
                    double alpha = 0;
                    for (int row = minor; row < n; row++) {
                        alpha -= qrt[c + row] * qrt[m + row];
                    }
                    alpha /= a * qrt[m + minor];
                    for (int row = minor; row < n; row++) {
                        qrt[c + row] -= alpha * qrt[m + row];
                    }
                }
            }
        }

        /** y ← Qᵀ·y, as the solver does it: each reflection's factor is a reciprocal, then multiplied. */
        private static void applyReflections(double[] qrt, double[] rDiagonal, double[] y, int n) {
            double[] alpha = new double[n];
            for (int minor = 0; minor < n; minor++) {
                int m = minor * n;
                double factor = 1.0 / (rDiagonal[minor] * qrt[m + minor]);
                Arrays.fill(alpha, 0.0);
                for (int row = minor; row < n; row++) {
                    double d = qrt[m + row];
                    for (int k = 0; k < n; k++) {
                        alpha[k] += d * y[row * n + k];
                    }
                }
                for (int k = 0; k < n; k++) {
                    alpha[k] *= factor;
                }
                for (int row = minor; row < n; row++) {
                    double d = qrt[m + row];
                    for (int k = 0; k < n; k++) {
                        y[row * n + k] += alpha[k] * d;
                    }
                }
            }
        }

        /**
         * R·X = y by back substitution, in place: row j of y becomes row j of X once it is scaled, and is
         * not touched after, so y ends as X (the solver copies each row out at that moment).
         */
        private static void solveTriangular(double[] qrt, double[] rDiagonal, double[] y, int n) {
            for (int j = n - 1; j >= 0; j--) {
                double factor = 1.0 / rDiagonal[j];
                for (int k = 0; k < n; k++) {
                    y[j * n + k] *= factor;
                }
                for (int i = 0; i < j; i++) {
                    double rIJ = qrt[j * n + i];
                    for (int k = 0; k < n; k++) {
                        y[i * n + k] -= y[j * n + k] * rIJ;
                    }
                }
            }
        }
    }
}
