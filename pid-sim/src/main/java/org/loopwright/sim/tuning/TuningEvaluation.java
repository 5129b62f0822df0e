package org.loopwright.sim.tuning;

import java.util.Locale;
import java.util.Optional;

import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.IntegratingModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

/**
 * Turns a rule's gains into controller settings and checks them: margins and Ms of the loop on the
 * model (pid-sim's frequency analysis: of the sampled loop when the sample period was given, else of
 * the continuous design), and a unit setpoint step and a unit load step simulated in closed loop on
 * the model (or the scenario's own profile on its plant).
 *
 * <p>Choices of ours when no sample period is given: h = a twentieth of the fastest of the dead time
 * and the time constants (of the time constants alone without dead time), a common rule of thumb of
 * 10–20 samples per dead time or time constant. Each run lasts 20·(sum of time constants + L), twice
 * that for an integrating process. A negative K gets direct action.
 *
 * <p>Thread-safe: stateless.
 */
public final class TuningEvaluation {

    /** Samples per dead time (or per time constant when it is shorter, or without dead time). */
    public static final double SAMPLES_PER_LAG = 20.0;
    /** Simulated time, in multiples of the time constants plus L (twice that for an integrating process). */
    public static final double RUN_LENGTH = 20.0;
    /**
     * The most samples a check by simulation may take a run: with the rule-of-thumb period the time
     * constants and the dead time may then differ by a factor of about 2,500; beyond, the work (and the
     * memory of the trajectory) would grow without bound.
     */
    public static final long MAX_SAMPLES = 1_000_000L;

    private TuningEvaluation() {
    }

    /** The model as a transfer function with its dead time. */
    public static TransferFunction transferFunction(ProcessModel model) {
        double k = model.processGain();
        double l = model.deadTimeSeconds();
        if (model instanceof FopdtModel m) {
            return TransferFunction.fopdt(k, m.timeConstantSeconds(), l);
        }
        if (model instanceof SopdtModel m) {
            return TransferFunction.sopdt(k, m.timeConstantSeconds(), m.secondTimeConstantSeconds(), l);
        }
        IntegratingModel m = (IntegratingModel) model;
        return m.lagSeconds() == 0.0 ? TransferFunction.integrating(k, l)
                : new TransferFunction(new double[] {k}, new double[] {m.lagSeconds(), 1.0, 0.0}, l);
    }

    /** The time constants of a model (none for a pure integrator). */
    static double[] timeConstants(ProcessModel model) {
        if (model instanceof FopdtModel m) {
            return new double[] {m.timeConstantSeconds()};
        }
        if (model instanceof SopdtModel m) {
            return new double[] {m.timeConstantSeconds(), m.secondTimeConstantSeconds()};
        }
        double lag = ((IntegratingModel) model).lagSeconds();
        return lag > 0.0 ? new double[] {lag} : new double[0];
    }

    /**
     * The sample period used for a model when none is given: a twentieth of the fastest of L and the
     * time constants (zeros left out); NaN for a pure integrator without dead time.
     */
    public static double samplePeriodSeconds(ProcessModel model) {
        double fastest = model.deadTimeSeconds() > 0.0 ? model.deadTimeSeconds() : Double.POSITIVE_INFINITY;
        for (double t : timeConstants(model)) {
            fastest = Math.min(fastest, t);
        }
        return Double.isInfinite(fastest) ? Double.NaN : fastest / SAMPLES_PER_LAG;
    }

    /** How long the checks simulate a model, in seconds. */
    public static double runSeconds(ProcessModel model) {
        double span = model.deadTimeSeconds();
        for (double t : timeConstants(model)) {
            span += t;
        }
        return (model instanceof IntegratingModel ? 2.0 : 1.0) * RUN_LENGTH * span;
    }

    /** Settings with the rule's gains (ideal form), the given sample period and action, and defaults otherwise. */
    public static ControllerSettings settings(TunedGains tuning, double samplePeriodSeconds, Action action) {
        return ControllerSettings.builder().gains(tuning.gains()).samplePeriodSeconds(samplePeriodSeconds)
                .action(action).build();
    }

    /** The action a model needs: direct for a negative process gain, reverse otherwise. */
    public static Action action(ProcessModel model) {
        return model.processGain() < 0.0 ? Action.DIRECT : Action.REVERSE;
    }

    /**
     * Checks a rule's gains on the model it was tuned for, at the rule-of-thumb sample period, with
     * the margins of the continuous design.
     */
    public static TuningCandidate onModel(TunedGains tuning, ProcessModel model) {
        ControllerSettings base = ControllerSettings.builder().gains(tuning.gains())
                .samplePeriodSeconds(samplePeriodSeconds(model)).action(action(model)).build();
        return onModel(tuning, model, base, false);
    }

    /**
     * Checks a rule's gains on the model it was tuned for with {@code base}'s other settings (sample
     * period, limits, methods).
     *
     * @param sampledMargins whether the margins are those of the loop sampled at base's period (true)
     *                       or of the continuous design (false)
     */
    public static TuningCandidate onModel(TunedGains tuning, ProcessModel model, ControllerSettings base,
            boolean sampledMargins) {
        double samples = runSeconds(model) / base.samplePeriodSeconds();
        if (samples > MAX_SAMPLES) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "checking the settings on the model would"
                    + " simulate %.3g samples a run (%s s at h = %s s); the limit is %d: the model's time constants and"
                    + " dead time are too far apart, or the sample period too short", samples, runSeconds(model),
                    base.samplePeriodSeconds(), MAX_SAMPLES));
        }
        ControllerSettings settings = base.toBuilder().gains(tuning.gains()).action(action(model)).build();
        TransferFunction plant = transferFunction(model);
        double duration = runSeconds(model);
        Scenario setpointStep = Scenario.setpointStep(plant, settings, 1.0, duration);
        Trajectory setpointRun = Simulation.run(setpointStep);
        Trajectory loadRun = Simulation.run(Scenario.loadStep(plant, settings, 1.0, duration));
        Optional<SampledMargins> sampled = sampled(Optional.of(SampledLoop.of(plant, settings)));
        StabilityMargins margins = sampledMargins && sampled.isPresent() ? sampled.get().margins()
                : LoopAnalysis.continuous(plant, settings);
        return new TuningCandidate(tuning, settings, Optional.of(margins), sampledMargins && sampled.isPresent(),
                sampled,
                Optional.of(ResponseMetrics.of(setpointStep, setpointRun)),
                Optional.of(new TuningCandidate.LoadResponse(ResponseMetrics.loadIae(loadRun, 0.0),
                        ResponseMetrics.peakDeviation(loadRun, 0.0))));
    }

    /**
     * Checks a rule's gains on a scenario: its controller's other settings are kept and the gains
     * replaced; the scenario's own setpoint profile and disturbances are run; margins of the loop
     * sampled at the scenario's period, its sensor delay counted, when its plant is linear.
     */
    public static TuningCandidate onScenario(TunedGains tuning, Scenario scenario, ControllerSettings base) {
        ControllerSettings settings = base.toBuilder().gains(tuning.gains()).build();
        Scenario run = scenario.withController(settings);
        Trajectory trajectory = Simulation.run(run);
        double loadAt = run.disturbances().isEmpty() ? Double.NaN : run.disturbances().get(0).atSeconds();
        Optional<TuningCandidate.LoadResponse> load = Double.isNaN(loadAt) ? Optional.empty()
                : Optional.of(new TuningCandidate.LoadResponse(ResponseMetrics.loadIae(trajectory, loadAt),
                        ResponseMetrics.peakDeviation(trajectory, loadAt)));
        Optional<SampledMargins> sampled = sampled(run.sampledLoop());
        return new TuningCandidate(tuning, settings, sampled.map(SampledMargins::margins), true, sampled,
                Optional.of(ResponseMetrics.of(run, trajectory)), load);
    }

    /** A rule's gains with no model to check them on (tuned from an ultimate point alone). */
    public static TuningCandidate withoutModel(TunedGains tuning, double samplePeriodSeconds) {
        return new TuningCandidate(tuning, settings(tuning, samplePeriodSeconds, Action.REVERSE), Optional.empty(),
                false, Optional.empty(), Optional.empty(), Optional.empty());
    }

    /** The sampled loop's margins and poles; empty when there is no loop or it is beyond the analysis' limits. */
    private static Optional<SampledMargins> sampled(Optional<SampledLoop> loop) {
        try {
            return loop.map(LoopAnalysis::sampled);
        } catch (IllegalArgumentException beyondLimits) {
            return Optional.empty();
        }
    }
}
