package org.loopwright.sim.design;

import java.util.Objects;
import java.util.Optional;

import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.IntegratingModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.sim.identify.IdentifiedModel;
import org.loopwright.sim.identify.StepTest;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.tuning.TuningEvaluation;

/**
 * The model a design works on, where it came from and, for a step test, the fit behind it.
 *
 * @param model  the process model
 * @param source {@code "step-test"}, {@code "plant-file"} or {@code "options"}
 * @param test   the step test, when the model was fitted to one
 * @param fit    the fit that was kept, when the model was fitted
 * @param choice why this model structure, in a sentence (empty when it was given)
 */
public record DesignModel(ProcessModel model, String source, Optional<StepTest> test, Optional<IdentifiedModel> fit,
        String choice) {

    /** Checks that nothing is null. */
    public DesignModel {
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(test, "test");
        Objects.requireNonNull(fit, "fit");
        Objects.requireNonNull(choice, "choice");
    }

    /** A model given directly (options or plant file). */
    public static DesignModel given(ProcessModel model, String source) {
        return new DesignModel(model, source, Optional.empty(), Optional.empty(), "");
    }

    /** {@code "fopdt"}, {@code "sopdt"} or {@code "integrating"}. */
    public String type() {
        return model instanceof FopdtModel ? "fopdt" : model instanceof SopdtModel ? "sopdt" : "integrating";
    }

    /** The model as a transfer function with its dead time. */
    public TransferFunction transferFunction() {
        return TuningEvaluation.transferFunction(model);
    }

    /** T (T1 for second order, the lag for an integrating process; NaN for a pure integrator). */
    public double timeConstantSeconds() {
        if (model instanceof FopdtModel m) {
            return m.timeConstantSeconds();
        }
        if (model instanceof SopdtModel m) {
            return m.timeConstantSeconds();
        }
        double lag = ((IntegratingModel) model).lagSeconds();
        return lag > 0.0 ? lag : Double.NaN;
    }

    /** T2 of a second-order model, NaN otherwise. */
    public double secondTimeConstantSeconds() {
        return model instanceof SopdtModel m ? m.secondTimeConstantSeconds() : Double.NaN;
    }

    /** The fit's RMSE, NaN without a fit. */
    public double rmse() {
        return fit.map(IdentifiedModel::rmse).orElse(Double.NaN);
    }

    /** The fit's R², NaN without a fit. */
    public double rSquared() {
        return fit.map(IdentifiedModel::rSquared).orElse(Double.NaN);
    }

    /** The sum of the dead time and the time constants: the model's time scale, seconds. */
    public double timeScaleSeconds() {
        double sum = model.deadTimeSeconds();
        if (!Double.isNaN(timeConstantSeconds())) {
            sum += timeConstantSeconds();
        }
        if (!Double.isNaN(secondTimeConstantSeconds())) {
            sum += secondTimeConstantSeconds();
        }
        return sum;
    }

    /** The model in words, such as "fopdt: K = 0.05, T = 2 s, L = 0.4 s". */
    public String describe() {
        StringBuilder text = new StringBuilder(type()).append(": K = ").append(num(model.processGain()));
        if (model instanceof IntegratingModel) {
            text.append(" per s");
        }
        if (!Double.isNaN(timeConstantSeconds())) {
            text.append(model instanceof SopdtModel ? ", T1 = " : model instanceof IntegratingModel ? ", lag T = "
                    : ", T = ").append(num(timeConstantSeconds())).append(" s");
        }
        if (!Double.isNaN(secondTimeConstantSeconds())) {
            text.append(", T2 = ").append(num(secondTimeConstantSeconds())).append(" s");
        }
        return text.append(", L = ").append(num(model.deadTimeSeconds())).append(" s").toString();
    }

    static String num(double value) {
        return String.format(java.util.Locale.ROOT, "%.4g", value);
    }
}
