package org.loopwright.sim.frequency;

import org.hipparchus.complex.Complex;
import org.hipparchus.exception.LocalizedCoreFormats;
import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.EigenDecompositionNonSymmetric;
import org.hipparchus.linear.HessenbergTransformer;
import org.hipparchus.linear.SchurTransformer;
import org.hipparchus.util.FastMath;
import org.hipparchus.util.Precision;

/**
 * The eigenvalues of a real square matrix, read from its real Schur form T: Householder reduction to upper
 * Hessenberg form, then the Francis double-shift QR iteration (Golub and Van Loan, <i>Matrix Computations</i>,
 * 4th ed., 2013, §7.4–7.5; the hqr procedure of Wilkinson and Reinsch, <i>Handbook for Automatic Computation
 * II: Linear Algebra</i>, 1971, in its JAMA form).
 *
 * <p>The arithmetic on T follows Hipparchus 3.1's {@link HessenbergTransformer} (its transform and getH) and
 * {@link SchurTransformer} (transform, getNorm, findSmallSubDiagonalElement, computeShift, initQRStep,
 * performDoubleQRStep) operation for operation and in the same order (both Apache License 2.0), so the
 * eigenvalues equal to the bit those of {@link EigenDecompositionNonSymmetric} with its default epsilon, which
 * SchurEigenvaluesProperties checks. What it leaves out is the orthogonal P of both transforms, which only
 * eigenvectors need: Hipparchus computes P from the Householder vectors and updates it beside T, but no update
 * of T reads it. Plain arrays instead of matrix objects and no P: a sweep asks for the poles of every run, and
 * Hipparchus' transformers were half of a run's fixed cost, much of it the JIT compiling their matrix objects.
 */
final class SchurEigenvalues {

    /** The convergence threshold of the iteration and the scale of the 2×2-block test, Hipparchus' default. */
    private static final double EPSILON = EigenDecompositionNonSymmetric.DEFAULT_EPSILON;

    /** QR steps allowed on one eigenvalue (or pair) before giving up, as in {@link SchurTransformer}. */
    private static final int MAX_ITERATIONS = 100;

    /** T: the Hessenberg form at first, the real Schur form at the end. */
    private final double[][] t;

    /** The L1 norm of the Hessenberg form (entries on and above the sub-diagonal), fixed for the iteration. */
    private final double norm;

    // shift figures of the current step: SchurTransformer's ShiftInfo x, y, w and exShift
    private double shiftX;
    private double shiftY;
    private double shiftW;
    private double exShift;

    /** The first Householder vector of a QR step. */
    private final double[] hVec = new double[3];

    private SchurEigenvalues(double[][] hessenberg) {
        t = hessenberg;
        norm = hessenbergNorm(hessenberg);
    }

    /**
     * The eigenvalues of a square matrix (left unchanged), in the order of the diagonal of T: a 1×1 block
     * is a real eigenvalue, a 2×2 block (a sub-diagonal entry above {@code norm1(matrix) · epsilon}) a
     * complex pair, read as {@link EigenDecompositionNonSymmetric#getEigenvalues()} reads them.
     *
     * @throws MathIllegalStateException when the iteration does not converge, as {@link SchurTransformer}
     */
    static Complex[] of(double[][] matrix) {
        double negligible = norm1(matrix) * EPSILON;
        double[][] t = new SchurEigenvalues(hessenberg(matrix)).schurForm();
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

    /** The largest column sum of absolute values, summed down each column as Hipparchus' getNorm1 does. */
    private static double norm1(double[][] matrix) {
        double maxColSum = 0;
        for (int j = 0; j < matrix.length; j++) {
            double columnSum = 0;
            for (double[] row : matrix) {
                columnSum += FastMath.abs(row[j]);
            }
            maxColSum = FastMath.max(maxColSum, columnSum);
        }
        return maxColSum;
    }

    /** A copy of the matrix reduced to upper Hessenberg form by Householder similarity transforms. */
    private static double[][] hessenberg(double[][] matrix) {
        int n = matrix.length;
        int high = n - 1;
        double[][] h = new double[n][];
        for (int i = 0; i < n; i++) {
            h[i] = matrix[i].clone();
        }
        double[] ort = new double[n];
        for (int m = 1; m <= high - 1; m++) {
            double scale = 0;
            for (int i = m; i <= high; i++) {
                scale += FastMath.abs(h[i][m - 1]);
            }
            if (!Precision.equals(scale, 0.0)) {
                double sum = 0;
                for (int i = high; i >= m; i--) {
                    ort[i] = h[i][m - 1] / scale;
                    sum += ort[i] * ort[i];
                }
                final double g = (ort[m] > 0) ? -FastMath.sqrt(sum) : FastMath.sqrt(sum);
                sum -= ort[m] * g;
                ort[m] -= g;

                // H = (I - u*u' / sum) * H * (I - u*u' / sum)
                for (int j = m; j < n; j++) {
                    double f = 0;
                    for (int i = high; i >= m; i--) {
                        f += ort[i] * h[i][j];
                    }
                    f /= sum;
                    for (int i = m; i <= high; i++) {
                        h[i][j] -= f * ort[i];
                    }
                }
                for (int i = 0; i <= high; i++) {
                    double f = 0;
                    for (int j = high; j >= m; j--) {
                        f += ort[j] * h[i][j];
                    }
                    f /= sum;
                    for (int j = m; j <= high; j++) {
                        h[i][j] -= f * ort[j];
                    }
                }
                h[m][m - 1] = scale * g;
            }
        }
        // below the sub-diagonal Hipparchus keeps the Householder vectors (for P) and its getH gives zeros
        // there; the QR steps' bulge reads those entries, so they must start as zeros
        for (int i = 2; i < n; i++) {
            for (int j = 0; j < i - 1; j++) {
                h[i][j] = 0.0;
            }
        }
        return h;
    }

    /** The L1 norm of T taken as {@link SchurTransformer}'s getNorm takes it (row by row, from the sub-diagonal). */
    private static double hessenbergNorm(double[][] t) {
        double norm = 0.0;
        for (int i = 0; i < t.length; i++) {
            for (int j = FastMath.max(i - 1, 0); j < t.length; j++) {
                norm += FastMath.abs(t[i][j]);
            }
        }
        return norm;
    }

    /** T brought to real Schur form in place, as {@link SchurTransformer}'s transform, without P. */
    private double[][] schurForm() {
        final int n = t.length;
        int iteration = 0;
        int iu = n - 1;
        while (iu >= 0) {
            final int il = findSmallSubDiagonalElement(iu);
            if (il == iu) {
                // one root found
                t[iu][iu] += exShift;
                iu--;
                iteration = 0;
            } else if (il == iu - 1) {
                // two roots found
                double p = (t[iu - 1][iu - 1] - t[iu][iu]) / 2.0;
                double q = p * p + t[iu][iu - 1] * t[iu - 1][iu];
                t[iu][iu] += exShift;
                t[iu - 1][iu - 1] += exShift;

                if (q >= 0) {
                    // real pair: rotated to an upper triangular block
                    double z = FastMath.sqrt(FastMath.abs(q));
                    if (p >= 0) {
                        z = p + z;
                    } else {
                        z = p - z;
                    }
                    final double x = t[iu][iu - 1];
                    final double s = FastMath.abs(x) + FastMath.abs(z);
                    p = x / s;
                    q = z / s;
                    final double r = FastMath.sqrt(p * p + q * q);
                    p /= r;
                    q /= r;

                    for (int j = iu - 1; j < n; j++) {
                        z = t[iu - 1][j];
                        t[iu - 1][j] = q * z + p * t[iu][j];
                        t[iu][j] = q * t[iu][j] - p * z;
                    }
                    for (int i = 0; i <= iu; i++) {
                        z = t[i][iu - 1];
                        t[i][iu - 1] = q * z + p * t[i][iu];
                        t[i][iu] = q * t[i][iu] - p * z;
                    }
                }
                iu -= 2;
                iteration = 0;
            } else {
                computeShift(il, iu, iteration);
                ++iteration;
                if (iteration > MAX_ITERATIONS) {
                    throw new MathIllegalStateException(LocalizedCoreFormats.CONVERGENCE_FAILED, MAX_ITERATIONS);
                }
                final int im = initQRStep(il, iu);
                performDoubleQRStep(il, im, iu);
            }
        }
        return t;
    }

    /** The lowest row above {@code startIdx} reached before a negligible sub-diagonal entry. */
    private int findSmallSubDiagonalElement(final int startIdx) {
        int l = startIdx;
        while (l > 0) {
            double s = FastMath.abs(t[l - 1][l - 1]) + FastMath.abs(t[l][l]);
            if (s == 0.0) {
                s = norm;
            }
            if (FastMath.abs(t[l][l - 1]) < EPSILON * s) {
                break;
            }
            l--;
        }
        return l;
    }

    /** The shift of the next step, with Wilkinson's exceptional shift at 10 and MATLAB's at 30 steps. */
    private void computeShift(final int l, final int idx, final int iteration) {
        shiftX = t[idx][idx];
        shiftY = shiftW = 0.0;
        if (l < idx) {
            shiftY = t[idx - 1][idx - 1];
            shiftW = t[idx][idx - 1] * t[idx - 1][idx];
        }

        if (iteration == 10) {
            exShift += shiftX;
            for (int i = 0; i <= idx; i++) {
                t[i][i] -= shiftX;
            }
            final double s = FastMath.abs(t[idx][idx - 1]) + FastMath.abs(t[idx - 1][idx - 2]);
            shiftX = 0.75 * s;
            shiftY = 0.75 * s;
            shiftW = -0.4375 * s * s;
        }

        if (iteration == 30) {
            double s = (shiftY - shiftX) / 2.0;
            s = s * s + shiftW;
            if (s > 0.0) {
                s = FastMath.sqrt(s);
                if (shiftY < shiftX) {
                    s = -s;
                }
                s = shiftX - shiftW / ((shiftY - shiftX) / 2.0 + s);
                for (int i = 0; i <= idx; i++) {
                    t[i][i] -= s;
                }
                exShift += s;
                shiftX = shiftY = shiftW = 0.964;
            }
        }
    }

    /** The row the QR step starts at (two consecutive small sub-diagonal entries), with its first vector. */
    private int initQRStep(final int il, final int iu) {
        int im = iu - 2;
        while (im >= il) {
            final double z = t[im][im];
            final double r = shiftX - z;
            double s = shiftY - z;
            hVec[0] = (r * s - shiftW) / t[im + 1][im] + t[im][im + 1];
            hVec[1] = t[im + 1][im + 1] - z - r - s;
            hVec[2] = t[im + 2][im + 1];

            if (im == il) {
                break;
            }

            final double lhs = FastMath.abs(t[im][im - 1]) * (FastMath.abs(hVec[1]) + FastMath.abs(hVec[2]));
            final double rhs = FastMath.abs(hVec[0]) * (FastMath.abs(t[im - 1][im - 1]) +
                                                        FastMath.abs(z) +
                                                        FastMath.abs(t[im + 1][im + 1]));

            if (lhs < EPSILON * rhs) {
                break;
            }
            im--;
        }
        return im;
    }

    /** One Francis double-shift QR step on rows {@code il..iu}, chasing the bulge from row {@code im}. */
    private void performDoubleQRStep(final int il, final int im, final int iu) {
        final int n = t.length;
        double p = hVec[0];
        double q = hVec[1];
        double r = hVec[2];

        for (int k = im; k <= iu - 1; k++) {
            boolean notlast = k != (iu - 1);
            if (k != im) {
                p = t[k][k - 1];
                q = t[k + 1][k - 1];
                r = notlast ? t[k + 2][k - 1] : 0.0;
                shiftX = FastMath.abs(p) + FastMath.abs(q) + FastMath.abs(r);
                if (Precision.equals(shiftX, 0.0, EPSILON * norm)) {
                    continue;
                }
                p /= shiftX;
                q /= shiftX;
                r /= shiftX;
            }
            double s = FastMath.sqrt(p * p + q * q + r * r);
            if (p < 0.0) {
                s = -s;
            }
            if (s != 0.0) {
                if (k != im) {
                    t[k][k - 1] = -s * shiftX;
                } else if (il != im) {
                    t[k][k - 1] = -t[k][k - 1];
                }
                p += s;
                shiftX = p / s;
                shiftY = q / s;
                double z = r / s;
                q /= p;
                r /= p;

                for (int j = k; j < n; j++) {
                    p = t[k][j] + q * t[k + 1][j];
                    if (notlast) {
                        p += r * t[k + 2][j];
                        t[k + 2][j] -= p * z;
                    }
                    t[k][j] -= p * shiftX;
                    t[k + 1][j] -= p * shiftY;
                }

                for (int i = 0; i <= FastMath.min(iu, k + 3); i++) {
                    p = shiftX * t[i][k] + shiftY * t[i][k + 1];
                    if (notlast) {
                        p += z * t[i][k + 2];
                        t[i][k + 2] -= p * r;
                    }
                    t[i][k] -= p;
                    t[i][k + 1] -= p * q;
                }
                // Hipparchus accumulates P here, reusing p as scratch; p is reassigned from T before its next read
            }
        }

        // clean up pollution due to round-off errors
        for (int i = im + 2; i <= iu; i++) {
            t[i][i - 2] = 0.0;
            if (i > im + 2) {
                t[i][i - 3] = 0.0;
            }
        }
    }
}
