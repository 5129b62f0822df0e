package org.loopwright.sim.tuning;

import java.util.Locale;
import java.util.Optional;

import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

/**
 * Turns a rule's gains into controller settings and checks them: margins and Ms of the continuous
 * loop and of the sampled loop with its closed-loop poles (pid-sim's frequency analysis), and a unit setpoint step and a unit load step simulated in
 * closed loop on the model (or the scenario's own profile on its plant).
 *
 * <p>Choices of ours for a model K·e^(−sL)/(Ts + 1): sample period h = min(T, L)/20 (T/20 without
 * dead time), a common rule of thumb of 10–20 samples per dead time or time constant; each run lasts
 * 20·(T + L). A negative K gets direct action.
 *
 * <p>Thread-safe: stateless.
 */
public final class TuningEvaluation {

    /** Samples per dead time (or per time constant when it is shorter, or without dead time). */
    public static final double SAMPLES_PER_LAG = 20.0;
    /** Simulated time, in multiples of T + L. */
    public static final double RUN_LENGTH = 20.0;
    /**
     * The most samples a check by simulation may take: RUN_LENGTH·(T + L)/h = 400·(T + L)/min(T, L), so
     * T and L may differ by a factor of about 2,500 at most; beyond, the work (and the memory of the
     * trajectory) would grow without bound.
     */
    public static final long MAX_SAMPLES = 1_000_000L;

    private TuningEvaluation() {
    }

    /** The model as a transfer function K/(Ts + 1) with dead time L. */
    public static TransferFunction transferFunction(FopdtModel model) {
        return new TransferFunction(new double[] {model.processGain()},
                new double[] {model.timeConstantSeconds(), 1.0}, model.deadTimeSeconds());
    }

    /** The sample period used for a model: min(T, L)/20, or T/20 without dead time. */
    public static double samplePeriodSeconds(FopdtModel model) {
        double l = model.deadTimeSeconds();
        double fastest = l > 0.0 ? Math.min(model.timeConstantSeconds(), l) : model.timeConstantSeconds();
        return fastest / SAMPLES_PER_LAG;
    }

    /** Settings with the rule's gains (ideal form), the given sample period and action, and defaults otherwise. */
    public static ControllerSettings settings(TunedGains tuning, double samplePeriodSeconds, Action action) {
        return ControllerSettings.builder().gains(tuning.gains()).samplePeriodSeconds(samplePeriodSeconds)
                .action(action).build();
    }

    /** The samples a check of settings on this model simulates, per run. */
    public static double samplesFor(FopdtModel model) {
        return RUN_LENGTH * (model.timeConstantSeconds() + model.deadTimeSeconds()) / samplePeriodSeconds(model);
    }

    /**
     * Checks a rule's gains on the model it was tuned for.
     *
     * @throws IllegalArgumentException if the check would take more than {@link #MAX_SAMPLES} samples
     */
    public static TuningCandidate onModel(TunedGains tuning, FopdtModel model) {
        if (samplesFor(model) > MAX_SAMPLES) {
            throw new IllegalArgumentException("the model's time constant and dead time are too far apart to check"
                    + " by simulation (" + String.format(Locale.ROOT, "%.3g", samplesFor(model))
                    + " samples; the limit is " + MAX_SAMPLES + ")");
        }
        Action action = model.processGain() < 0.0 ? Action.DIRECT : Action.REVERSE;
        ControllerSettings settings = settings(tuning, samplePeriodSeconds(model), action);
        TransferFunction plant = transferFunction(model);
        double duration = RUN_LENGTH * (model.timeConstantSeconds() + model.deadTimeSeconds());
        Scenario setpointStep = Scenario.setpointStep(plant, settings, 1.0, duration);
        Trajectory setpointRun = Simulation.run(setpointStep);
        Trajectory loadRun = Simulation.run(Scenario.loadStep(plant, settings, 1.0, duration));
        return new TuningCandidate(tuning, settings, Optional.of(LoopAnalysis.continuous(plant, settings)),
                sampledMargins(Optional.of(SampledLoop.of(plant, settings))),
                Optional.of(ResponseMetrics.of(setpointStep, setpointRun)),
                Optional.of(new TuningCandidate.LoadResponse(ResponseMetrics.loadIae(loadRun, 0.0),
                        ResponseMetrics.peakDeviation(loadRun, 0.0))));
    }

    /**
     * Checks a rule's gains on a scenario: its controller's other settings are kept and the gains
     * replaced; the scenario's own setpoint profile and disturbances are run; margins when its plant
     * is linear.
     */
    public static TuningCandidate onScenario(TunedGains tuning, Scenario scenario, ControllerSettings base) {
        ControllerSettings settings = base.toBuilder().gains(tuning.gains()).build();
        Scenario run = scenario.withController(settings);
        Trajectory trajectory = Simulation.run(run);
        double loadAt = run.disturbances().isEmpty() ? Double.NaN : run.disturbances().get(0).atSeconds();
        Optional<TuningCandidate.LoadResponse> load = Double.isNaN(loadAt) ? Optional.empty()
                : Optional.of(new TuningCandidate.LoadResponse(ResponseMetrics.loadIae(trajectory, loadAt),
                        ResponseMetrics.peakDeviation(trajectory, loadAt)));
        return new TuningCandidate(tuning, settings,
                run.linearPlant().map(plant -> LoopAnalysis.continuous(plant, settings)),
                sampledMargins(run.sampledLoop()),
                Optional.of(ResponseMetrics.of(run, trajectory)), load);
    }

    /** A rule's gains with no model to check them on (tuned from an ultimate point alone). */
    public static TuningCandidate withoutModel(TunedGains tuning, double samplePeriodSeconds) {
        return new TuningCandidate(tuning, settings(tuning, samplePeriodSeconds, Action.REVERSE), Optional.empty(),
                Optional.empty(), Optional.empty(), Optional.empty());
    }

    /** The sampled loop's margins and poles; empty when there is no loop or it is beyond the analysis' limits. */
    private static Optional<SampledMargins> sampledMargins(Optional<SampledLoop> loop) {
        try {
            return loop.map(LoopAnalysis::sampled);
        } catch (IllegalArgumentException beyondLimits) {
            return Optional.empty();
        }
    }
}
