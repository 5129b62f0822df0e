package org.loopwright.sim.identify;

import org.hipparchus.exception.MathIllegalStateException;
import org.hipparchus.linear.Array2DRowRealMatrix;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresBuilder;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LeastSquaresProblem;
import org.hipparchus.optim.nonlinear.vector.leastsquares.LevenbergMarquardtOptimizer;
import org.hipparchus.optim.nonlinear.vector.leastsquares.MultivariateJacobianFunction;
import org.hipparchus.util.Pair;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.SmithTwoPoint;
import org.loopwright.sim.config.InputFileException;

/**
 * Fits a first- or second-order-plus-dead-time model to a step test by least squares (Hipparchus
 * {@link LevenbergMarquardtOptimizer}), started from Smith's two-point estimate.
 *
 * <p>Parameters: gain, time constant(s), dead time and the output's baseline, all fitted to every
 * sample. The two-point start is taken on the output smoothed by a centred moving average over
 * 1 % of the record on each side of the step (never across it), so noise does not trigger the
 * 28.3 % crossing early; the fit itself uses the raw samples. The SOPDT start splits the two-point T as T2 = 0.3·T, T1 = T − T2/2 and L − T2/2
 * (the half rule of Skogestad 2003 run backwards). Derivatives are central differences.
 *
 * <p>Thread-safe: stateless.
 */
public final class StepIdentification {

    /** Most evaluations of the model the optimiser may make. */
    public static final int MAX_EVALUATIONS = 20_000;

    private StepIdentification() {
    }

    /**
     * Identifies a model from a step test.
     *
     * @throws InputFileException when the data holds no clean step, the output does not respond,
     *                            or the fit does not converge
     */
    public static IdentifiedModel identify(StepTest test, ModelKind kind) {
        DetectedStep step = DetectedStep.find(test);
        double[] t = test.timesSeconds();
        double[] y = test.outputs();
        FopdtModel start = twoPointStart(test, step);
        double span = t[t.length - 1] - t[0];
        double baseline = mean(y, 0, step.index());
        double[] p0 = kind == ModelKind.FOPDT
                ? new double[] {start.processGain(), start.timeConstantSeconds(), start.deadTimeSeconds(), baseline}
                : sopdtStart(start, baseline);
        Response response = new Response(kind, t, step, span, Math.abs(start.processGain() * step.change()));
        LeastSquaresProblem problem = new LeastSquaresBuilder()
                .start(p0)
                .model(response)
                .target(y)
                .parameterValidator(response::clamp)
                .maxEvaluations(MAX_EVALUATIONS)
                .maxIterations(MAX_EVALUATIONS)
                .build();
        LeastSquaresOptimizer.Optimum optimum;
        try {
            optimum = new LevenbergMarquardtOptimizer().optimize(problem);
        } catch (MathIllegalStateException e) {
            throw InputFileException.whole(test.fileName(), "the least-squares fit did not converge within "
                    + MAX_EVALUATIONS + " evaluations (" + e.getMessage() + ")", e);
        }
        double[] p = response.clamp(optimum.getPoint()).toArray();
        double[] predicted = response.values(p);
        double residual = 0.0;
        double meanOutput = mean(y, 0, y.length);
        double total = 0.0;
        for (int i = 0; i < y.length; i++) {
            residual += (y[i] - predicted[i]) * (y[i] - predicted[i]);
            total += (y[i] - meanOutput) * (y[i] - meanOutput);
        }
        double[] timeConstants = kind == ModelKind.FOPDT ? new double[] {p[1]} : new double[] {p[1], p[2]};
        int lead = kind.order() + 1;
        return new IdentifiedModel(kind, p[0], timeConstants, p[lead], p[lead + 1], step,
                Math.sqrt(residual / y.length), 1.0 - residual / total);
    }

    private static FopdtModel twoPointStart(StepTest test, DetectedStep step) {
        double[] y = test.outputs();
        int half = Math.max(0, y.length / 200);
        double[] smoothed = new double[y.length];
        for (int i = 0; i < y.length; i++) {
            // never across the step: a response shorter than the window would be moved ahead of the step
            boolean after = i >= step.index();
            int from = Math.max(after ? step.index() : 0, i - half);
            int to = Math.min(after ? y.length : step.index(), i + half + 1);
            smoothed[i] = mean(y, from, to);
        }
        try {
            return SmithTwoPoint.estimate(test.timesSeconds(), smoothed, step.timeSeconds(), step.change());
        } catch (InvalidSettingException e) {
            throw InputFileException.whole(test.fileName(), "column 'output' shows no response to the step at time="
                    + step.timeSeconds() + " (" + e.getMessage() + ")", e);
        }
    }

    private static double[] sopdtStart(FopdtModel start, double baseline) {
        double t = start.timeConstantSeconds();
        double t2 = 0.3 * t;
        double l = Math.max(0.0, start.deadTimeSeconds() - t2 / 2.0);
        return new double[] {start.processGain(), t - t2 / 2.0, t2, l, baseline};
    }

    private static double mean(double[] values, int from, int to) {
        if (to <= from) {
            return values[from];
        }
        double sum = 0.0;
        for (int i = from; i < to; i++) {
            sum += values[i];
        }
        return sum / (to - from);
    }

    /** The model's predicted outputs at the sample times and their Jacobian by central differences. */
    private static final class Response implements MultivariateJacobianFunction {
        private final ModelKind kind;
        private final double[] times;
        private final DetectedStep step;
        private final double span;
        private final double outputScale;

        Response(ModelKind kind, double[] times, DetectedStep step, double span, double outputScale) {
            this.kind = kind;
            this.times = times;
            this.step = step;
            this.span = span;
            this.outputScale = outputScale;
        }

        double[] values(double[] p) {
            int lead = kind.order() + 1;
            double[] lags = kind == ModelKind.FOPDT ? new double[] {p[1]} : new double[] {p[1], p[2]};
            double gain = p[0] * step.change();
            double deadTime = p[lead];
            double baseline = p[lead + 1];
            double[] out = new double[times.length];
            for (int i = 0; i < times.length; i++) {
                out[i] = baseline + gain * IdentifiedModel.unitStep(lags, times[i] - step.timeSeconds() - deadTime);
            }
            return out;
        }

        @Override
        public Pair<RealVector, RealMatrix> value(RealVector point) {
            double[] p = point.toArray();
            double[] f = values(p);
            double[][] jacobian = new double[times.length][p.length];
            for (int j = 0; j < p.length; j++) {
                double delta = 1e-6 * Math.max(Math.abs(p[j]), scale(j, p));
                double[] up = p.clone();
                double[] down = p.clone();
                up[j] += delta;
                down[j] -= delta;
                double[] fUp = values(up);
                double[] fDown = values(down);
                for (int i = 0; i < times.length; i++) {
                    jacobian[i][j] = (fUp[i] - fDown[i]) / (2.0 * delta);
                }
            }
            return new Pair<>(new ArrayRealVector(f, false), new Array2DRowRealMatrix(jacobian, false));
        }

        /** The size of a parameter's natural unit: the record's span for times, the output change otherwise. */
        private double scale(int j, double[] p) {
            boolean time = j >= 1 && j <= kind.order() + 1;
            return time ? span : Math.max(outputScale, Math.abs(p[0]));
        }

        /** Keeps the time constants positive and ordered, and the dead time within the record. */
        RealVector clamp(RealVector point) {
            double[] p = point.toArray();
            double smallest = 1e-6 * span;
            for (int j = 1; j <= kind.order(); j++) {
                p[j] = Math.min(Math.max(p[j], smallest), 100.0 * span);
            }
            if (kind == ModelKind.SOPDT && p[2] > p[1]) {
                double swap = p[1];
                p[1] = p[2];
                p[2] = swap;
            }
            int lead = kind.order() + 1;
            p[lead] = Math.min(Math.max(p[lead], 0.0), span);
            return new ArrayRealVector(p, false);
        }
    }
}
