package org.loopwright.sim.assess;

import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.QRDecomposition;
import org.hipparchus.linear.RealVector;

/**
 * The minimum-variance index (Harris 1989, "Assessment of closed-loop performance", Canadian Journal of
 * Chemical Engineering 67; the AR estimate as in Desborough &amp; Harris 1992; both from memory).
 * Whatever the controller, the first d terms of the error's impulse-response (moving-average)
 * expansion e(t) = Σ ψi·a(t−i) cannot be changed by feedback when the loop's delay is d samples, so
 * the smallest achievable variance is σ²mv = σ²a·(ψ0² + … + ψ(d−1)²). An AR model A(q)e = a is fitted
 * to the error by least squares (Hipparchus QR), its order chosen by Akaike's criterion up to
 * {@value #MAX_ORDER}; ψ follows from 1/A(q). Reported as σ²mv / σ²e: 1 is minimum-variance
 * control, near 0 far from it.
 *
 * <p>Before the figure is trusted, the fitted model must be stationary: all reflection coefficients of
 * A(q) (Schur–Cohn step-down recursion) inside (−1, 1); otherwise the error drifts or diverges and the
 * index is not defined.
 *
 * @param index            σ²mv / σ²e, NaN when not defined
 * @param order            the AR order chosen
 * @param errorVariance    σ²e about its mean
 * @param residualVariance σ²a of the fitted model
 * @param stationary       whether the fitted model is stationary
 */
public record HarrisIndex(double index, int order, double errorVariance, double residualVariance,
        boolean stationary) {

    /** Largest AR order tried. */
    public static final int MAX_ORDER = 20;
    /** The last this many samples of a stretch are fitted (bounds the work on long records). */
    public static final int MAX_SAMPLES = 20_000;
    /** Fewest samples for a fit. */
    public static final int MIN_SAMPLES = 20 * MAX_ORDER;

    /**
     * Fits e[from..to) (the last {@value #MAX_SAMPLES} at most) and computes the index for a delay of
     * {@code delaySamples} (&ge; 1).
     */
    public static HarrisIndex of(double[] e, int from, int to, int delaySamples) {
        int start = Math.max(from, to - MAX_SAMPLES);
        int n = to - start;
        double mean = 0.0;
        for (int k = start; k < to; k++) {
            mean += e[k];
        }
        mean /= n;
        double[] x = new double[n];
        double variance = 0.0;
        for (int k = 0; k < n; k++) {
            x[k] = e[start + k] - mean;
            variance += x[k] * x[k];
        }
        variance /= n;
        int rows = n - MAX_ORDER;
        double bestAic = Double.POSITIVE_INFINITY;
        double[] best = null;
        double bestResidual = Double.NaN;
        for (int p = 1; p <= MAX_ORDER; p++) {
            double[][] regressors = new double[rows][p];
            double[] target = new double[rows];
            for (int r = 0; r < rows; r++) {
                int t = MAX_ORDER + r;
                target[r] = x[t];
                for (int i = 0; i < p; i++) {
                    regressors[r][i] = x[t - 1 - i];
                }
            }
            Array2DRowRealMatrix matrix = new Array2DRowRealMatrix(regressors, false);
            RealVector y = new ArrayRealVector(target, false);
            RealVector a = new QRDecomposition(matrix).getSolver().solve(y);
            double rss = y.subtract(matrix.operate(a)).getNorm();
            rss *= rss;
            double aic = rows * Math.log(rss / rows) + 2.0 * p;
            if (aic < bestAic) {
                bestAic = aic;
                best = a.toArray();
                bestResidual = rss / (rows - p);
            }
        }
        boolean stationary = stationary(best);
        double[] psi = impulseResponse(best, delaySamples);
        double sum = 0.0;
        for (double v : psi) {
            sum += v * v;
        }
        double index = stationary && variance > 0.0 ? bestResidual * sum / variance : Double.NaN;
        return new HarrisIndex(index, best.length, variance, bestResidual, stationary);
    }

    /** ψ0..ψ(d−1) of 1/A(q) for e(t) = Σ ai·e(t−i) + a(t): ψ0 = 1, ψj = Σ ai·ψ(j−i). */
    static double[] impulseResponse(double[] a, int terms) {
        double[] psi = new double[terms];
        psi[0] = 1.0;
        for (int j = 1; j < terms; j++) {
            double sum = 0.0;
            for (int i = 1; i <= Math.min(j, a.length); i++) {
                sum += a[i - 1] * psi[j - i];
            }
            psi[j] = sum;
        }
        return psi;
    }

    /**
     * Whether 1 − Σ ai·q^−i has all its roots inside the unit circle: the step-down (Schur–Cohn)
     * recursion's reflection coefficients all lie in (−1, 1).
     */
    static boolean stationary(double[] a) {
        double[] c = new double[a.length + 1];
        for (int i = 1; i <= a.length; i++) {
            c[i] = -a[i - 1];
        }
        for (int m = a.length; m >= 1; m--) {
            double k = c[m];
            if (!(Math.abs(k) < 1.0)) {
                return false;
            }
            double[] next = new double[m];
            for (int i = 1; i < m; i++) {
                next[i] = (c[i] - k * c[m - i]) / (1.0 - k * k);
            }
            c = next;
        }
        return true;
    }
}
