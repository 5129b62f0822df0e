package org.loopwright.sim.frequency;

import java.util.ArrayList;
import java.util.List;

import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.complex.Complex;
import org.hipparchus.linear.EigenDecompositionNonSymmetric;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.multiloop.Cascade;
import org.loopwright.sim.plant.TransferFunction;

/**
 * Margins of a cascade: the inner loop alone, and the outer loop with the inner loop closed, each
 * for the continuous design and as it runs sampled.
 *
 * <p>Continuous: the outer loop is L1 = σ1·C1(s)·T2(s)·P1(s) with T2 = L2/(1 + L2), L2 = σ2·C2·P2,
 * dead times included. Sampled, exactly (no approximation beyond the linear parts): at the inner
 * period h2 the map from the inner setpoint to the outer measurement is
 * <pre>
 *   G(z) = [P2·P1]_zoh(z) · C2(z) / (1 + C2(z)·P2_zoh(z))
 * </pre>
 * (the outer plant is driven by the inner plant's output, which is not held, so the series pair
 * is sampled together). The outer controller holds the inner setpoint for n inner samples and reads
 * the outer measurement every n-th, so at the outer period h1 = n·h2 the plant it sees is G lifted:
 * with G realised as x(k+1) = A·x + B·r, y = C·x, it is A^n, (I + A + … + A^(n−1))·B, C (Åström &amp;
 * Wittenmark, <i>Computer-Controlled Systems</i>, 3rd ed., 1997, the sampling of a discrete system at
 * a multiple of its period). Margins come from its frequency response C·(zI − A^n)⁻¹·B_n at
 * z = e^{jωh1}, and stability from the eigenvalues of the whole outer closed loop.
 *
 * <p>The sensor of a cascade scenario reads the outer measurement, every inner sample, N inner samples
 * late ({@code sensor: {delay-samples: N}}, as the simulation runs it): a factor z^(−N) on G(z) at h2,
 * before the lifting, as {@link SampledLoop} adds it to a single loop.
 *
 * <p>Thread-safe: stateless.
 */
public final class CascadeAnalysis {

    private static final int POINTS_PER_DECADE = 200;

    private CascadeAnalysis() {
    }

    /** The inner closed loop T2(jω) = L2/(1 + L2) of the continuous design. */
    public static FrequencyResponse innerClosedLoop(TransferFunction innerPlant, ControllerSettings inner) {
        FrequencyResponse loop = LoopAnalysis.continuousLoop(innerPlant, inner);
        return omega -> {
            Complex l = loop.at(omega);
            return l.divide(l.add(1.0));
        };
    }

    /** The continuous outer loop σ1·C1·T2·P1. */
    public static FrequencyResponse outerContinuousLoop(TransferFunction outerPlant, ControllerSettings outer,
            TransferFunction innerPlant, ControllerSettings inner) {
        return LoopAnalysis.continuousLoop(outerPlant, outer).times(innerClosedLoop(innerPlant, inner));
    }

    /** The margins of the continuous outer loop with the inner loop closed. */
    public static StabilityMargins outerContinuous(TransferFunction outerPlant, ControllerSettings outer,
            TransferFunction innerPlant, ControllerSettings inner) {
        FrequencyBand outerBand = LoopAnalysis.continuousBand(outerPlant, outer);
        FrequencyBand innerBand = LoopAnalysis.continuousBand(innerPlant, inner);
        FrequencyBand band = new FrequencyBand(Math.min(outerBand.lowestRadPerSecond(), innerBand.lowestRadPerSecond()),
                Math.max(outerBand.highestRadPerSecond(), innerBand.highestRadPerSecond()), POINTS_PER_DECADE,
                outerPlant.deadTimeSeconds() + innerPlant.deadTimeSeconds(), false);
        return MarginSearch.search(outerContinuousLoop(outerPlant, outer, innerPlant, inner), band);
    }

    /**
     * The margins and closed-loop poles of the sampled outer loop with the sampled inner loop closed.
     *
     * @param outerPlant         the outer plant, driven by the inner plant's output
     * @param outer              the outer controller
     * @param innerPlant         the inner plant
     * @param inner              the inner controller, whose period h2 the loop runs at
     * @param sensorDelaySamples whole inner samples by which the outer measurement is late, 0 to
     *                           {@value SampledLoop#MAX_DELAY_SAMPLES}
     * @return the outer loop's margins and poles
     * @throws org.loopwright.pid.InvalidSettingException when the periods are not in a whole ratio
     * @throws IllegalArgumentException when the sensor delay is out of range
     */
    public static SampledMargins outerSampled(TransferFunction outerPlant, ControllerSettings outer,
            TransferFunction innerPlant, ControllerSettings inner, int sensorDelaySamples) {
        if (sensorDelaySamples < 0 || sensorDelaySamples > SampledLoop.MAX_DELAY_SAMPLES) {
            throw new IllegalArgumentException("delay-samples must be 0 to " + SampledLoop.MAX_DELAY_SAMPLES
                    + ": delay-samples=" + sensorDelaySamples);
        }
        int ratio = Cascade.samplesPerOuterSample(outer.samplePeriodSeconds(), inner.samplePeriodSeconds());
        double h2 = inner.samplePeriodSeconds();
        double h1 = outer.samplePeriodSeconds();
        PulseTransferFunction g = innerSetpointToOuterMeasurement(outerPlant, innerPlant, inner);
        PulseTransferFunction sensed = new PulseTransferFunction(g.numerator(), g.denominator(),
                g.delaySamples() + sensorDelaySamples, h2);
        StateModel plant = StateModel.of(sensed).lifted(ratio);
        StateModel controller = StateModel.of(LoopAnalysis.discreteController(outer, h1)
                .times(outer.action().sign()));
        FrequencyResponse loop = omega -> {
            double angle = omega * h1;
            Complex z = new Complex(Math.cos(angle), Math.sin(angle));
            return controller.at(z).multiply(plant.at(z));
        };
        double nyquist = Math.PI / h1;
        double low = Math.min(LoopAnalysis.continuousBand(outerPlant, outer).lowestRadPerSecond(), nyquist * 1e-4);
        double delay = outerPlant.deadTimeSeconds() + innerPlant.deadTimeSeconds() + (sensorDelaySamples + 1) * h2
                + 2.0 * h1;
        StabilityMargins margins = MarginSearch.search(loop, new FrequencyBand(low, nyquist, POINTS_PER_DECADE,
                delay, true));
        return new SampledMargins(margins, closedLoopPoles(plant, controller));
    }

    /** G(z) at the inner period: inner setpoint to outer measurement, the inner loop closed. */
    static PulseTransferFunction innerSetpointToOuterMeasurement(TransferFunction outerPlant,
            TransferFunction innerPlant, ControllerSettings inner) {
        double h = inner.samplePeriodSeconds();
        PulseTransferFunction c = LoopAnalysis.discreteController(inner, h).times(inner.action().sign());
        PulseTransferFunction p = ZeroOrderHoldEquivalent.of(innerPlant, h);
        PulseTransferFunction series = ZeroOrderHoldEquivalent.of(series(innerPlant, outerPlant), h);
        PolynomialFunction shift = shift(p.delaySamples());
        // u/r2 = Nc·D2·z^d2 / (Dc·D2·z^d2 + Nc·N2)
        PolynomialFunction denominator = c.denominator().multiply(p.denominator()).multiply(shift)
                .add(c.numerator().multiply(p.numerator()));
        // the series' poles are the inner plant's and the outer plant's: D2 cancels against u/r2's D2, or
        // it would stay as a hidden mode among the closed-loop poles (at z = 1 for an integrating inner plant)
        PolynomialFunction outerPoles = quotient(series.denominator(), p.denominator());
        if (outerPoles != null) {
            return new PulseTransferFunction(series.numerator().multiply(c.numerator()).multiply(shift),
                    outerPoles.multiply(denominator), series.delaySamples(), h);
        }
        PolynomialFunction numerator = c.numerator().multiply(p.denominator()).multiply(shift);
        return new PulseTransferFunction(series.numerator().multiply(numerator),
                series.denominator().multiply(denominator), series.delaySamples(), h);
    }

    /** dividend/divisor when the division leaves no remainder (to rounding), else null. */
    private static PolynomialFunction quotient(PolynomialFunction dividend, PolynomialFunction divisor) {
        double[] rest = dividend.getCoefficients();
        double[] by = divisor.getCoefficients();
        int degree = by.length - 1;
        if (rest.length <= degree) {
            return null;
        }
        double size = 0.0;
        for (double value : rest) {
            size = Math.max(size, Math.abs(value));
        }
        double[] q = new double[rest.length - degree];
        for (int i = q.length - 1; i >= 0; i--) {
            q[i] = rest[i + degree] / by[degree];
            for (int j = 0; j <= degree; j++) {
                rest[i + j] -= q[i] * by[j];
            }
        }
        for (int j = 0; j < degree; j++) {
            if (Math.abs(rest[j]) > 1e-9 * size) {
                return null;
            }
        }
        return new PolynomialFunction(q);
    }

    private static TransferFunction series(TransferFunction first, TransferFunction second) {
        return new TransferFunction(convolve(first.numerator(), second.numerator()),
                convolve(first.denominator(), second.denominator()),
                first.deadTimeSeconds() + second.deadTimeSeconds());
    }

    private static double[] convolve(double[] a, double[] b) {
        double[] out = new double[a.length + b.length - 1];
        for (int i = 0; i < a.length; i++) {
            for (int j = 0; j < b.length; j++) {
                out[i + j] += a[i] * b[j];
            }
        }
        return out;
    }

    private static PolynomialFunction shift(int samples) {
        double[] c = new double[samples + 1];
        c[samples] = 1.0;
        return new PolynomialFunction(c);
    }

    /** Eigenvalues of the outer closed loop: plant (A, B, C), controller (Ac, Bc, Cc, Dc), e = −y. */
    private static List<Complex> closedLoopPoles(StateModel plant, StateModel controller) {
        int n = plant.order();
        int m = controller.order();
        RealMatrix closed = MatrixUtils.createRealMatrix(n + m, n + m);
        // u = Cc·xc − Dc·C·x (the plant has no feedthrough: every zero-order-hold model is strictly proper)
        RealMatrix bc = plant.b.outerProduct(controller.c);
        RealMatrix bdc = plant.b.outerProduct(plant.c).scalarMultiply(controller.d);
        closed.setSubMatrix(plant.a.subtract(bdc).getData(), 0, 0);
        if (m > 0) {
            closed.setSubMatrix(bc.getData(), 0, n);
            closed.setSubMatrix(controller.b.outerProduct(plant.c).scalarMultiply(-1.0).getData(), n, 0);
            closed.setSubMatrix(controller.a.getData(), n, n);
        }
        List<Complex> poles = new ArrayList<>();
        for (Complex p : new EigenDecompositionNonSymmetric(closed).getEigenvalues()) {
            poles.add(p);
        }
        return poles;
    }

    /** A strictly proper or proper single-input single-output discrete system in controllable form. */
    private static final class StateModel {
        private final RealMatrix a;
        private final RealVector b;
        private final RealVector c;
        private final double d;

        private StateModel(RealMatrix a, RealVector b, RealVector c, double d) {
            this.a = a;
            this.b = b;
            this.c = c;
            this.d = d;
        }

        /** The controllable canonical realisation of B(z)/(A(z)·z^d). */
        static StateModel of(PulseTransferFunction h) {
            double[] den = h.denominator().multiply(shift(h.delaySamples())).getCoefficients();
            double[] num = h.numerator().getCoefficients();
            int order = den.length - 1;
            double lead = den[order];
            double feedthrough = num.length > order ? num[order] / lead : 0.0;
            RealMatrix a = MatrixUtils.createRealMatrix(Math.max(order, 1), Math.max(order, 1));
            RealVector b = MatrixUtils.createRealVector(new double[Math.max(order, 1)]);
            RealVector c = MatrixUtils.createRealVector(new double[Math.max(order, 1)]);
            if (order == 0) {
                // a static gain: one state that nothing drives and nothing reads (a pole at 0)
                return new StateModel(a, b, c, num[0] / lead);
            }
            for (int i = 0; i + 1 < order; i++) {
                a.setEntry(i, i + 1, 1.0);
            }
            for (int j = 0; j < order; j++) {
                a.setEntry(order - 1, j, -den[j] / lead);
                double nj = j < num.length ? num[j] / lead : 0.0;
                c.setEntry(j, nj - feedthrough * den[j] / lead);
            }
            b.setEntry(order - 1, 1.0);
            return new StateModel(a, b, c, feedthrough);
        }

        int order() {
            return a.getRowDimension();
        }

        /** The model sampled every n-th step with its input held: A^n, (I + … + A^(n−1))·B, C. */
        StateModel lifted(int n) {
            RealMatrix power = MatrixUtils.createRealIdentityMatrix(order());
            RealVector input = MatrixUtils.createRealVector(new double[order()]);
            for (int i = 0; i < n; i++) {
                input = input.add(power.operate(b));
                power = power.multiply(a);
            }
            return new StateModel(power, input, c, d);
        }

        /**
         * C·(zI − A)⁻¹·B + D, by Gaussian elimination with partial pivoting on primitive arrays (the
         * margin search asks for thousands of frequencies).
         */
        Complex at(Complex z) {
            int n = order();
            double[][] re = new double[n][n + 1];
            double[][] im = new double[n][n + 1];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    re[i][j] = -a.getEntry(i, j);
                }
                re[i][i] += z.getReal();
                im[i][i] += z.getImaginary();
                re[i][n] = b.getEntry(i);
            }
            for (int col = 0; col < n; col++) {
                int pivot = col;
                for (int row = col + 1; row < n; row++) {
                    if (Math.hypot(re[row][col], im[row][col]) > Math.hypot(re[pivot][col], im[pivot][col])) {
                        pivot = row;
                    }
                }
                double[] swap = re[col];
                re[col] = re[pivot];
                re[pivot] = swap;
                swap = im[col];
                im[col] = im[pivot];
                im[pivot] = swap;
                double pr = re[col][col];
                double pi = im[col][col];
                double norm = pr * pr + pi * pi;
                for (int row = col + 1; row < n; row++) {
                    // factor = m[row][col] / m[col][col]
                    double fr = (re[row][col] * pr + im[row][col] * pi) / norm;
                    double fi = (im[row][col] * pr - re[row][col] * pi) / norm;
                    for (int k = col; k <= n; k++) {
                        re[row][k] -= fr * re[col][k] - fi * im[col][k];
                        im[row][k] -= fr * im[col][k] + fi * re[col][k];
                    }
                }
            }
            double[] xr = new double[n];
            double[] xi = new double[n];
            for (int row = n - 1; row >= 0; row--) {
                double sr = re[row][n];
                double si = im[row][n];
                for (int k = row + 1; k < n; k++) {
                    sr -= re[row][k] * xr[k] - im[row][k] * xi[k];
                    si -= re[row][k] * xi[k] + im[row][k] * xr[k];
                }
                double pr = re[row][row];
                double pi = im[row][row];
                double norm = pr * pr + pi * pi;
                xr[row] = (sr * pr + si * pi) / norm;
                xi[row] = (si * pr - sr * pi) / norm;
            }
            double sumRe = d;
            double sumIm = 0.0;
            for (int i = 0; i < n; i++) {
                sumRe += c.getEntry(i) * xr[i];
                sumIm += c.getEntry(i) * xi[i];
            }
            return new Complex(sumRe, sumIm);
        }
    }
}
