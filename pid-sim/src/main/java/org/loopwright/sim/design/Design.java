package org.loopwright.sim.design;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.IntConsumer;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.RuleNotApplicable;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.pid.tuning.TuningResult;
import org.loopwright.pid.tuning.ModelRule;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;
import org.loopwright.sim.sweep.Sweep;
import org.loopwright.sim.sweep.SweepResult;
import org.loopwright.sim.study.DiscretisationStudy;

/**
 * The design procedure: candidates from every published rule that applies to the model, PI and PID
 * as the specification allows, plus the optimised design ({@link MaxIntegralGain}); each verified on
 * the sampled loop, in simulation with the device's limits and across plant uncertainty (see
 * {@link DesignExperiment}); then the recommendation.
 *
 * <p>Rules: every model rule of {@link ModelRule}; for a second-order model the rules whose paper
 * covers only first order are applied to its half-rule reduction (Skogestad 2003), as the note says,
 * and still checked on the second-order model. The optimised design for PID holds the derivative
 * time of SIMC's PID rule for the model, or AMIGO's where SIMC gives none (first order); a pure
 * integrator gets no optimised PID.
 *
 * <p>Recommendation: among the candidates that meet the constraints (stable sampled loop, Ms within
 * the limit, no unstable sweep run), the one with the smallest IAE after the load step. When none
 * does, the stable candidate with the smallest Ms, with the verdict saying so; an unstable candidate
 * is never recommended.
 *
 * <p>Thread-safe: stateless; the sweeps run on a pool of their own.
 */
public final class Design {

    /** The optimised candidate's rule name. */
    public static final String OPTIMISED_RULE = "max-integral-gain";
    /** Its source. */
    public static final String OPTIMISED_SOURCE = "largest integral gain with a stable sampled loop and Ms within the"
            + " limit (the constrained integral-gain optimisation of K.J. Astrom, T. Hagglund, Advanced PID Control,"
            + " ISA 2006, ch. 7), solved with Hipparchus";

    private Design() {
    }

    /**
     * Runs the design.
     *
     * @param model    the process model
     * @param spec     the device's limits and the design's choices
     * @param threads  threads for the sweeps
     * @param progress told of each finished sweep run (from the pool's threads)
     * @throws IllegalArgumentException for a specification the model cannot be checked with (see
     *                                  {@link DesignExperiment#of})
     */
    public static DesignResult run(DesignModel model, DesignSpec spec, int threads, IntConsumer progress) {
        DesignExperiment experiment = DesignExperiment.of(model, spec);
        List<String> notApplicable = new ArrayList<>();
        List<Proposal> proposals = proposals(model, spec, experiment, notApplicable);
        List<Candidate> candidates = new ArrayList<>();
        for (Proposal p : proposals) {
            candidates.add(verify(p, model, spec, experiment, threads, progress));
        }
        Optional<Candidate> best = recommend(candidates);
        List<DiscretisationCheck> check = best.map(c -> discretisationCheck(c, model, spec, experiment))
                .orElse(List.of());
        return new DesignResult(model, spec, experiment, candidates, notApplicable, best,
                best.map(Candidate::meetsConstraints).orElse(false), check);
    }

    /**
     * The recommendation: the smallest load IAE among the candidates that meet the constraints; when
     * none does, the stable candidate with the smallest Ms; empty when none is stable.
     */
    public static Optional<Candidate> recommend(List<Candidate> candidates) {
        Optional<Candidate> best = candidates.stream().filter(Candidate::meetsConstraints)
                .min(Comparator.comparingDouble(Candidate::loadIae));
        return best.isPresent() ? best
                : candidates.stream().filter(Candidate::stable).min(Comparator.comparingDouble(Candidate::ms));
    }

    /** The total number of progress steps {@link #run} reports at most: the sweep runs of every candidate. */
    public static int progressSteps(DesignSpec spec) {
        return spec.runs() * spec.types().size() * (ModelRule.values().length + 1);
    }

    /** A candidate before verification. */
    record Proposal(String rule, ControllerType type, String source, String note, IdealGains gains) {
        String name() {
            return rule + "-" + type.name().toLowerCase(Locale.ROOT);
        }
    }

    private static List<Proposal> proposals(DesignModel model, DesignSpec spec, DesignExperiment experiment,
            List<String> notApplicable) {
        ProcessModel m = model.model();
        List<Proposal> proposals = new ArrayList<>();
        for (ControllerType type : spec.types()) {
            for (ModelRule rule : ModelRule.values()) {
                TuningResult result = rule.tune(m, type);
                String reduced = "";
                if (result instanceof RuleNotApplicable && m instanceof SopdtModel second && rule != ModelRule.SIMC) {
                    result = rule.tune(second.halfRule(), type);
                    reduced = "on the half-rule first-order model (Skogestad 2003)";
                }
                if (result instanceof TunedGains tuned) {
                    String note = join(reduced, tuned.note());
                    proposals.add(new Proposal(rule.label(), type, rule.citation(), note, tuned.gains()));
                } else {
                    RuleNotApplicable why = (RuleNotApplicable) result;
                    notApplicable.add(rule.label() + " (" + type.name().toLowerCase(Locale.ROOT) + "): " + why.reason());
                }
            }
        }
        // the optimisations are the costly part: PI and PID side by side
        List<Optimised> optimised = spec.types().parallelStream()
                .map(type -> optimised(model, spec, experiment, type, proposals)).toList();
        for (Optimised o : optimised) {
            o.proposal().ifPresent(proposals::add);
            o.notApplicable().ifPresent(notApplicable::add);
        }
        return proposals;
    }

    /** The optimised design for one type, or why there is none. */
    record Optimised(Optional<Proposal> proposal, Optional<String> notApplicable) {
        static Optimised none(String why) {
            return new Optimised(Optional.empty(), Optional.of(why));
        }
    }

    private static Optimised optimised(DesignModel model, DesignSpec spec, DesignExperiment experiment,
            ControllerType type, List<Proposal> published) {
        String label = OPTIMISED_RULE + " (" + type.name().toLowerCase(Locale.ROOT) + "): ";
        double derivativeTime = 0.0;
        String note = "PI";
        if (type == ControllerType.PID) {
            Optional<TunedGains> source = derivativeSource(model.model());
            if (source.isEmpty()) {
                return Optimised.none(label + "no published PID rule for this model to take the derivative time from");
            }
            derivativeTime = source.get().gains().derivativeTime();
            note = "Td = " + DesignModel.num(derivativeTime) + " s held from " + source.get().rule().label()
                    + "'s PID rule (our derivative constraint)";
        }
        double kpGuess = published.stream().filter(p -> p.type() == type).mapToDouble(p -> p.gains().gain())
                .filter(g -> g > 0.0).min().orElse(1.0 / model.model().gainMagnitude());
        ControllerSettings base = experiment.simulatedSettings(IdealGains.pi(1.0, 1.0));
        MaxIntegralGain problem = new MaxIntegralGain(model.transferFunction(), base, spec.sensorDelaySamples(),
                spec.maxSensitivity(), derivativeTime);
        Optional<ParallelGains> optimum = problem.solve(kpGuess);
        if (optimum.isEmpty()) {
            return Optimised.none(label + "no gains give a stable sampled loop with Ms <= " + spec.maxSensitivity());
        }
        return new Optimised(Optional.of(new Proposal(OPTIMISED_RULE, type, OPTIMISED_SOURCE, join(String.format(
                Locale.ROOT, "Ms <= %s at h = %s s", spec.maxSensitivity(), spec.samplePeriodSeconds()), note),
                optimum.get().toIdeal())), Optional.empty());
    }

    /** The PID rule whose derivative time the optimised PID holds: SIMC's, else AMIGO's (on the half rule for SOPDT). */
    private static Optional<TunedGains> derivativeSource(ProcessModel m) {
        if (ModelRule.SIMC.tune(m, ControllerType.PID) instanceof TunedGains simc) {
            return Optional.of(simc);
        }
        ProcessModel first = m instanceof SopdtModel second ? second.halfRule() : m;
        return ModelRule.AMIGO.tune(first, ControllerType.PID) instanceof TunedGains amigo ? Optional.of(amigo)
                : Optional.empty();
    }

    private static Candidate verify(Proposal p, DesignModel model, DesignSpec spec, DesignExperiment experiment,
            int threads, IntConsumer progress) {
        ControllerSettings device = experiment.deviceSettings(p.gains());
        String text = experiment.scenarioText(experiment.simulatedSettings(p.gains()));
        Scenario scenario = DesignExperiment.scenario(text);
        ControllerSettings simulated = scenario.controller().orElseThrow();
        TransferFunction plant = scenario.linearPlant().orElseThrow();
        SampledMargins margins = LoopAnalysis.sampled(new SampledLoop(plant, simulated, simulated.samplePeriodSeconds(),
                scenario.sensor().delaySamples()));
        Optional<Trajectory> run = Optional.empty();
        Optional<ResponseMetrics> metrics = Optional.empty();
        double loadIae = Double.NaN;
        Optional<SweepResult> sweep = Optional.empty();
        if (margins.stable()) {
            Trajectory trajectory = Simulation.run(scenario);
            run = Optional.of(trajectory);
            metrics = Optional.of(ResponseMetrics.of(scenario, trajectory));
            loadIae = ResponseMetrics.loadIae(trajectory, experiment.loadAtSeconds());
            sweep = Optional.of(new Sweep(scenario, spec.spread(), spec.seed()).run(spec.runs(), threads, progress));
        }
        return new Candidate(p.name(), p.rule(), p.type(), p.source(), p.note(), p.gains(), device, text, scenario,
                margins, run, metrics, loadIae, sweep, spec.maxSensitivity());
    }

    /** Each integral (and, for PID, derivative) method at h with the recommended gains: PM, Ms, stability. */
    private static List<DiscretisationCheck> discretisationCheck(Candidate c, DesignModel model, DesignSpec spec,
            DesignExperiment experiment) {
        List<DiscretisationCheck> rows = new ArrayList<>();
        ControllerSettings simulated = c.scenario().controller().orElseThrow();
        boolean derivative = c.gains().derivativeTime() > 0.0;
        for (IntegralMethod integral : IntegralMethod.values()) {
            for (DerivativeMethod d : derivative ? DerivativeMethod.values()
                    : new DerivativeMethod[] {simulated.derivativeMethod()}) {
                boolean chosen = integral == spec.integralMethod() && d == spec.derivativeMethod();
                try {
                    ControllerSettings variant = simulated.toBuilder().integralMethod(integral).derivativeMethod(d)
                            .build();
                    SampledMargins m = LoopAnalysis.sampled(new SampledLoop(model.transferFunction(), variant,
                            variant.samplePeriodSeconds(), spec.sensorDelaySamples()));
                    rows.add(new DiscretisationCheck(integral, derivative ? d : null, chosen,
                            m.margins().gainCrossover().map(g -> g.phaseMarginDegrees()).orElse(Double.NaN),
                            m.margins().sensitivityPeak().value(), m.stable(), ""));
                } catch (IllegalArgumentException notApplicable) {
                    rows.add(new DiscretisationCheck(integral, d, chosen, Double.NaN, Double.NaN, false,
                            "not applicable: " + DiscretisationStudy.notApplicable(d, simulated.samplePeriodSeconds(),
                                    simulated.derivativeFilterTimeSeconds(), notApplicable.getMessage())));
                }
            }
        }
        return rows;
    }

    private static String join(String a, String b) {
        return a.isEmpty() ? b : b.isEmpty() ? a : a + "; " + b;
    }

}
