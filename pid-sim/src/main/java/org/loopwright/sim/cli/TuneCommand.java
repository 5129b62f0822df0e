package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.function.Supplier;
import java.util.stream.Collectors;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.IntegratingModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.pid.tuning.RuleNotApplicable;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.pid.tuning.TuningResult;
import org.loopwright.pid.tuning.ModelRule;
import org.loopwright.pid.tuning.TuningRule;
import org.loopwright.pid.tuning.UltimatePointRule;
import org.loopwright.pid.tuning.UltimatePoint;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.tuning.TuningCandidate;
import org.loopwright.sim.tuning.TuningEvaluation;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code tune}: PID settings from a process model (first or second order plus dead time, or
 * integrating) or an ultimate point (Ku, Pu) by the published rules, each checked on the model: the
 * settings in ideal, parallel and series form, the margins and Ms of the loop (sampled at
 * {@code --sample-period} when given, else of the continuous design), and the figures of a unit
 * setpoint step and a unit load step in simulation (see {@link TuningEvaluation}). Without
 * {@code --rule} every rule is listed, those that do not apply with the reason. Exit code 2 for bad
 * input, including a rule that does not apply to the model.
 */
@Command(name = "tune", mixinStandardHelpOptions = true,
        description = {"PID settings from a model (K, T, L; or K, T, T2, L; or an integrating K, L) or an ultimate"
                + " point (Ku, Pu) by published rules, checked on the model: margins, Ms, setpoint- and load-step"
                + " figures.",
                "Rules: simc, amigo, lambda, ziegler-nichols, cohen-coon (from a model; only simc covers second-order"
                        + " and integrating models); ziegler-nichols, tyreus-luyben (from an ultimate point)."})
public final class TuneCommand implements Callable<Integer> {

    /** Sample period for settings tuned from an ultimate point alone: Pu divided by this. */
    public static final double SAMPLES_PER_ULTIMATE_PERIOD = 50.0;

    @Spec
    private CommandSpec spec;

    @Mixin
    private ModelOptions modelOptions;

    @Option(names = "--model-file", paramLabel = "FILE.json",
            description = "Read the model from the output of identify --json instead of K, T, L.")
    private Path modelFile;

    @Option(names = "--sample-period", paramLabel = "H",
            description = "The controller's sample period in seconds: margins of the loop sampled at H; needed by"
                    + " --write-controller (default for the checks: a twentieth of the fastest of L and T).")
    private Double samplePeriod;

    @Option(names = "--ultimate-gain", paramLabel = "KU", description = "Ultimate gain Ku.")
    private Double ultimateGain;

    @Option(names = "--ultimate-period", paramLabel = "PU", description = "Ultimate period Pu in seconds.")
    private Double ultimatePeriod;

    @Option(names = "--rule", paramLabel = "R", completionCandidates = OptionWords.RuleLabels.class,
            description = "One rule (${COMPLETION-CANDIDATES}); without it, every rule that applies.")
    private String rule;

    @Option(names = "--type", paramLabel = "TYPE", defaultValue = "pi", converter = OptionWords.ControllerTypes.class,
            completionCandidates = OptionWords.ControllerTypes.class,
            description = "${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
    private ControllerType controllerType;

    @Option(names = "--closed-loop-time", paramLabel = "TC",
            description = "SIMC's tau_c (default: the dead time L, as Skogestad 2003 recommends) or lambda's lambda"
                    + " (default: max(T, 1.7 L) for PI, max(T, 0.8 L) for PID), seconds.")
    private Double closedLoopTime;

    @Option(names = "--write-controller", paramLabel = "FILE.yaml",
            description = "Write the settings as a controller file that simulate and replay accept (needs --rule"
                    + " and --sample-period).")
    private Path controllerOut;

    @Mixin
    private JsonOption output;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        boolean fromOptions = modelOptions.given();
        boolean fromModel = fromOptions || modelFile != null;
        boolean fromPoint = ultimateGain != null || ultimatePeriod != null;
        if (fromModel == fromPoint) {
            throw new InputException("give either a model (--process-gain, --time-constant, --dead-time; or"
                    + " --model-file) or --ultimate-gain and --ultimate-period");
        }
        if (fromOptions && modelFile != null) {
            throw new InputException("--model-file excludes --process-gain, --time-constant, --second-time-constant,"
                    + " --integrating and --dead-time: --model-file=" + modelFile);
        }
        if (fromPoint && (ultimateGain == null || ultimatePeriod == null)) {
            throw new InputException("an ultimate point needs both --ultimate-gain and --ultimate-period");
        }
        if (controllerOut != null && rule == null) {
            throw new InputException("--write-controller needs --rule: which rule's settings to write");
        }
        if (controllerOut != null && samplePeriod == null) {
            throw new InputException("--write-controller needs --sample-period: the controller's period is the device's"
                    + " choice, not one to invent");
        }
        if (closedLoopTime != null && rule != null && !rule.equals("simc") && !rule.equals("lambda")) {
            throw new InputException("--closed-loop-time applies to the simc and lambda rules only: --rule=" + rule);
        }
        if (closedLoopTime != null && !(closedLoopTime > 0.0 && Double.isFinite(closedLoopTime))) {
            throw new InputException("--closed-loop-time must be finite and > 0 (omit it for the rule's default):"
                    + " --closed-loop-time=" + closedLoopTime);
        }
        double designTime = closedLoopTime == null ? Double.NaN : closedLoopTime;
        List<TuningCandidate> candidates = new ArrayList<>();
        List<RuleNotApplicable> skipped = new ArrayList<>();
        ProcessModel model = modelFile != null ? ModelFile.read(modelFile) : fromOptions
                ? modelOptions.model() : null;
        UltimatePoint point = fromPoint ? inOptionTerms(() -> new UltimatePoint(ultimateGain, ultimatePeriod)) : null;
        ControllerSettings base = fromModel ? baseSettings(model) : null;
        if (fromModel && TuningEvaluation.runSeconds(model) / base.samplePeriodSeconds()
                > TuningEvaluation.MAX_SAMPLES) {
            throw new InputException(String.format(Locale.ROOT, "the model's time constants, --dead-time and"
                    + " --sample-period must keep the check by simulation within %d samples a run: %.3g s at"
                    + " h = %s s would be %.3g", TuningEvaluation.MAX_SAMPLES, TuningEvaluation.runSeconds(model),
                    base.samplePeriodSeconds(), TuningEvaluation.runSeconds(model) / base.samplePeriodSeconds()));
        }
        List<TuningResult> results = new ArrayList<>();
        if (fromModel) {
            for (ModelRule r : rule == null ? ModelRule.values() : new ModelRule[] {modelRule(rule)}) {
                results.add(r.tune(model, controllerType, designTime));
            }
        } else {
            for (UltimatePointRule r : rule == null ? UltimatePointRule.values()
                    : new UltimatePointRule[] {ultimatePointRule(rule)}) {
                results.add(r.tune(point, controllerType));
            }
        }
        for (TuningResult result : results) {
            if (result instanceof TunedGains tuned) {
                candidates.add(fromModel ? TuningEvaluation.onModel(tuned, model, base, samplePeriod != null)
                        : TuningEvaluation.withoutModel(tuned, samplePeriod != null ? samplePeriod
                                : ultimatePeriod / SAMPLES_PER_ULTIMATE_PERIOD));
            } else {
                skipped.add((RuleNotApplicable) result);
            }
        }
        if (rule != null && candidates.isEmpty()) {
            RuleNotApplicable why = skipped.get(0);
            throw new InputException(why.rule().label() + " does not apply: " + why.reason() + " (" + why.citation() + ")");
        }
        if (controllerOut != null) {
            if (candidates.get(0).stable().orElse(true) == Boolean.FALSE) {
                throw new InputException("--write-controller: " + candidates.get(0).tuning().rule().label()
                        + " makes the sampled loop UNSTABLE at --sample-period " + samplePeriod + "; no file written");
            }
            write(controllerOut, ControllerFile.toYaml(candidates.get(0).settings()));
        }
        if (output.json()) {
            out.println(JsonOutput.text(rule == null ? TuningReport.json(candidates)
                    : TuningReport.json(candidates.get(0))));
        } else {
            out.println(fromModel
                    ? "Model: " + describe(model) + " (sample period " + TuningReport.num(base.samplePeriodSeconds())
                            + " s" + (samplePeriod == null ? ", a twentieth of the fastest of L and T," : "")
                            + " in simulation)"
                    : "Ultimate point: Ku=" + ultimateGain + ", Pu=" + ultimatePeriod + " s (no model: no margins"
                            + " or simulation; give K, T, L for those)");
            if (rule == null) {
                TuningReport.printTable(out, candidates, skipped);
            } else {
                TuningReport.printOne(out, candidates.get(0));
            }
            if (controllerOut != null) {
                out.println("Wrote " + controllerOut);
            }
        }
        out.flush();
        return 0;
    }

    /** The settings every rule's gains go into: the sample period, the output limits, the action. */
    private ControllerSettings baseSettings(ProcessModel model) {
        double h = samplePeriod != null ? samplePeriod : TuningEvaluation.samplePeriodSeconds(model);
        if (!(h > 0.0 && Double.isFinite(h))) {
            throw new InputException(samplePeriod != null
                    ? "--sample-period must be finite and > 0: --sample-period=" + samplePeriod
                    : "a pure integrator without dead time has no time scale: give --sample-period");
        }
        double min = modelOptions.outputMin();
        double max = modelOptions.outputMax();
        if (!(min < max) || Double.isNaN(min) || Double.isNaN(max)) {
            throw new InputException("--output-min must be < --output-max: --output-min=" + min + ", --output-max="
                    + max);
        }
        return ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0)).samplePeriodSeconds(h)
                .outputRange(min, max).action(TuningEvaluation.action(model)).build();
    }

    /** The model in words, such as "fopdt, K=2.0, T=10.0 s, L=1.0 s". */
    static String describe(ProcessModel model) {
        if (model instanceof FopdtModel m) {
            return "first order plus dead time, K=" + m.processGain() + ", T=" + m.timeConstantSeconds() + " s, L="
                    + m.deadTimeSeconds() + " s";
        }
        if (model instanceof SopdtModel m) {
            return "second order plus dead time, K=" + m.processGain() + ", T1=" + m.timeConstantSeconds() + " s, T2="
                    + m.secondTimeConstantSeconds() + " s, L=" + m.deadTimeSeconds() + " s";
        }
        IntegratingModel m = (IntegratingModel) model;
        return "integrating, K=" + m.processGain() + " 1/s" + (m.lagSeconds() > 0.0 ? ", lag T=" + m.lagSeconds()
                + " s" : "") + ", L=" + m.deadTimeSeconds() + " s";
    }

    /** The model rule named by {@code --rule} (ziegler-nichols is the step-response rule here). */
    static ModelRule modelRule(String label) {
        return rule(label, ModelRule.values(), " for a model");
    }

    /** The ultimate-point rule named by {@code --rule}. */
    static UltimatePointRule ultimatePointRule(String label) {
        return rule(label, UltimatePointRule.values(), " for an ultimate point");
    }

    private static <R extends TuningRule> R rule(String label, R[] rules, String what) {
        for (R r : rules) {
            if (r.label().equals(label)) {
                return r;
            }
        }
        String allowed = Arrays.stream(rules).map(TuningRule::label).collect(Collectors.joining(", "));
        throw new InputException("--rule must be one of " + allowed + what + ": --rule=" + label);
    }

    /** Builds a model or a point from option values; a value the model refuses is bad input named by its option. */
    static <T> T inOptionTerms(Supplier<T> build) {
        return OptionChecks.inOptionTerms(ModelOptions.OPTION_OF_FIELD, build);
    }

    /** Writes a --write-controller file: staged beside it, then moved, so a failure leaves no half-written file. */
    static void write(Path file, String text) {
        Path absolute = file.toAbsolutePath();
        try (OutputStage stage = OutputStage.in(absolute.getParent(), "--write-controller")) {
            Files.writeString(stage.directory().resolve(absolute.getFileName().toString()), text,
                    StandardCharsets.UTF_8);
            stage.commit();
        } catch (IOException e) {
            throw new InputException(file + ": cannot be written (" + e + ")");
        }
    }
}
