package org.loopwright.sim.frequency;

import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.loopwright.sim.plant.HipparchusArithmetic;
import org.loopwright.sim.plant.MatrixExponential;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The exact sampled model of a plant driven through a zero-order hold and read at the sampling
 * instants, dead time included — also when the dead time is not a whole number of periods.
 *
 * <p>Method (Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i>, 3rd ed., §2.3, "sampling a
 * system with time delay"; the modified z-transform): write the dead time as L = d·h + τ with
 * 0 &le; τ &lt; h and realise N(s)/D(s) as ẋ = Ax + Bu, y = Cx + Du. Over one period the held input
 * switches from u(k−d−1) to u(k−d) at τ, so
 * <pre>
 *   x(k+1) = Φ·x(k) + Γ0·u(k−d) + Γ1·u(k−d−1)
 *   Φ = e^(Ah),  Γ0 = ∫₀^(h−τ) e^(As) ds·B,  Γ1 = e^(A(h−τ))·∫₀^τ e^(As) ds·B
 * </pre>
 * Each integral comes from one matrix exponential of [[A, B], [0, 0]]. The pulse-transfer function is
 * H(z) = z^(−d)·[C·(zI − Φ)⁻¹·(Γ0 + Γ1·z⁻¹) + D·z^(−1 if τ &gt; 0)], whose numerator is found from the
 * adjugate of (zI − Φ) by the Faddeev–LeVerrier recursion (exact in the algebra, no cancellation of
 * two determinants).
 */
public final class ZeroOrderHoldEquivalent {

    /** A dead time within this fraction of a period of a whole number of periods is taken as whole. */
    private static final double WHOLE_PERIOD_TOLERANCE = 1e-9;

    private ZeroOrderHoldEquivalent() {
    }

    /**
     * The zero-order-hold equivalent of {@code plant} at {@code periodSeconds}.
     *
     * @throws IllegalArgumentException if the period is not finite and &gt; 0
     */
    public static PulseTransferFunction of(TransferFunction plant, double periodSeconds) {
        if (!Double.isFinite(periodSeconds) || periodSeconds <= 0.0) {
            throw new IllegalArgumentException("period must be finite and > 0: periodSeconds=" + periodSeconds);
        }
        double periods = plant.deadTimeSeconds() / periodSeconds;
        int wholeDelay = (int) Math.floor(periods);
        double fraction = periods - wholeDelay;
        if (fraction > 1.0 - WHOLE_PERIOD_TOLERANCE) {
            wholeDelay++;
            fraction = 0.0;
        } else if (fraction < WHOLE_PERIOD_TOLERANCE) {
            fraction = 0.0;
        }
        double tau = fraction * periodSeconds;

        StateSpace model = StateSpace.of(plant);
        int n = model.order();
        if (n == 0) {
            // a static gain: D·z^(−d), one more sample of delay when the hold switches within a period
            PolynomialFunction den = tau > 0.0 ? new PolynomialFunction(0.0, 1.0) : PulseTransferFunction.constant(1.0);
            return new PulseTransferFunction(PulseTransferFunction.constant(model.feedthrough()), den, wholeDelay,
                    periodSeconds);
        }
        double[] afterSwitch = holdIntegral(model, periodSeconds - tau);
        double[] beforeSwitch = holdIntegral(model, tau);
        double[] phiLate = stateBlock(afterSwitch, n);
        double[] gammaNow = inputColumn(afterSwitch, n);
        // the exponentials are BlockRealMatrix objects in Hipparchus, so their products sum in block order
        double[] phi = HipparchusArithmetic.blockTimesBlock(phiLate, stateBlock(beforeSwitch, n), n);
        double[] gammaPrevious = HipparchusArithmetic.blockTimesVector(phiLate, inputColumn(beforeSwitch, n), n);

        // adj(zI − Φ) = Σ_{k=0}^{n−1} M_k·z^(n−1−k);  det(zI − Φ) = Σ_{k=0}^{n} c_k·z^(n−k)
        double[] characteristic = new double[n + 1]; // ascending powers
        double[] nowTerms = new double[n];           // C·adj·Γ0, ascending powers
        double[] previousTerms = new double[n];      // C·adj·Γ1, ascending powers
        double[] m = identity(n);
        characteristic[n] = 1.0;
        for (int k = 1; k <= n; k++) {
            // M_0 = I was an Array2DRowRealMatrix, each later M_k the BlockRealMatrix of Φ·M + c·I:
            // the two kinds sum their products in different orders
            boolean blockM = k > 1;
            nowTerms[n - k] = HipparchusArithmetic.dotProduct(model.output(), times(m, gammaNow, n, blockM));
            previousTerms[n - k] = HipparchusArithmetic.dotProduct(model.output(),
                    times(m, gammaPrevious, n, blockM));
            double[] phiM = blockM ? HipparchusArithmetic.blockTimesBlock(phi, m, n)
                    : HipparchusArithmetic.blockTimesRows(phi, m, n);
            double c = -HipparchusArithmetic.trace(phiM, n) / k;
            characteristic[n - k] = c;
            HipparchusArithmetic.addScaledIdentity(phiM, n, c);
            m = phiM;
        }
        PolynomialFunction det = new PolynomialFunction(characteristic);
        PolynomialFunction now = new PolynomialFunction(nowTerms);
        PolynomialFunction previous = new PolynomialFunction(previousTerms);
        PolynomialFunction feedthrough = det.multiply(PulseTransferFunction.constant(model.feedthrough()));
        PolynomialFunction z = new PolynomialFunction(0.0, 1.0);
        if (tau == 0.0) {
            // Γ1 = 0: H = z^(−d)·[C·adj·Γ0 + D·det]/det
            return new PulseTransferFunction(now.add(feedthrough), det, wholeDelay, periodSeconds);
        }
        // H = z^(−d)·[z·C·adj·Γ0 + C·adj·Γ1 + D·det]/(z·det)
        return new PulseTransferFunction(now.multiply(z).add(previous).add(feedthrough), det.multiply(z),
                wholeDelay, periodSeconds);
    }

    private static double[] identity(int n) {
        double[] identity = new double[n * n];
        for (int i = 0; i < n; i++) {
            identity[i * n + i] = 1.0;
        }
        return identity;
    }

    private static double[] times(double[] matrix, double[] vector, int n, boolean blockOrder) {
        return blockOrder ? HipparchusArithmetic.blockTimesVector(matrix, vector, n)
                : HipparchusArithmetic.rowsTimesVector(matrix, vector, n);
    }

    /** exp([[A, B], [0, 0]]·t) = [[e^(At), ∫₀^t e^(As) ds·B], [0, 1]], row-major (n+1)×(n+1). */
    private static double[] holdIntegral(StateSpace model, double seconds) {
        return MatrixExponential.ofHold(model.dynamics(), model.input(), model.order(), seconds);
    }

    /** The top-left n×n of an (n+1)×(n+1) hold integral: e^(At). */
    private static double[] stateBlock(double[] holdIntegral, int n) {
        double[] block = new double[n * n];
        for (int i = 0; i < n; i++) {
            System.arraycopy(holdIntegral, i * (n + 1), block, i * n, n);
        }
        return block;
    }

    /** The last column's first n entries of an (n+1)×(n+1) hold integral: ∫₀^t e^(As) ds·B. */
    private static double[] inputColumn(double[] holdIntegral, int n) {
        double[] column = new double[n];
        for (int i = 0; i < n; i++) {
            column[i] = holdIntegral[i * (n + 1) + n];
        }
        return column;
    }
}
