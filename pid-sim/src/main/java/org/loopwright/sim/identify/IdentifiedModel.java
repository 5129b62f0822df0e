package org.loopwright.sim.identify;

import java.util.Arrays;
import java.util.Objects;

import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.sim.plant.TransferFunction;

/**
 * A model fitted to a step test, with its fit quality. The response it predicts is
 * y(t) = baseline + gain·Δu·s(t − tstep − L), with s the unit step response of the lag(s):
 * 1 − e^(−τ/T) for first order, 1 − (T1·e^(−τ/T1) − T2·e^(−τ/T2))/(T1 − T2) for second order
 * (1 − (1 + τ/T)·e^(−τ/T) when T1 = T2), and 0 for τ &le; 0.
 *
 * @param kind            first or second order plus dead time
 * @param gain            K, output units per input unit
 * @param timeConstants   T (one value) or T1 &ge; T2 (two values), seconds
 * @param deadTimeSeconds L
 * @param baseline        the output before the step
 * @param step            the step the model responds to
 * @param rmse            root-mean-square residual over every sample, output units
 * @param rSquared        1 − (residual sum of squares)/(total sum of squares about the mean)
 */
public record IdentifiedModel(ModelKind kind, double gain, double[] timeConstants, double deadTimeSeconds,
                              double baseline, DetectedStep step, double rmse, double rSquared) {

    /** Copies the time constants and checks their number against the kind. */
    public IdentifiedModel {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(step, "step");
        timeConstants = timeConstants.clone();
        if (timeConstants.length != kind.order()) {
            throw new IllegalArgumentException(kind + " needs " + kind.order() + " time constants: "
                    + Arrays.toString(timeConstants));
        }
    }

    @Override
    public double[] timeConstants() {
        return timeConstants.clone();
    }

    /** The output the model predicts at a time. */
    public double responseAt(double timeSeconds) {
        return baseline + gain * step.change() * unitStep(timeConstants, timeSeconds - step.timeSeconds() - deadTimeSeconds);
    }

    /** The model as a transfer function with its dead time (the baseline and step are not part of it). */
    public TransferFunction transferFunction() {
        double[] denominator = kind == ModelKind.FOPDT
                ? new double[] {timeConstants[0], 1.0}
                : new double[] {timeConstants[0] * timeConstants[1], timeConstants[0] + timeConstants[1], 1.0};
        return new TransferFunction(new double[] {gain}, denominator, deadTimeSeconds);
    }

    /**
     * The first-order-plus-dead-time model for the tuning rules: this model itself for FOPDT; for
     * SOPDT, Skogestad's half rule (2003): T = T1 + T2/2, L = L + T2/2.
     */
    public FopdtModel toFopdt() {
        if (kind == ModelKind.FOPDT) {
            return new FopdtModel(gain, timeConstants[0], deadTimeSeconds);
        }
        return new FopdtModel(gain, timeConstants[0] + timeConstants[1] / 2.0, deadTimeSeconds + timeConstants[1] / 2.0);
    }

    /** The model for the tuning rules: first or second order plus dead time, as fitted. */
    public ProcessModel processModel() {
        return kind == ModelKind.FOPDT ? toFopdt()
                : new SopdtModel(gain, timeConstants[0], timeConstants[1], deadTimeSeconds);
    }

    /** The unit step response of one or two lags at τ seconds after the dead time. */
    static double unitStep(double[] timeConstants, double tau) {
        if (tau <= 0.0) {
            return 0.0;
        }
        double t1 = timeConstants[0];
        if (timeConstants.length == 1) {
            return -Math.expm1(-tau / t1);
        }
        double t2 = timeConstants[1];
        if (Math.abs(t1 - t2) <= 1e-6 * Math.max(t1, t2)) {
            double t = 0.5 * (t1 + t2);
            return 1.0 - (1.0 + tau / t) * Math.exp(-tau / t);
        }
        return 1.0 - (t1 * Math.exp(-tau / t1) - t2 * Math.exp(-tau / t2)) / (t1 - t2);
    }

    @Override
    public boolean equals(Object other) {
        return other instanceof IdentifiedModel m && kind == m.kind && gain == m.gain
                && Arrays.equals(timeConstants, m.timeConstants) && deadTimeSeconds == m.deadTimeSeconds
                && baseline == m.baseline && step.equals(m.step) && rmse == m.rmse && rSquared == m.rSquared;
    }

    @Override
    public int hashCode() {
        return Objects.hash(kind, gain, Arrays.hashCode(timeConstants), deadTimeSeconds, baseline, step, rmse, rSquared);
    }

    @Override
    public String toString() {
        return "IdentifiedModel[kind=" + kind + ", gain=" + gain + ", timeConstants=" + Arrays.toString(timeConstants)
                + ", deadTimeSeconds=" + deadTimeSeconds + ", baseline=" + baseline + ", rmse=" + rmse
                + ", rSquared=" + rSquared + "]";
    }
}
