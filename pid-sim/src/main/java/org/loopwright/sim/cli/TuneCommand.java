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
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.RuleNotApplicable;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.pid.tuning.TuningResult;
import org.loopwright.pid.tuning.TuningRule;
import org.loopwright.pid.tuning.UltimatePoint;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.tuning.TuningCandidate;
import org.loopwright.sim.tuning.TuningEvaluation;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code tune}: PID settings from a first-order-plus-dead-time model (K, T, L) or an ultimate point
 * (Ku, Pu) by the published rules, each checked on the model: the settings in ideal, parallel and
 * series form, the margins and Ms of the continuous loop, and the figures of a unit setpoint step and
 * a unit load step in simulation (sample period and run length as {@link TuningEvaluation} chooses).
 * Without {@code --rule} every rule that applies is compared in one table. Exit code 2 for bad input,
 * including a rule that does not apply to the model.
 */
@Command(name = "tune", mixinStandardHelpOptions = true,
        description = {"PID settings from a model (K, T, L) or an ultimate point (Ku, Pu) by published rules,"
                + " checked on the model: margins, Ms, setpoint- and load-step figures.",
                "Rules: simc, amigo, lambda, ziegler-nichols, cohen-coon (from a model);"
                        + " ziegler-nichols, tyreus-luyben (from an ultimate point)."})
public final class TuneCommand implements Callable<Integer> {

    /** Sample period for settings tuned from an ultimate point alone: Pu divided by this. */
    public static final double SAMPLES_PER_ULTIMATE_PERIOD = 50.0;

    @Spec
    private CommandSpec spec;

    @Option(names = "--process-gain", paramLabel = "K", description = "Process gain K (output units per input unit).")
    private Double processGain;

    @Option(names = "--time-constant", paramLabel = "T", description = "Time constant T in seconds.")
    private Double timeConstant;

    @Option(names = "--dead-time", paramLabel = "L", description = "Dead time L in seconds.")
    private Double deadTime;

    @Option(names = "--ultimate-gain", paramLabel = "KU", description = "Ultimate gain Ku.")
    private Double ultimateGain;

    @Option(names = "--ultimate-period", paramLabel = "PU", description = "Ultimate period Pu in seconds.")
    private Double ultimatePeriod;

    @Option(names = "--rule", paramLabel = "R", description = "One rule; without it, every rule that applies.")
    private String rule;

    @Option(names = "--type", paramLabel = "pi|pid", defaultValue = "pi", description = "PI or PID (default: pi).")
    private String type;

    @Option(names = "--closed-loop-time", paramLabel = "TC",
            description = "SIMC's tau_c (default: the dead time L, as Skogestad 2003 recommends) or lambda's lambda"
                    + " (default: max(T, 1.7 L) for PI, max(T, 0.8 L) for PID), seconds.")
    private Double closedLoopTime;

    @Option(names = "--write-controller", paramLabel = "FILE.yaml",
            description = "Write the settings as a controller file that simulate and replay accept (needs --rule).")
    private Path controllerOut;

    @Option(names = "--json", description = "Print JSON instead of text.")
    private boolean json;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        ControllerType controllerType = parseType(type);
        boolean fromModel = processGain != null || timeConstant != null || deadTime != null;
        boolean fromPoint = ultimateGain != null || ultimatePeriod != null;
        if (fromModel == fromPoint) {
            throw bad("give either --process-gain, --time-constant and --dead-time, or --ultimate-gain"
                    + " and --ultimate-period");
        }
        if (fromModel && (processGain == null || timeConstant == null || deadTime == null)) {
            throw bad("a model needs all of --process-gain, --time-constant and --dead-time");
        }
        if (fromPoint && (ultimateGain == null || ultimatePeriod == null)) {
            throw bad("an ultimate point needs both --ultimate-gain and --ultimate-period");
        }
        if (controllerOut != null && rule == null) {
            throw bad("--write-controller needs --rule: which rule's settings to write");
        }
        if (closedLoopTime != null && rule != null && !rule.equals("simc") && !rule.equals("lambda")) {
            throw bad("--closed-loop-time applies to the simc and lambda rules only: --rule=" + rule);
        }
        if (closedLoopTime != null && !(closedLoopTime > 0.0 && Double.isFinite(closedLoopTime))) {
            throw bad("--closed-loop-time must be finite and > 0 (omit it for the rule's default):"
                    + " --closed-loop-time=" + closedLoopTime);
        }
        double designTime = closedLoopTime == null ? Double.NaN : closedLoopTime;
        List<TuningRule> rules = rule == null ? Arrays.stream(TuningRule.values())
                .filter(r -> r.usesModel() == fromModel).toList() : List.of(parseRule(rule, fromModel));
        List<TuningCandidate> candidates = new ArrayList<>();
        List<RuleNotApplicable> skipped = new ArrayList<>();
        FopdtModel model;
        UltimatePoint point;
        try {
            model = fromModel ? new FopdtModel(processGain, timeConstant, deadTime) : null;
            point = fromPoint ? new UltimatePoint(ultimateGain, ultimatePeriod) : null;
        } catch (InvalidSettingException e) {
            throw bad(inOptionTerms(e));
        }
        if (fromModel && TuningEvaluation.samplesFor(model) > TuningEvaluation.MAX_SAMPLES) {
            throw bad(String.format(Locale.ROOT, "--time-constant and --dead-time must be within a factor of about"
                    + " 2500 of each other: checking the settings would simulate %.3g samples a run, the limit is %d"
                    + " (period min(T, L)/20 over %s·(T + L)): --time-constant=%s, --dead-time=%s",
                    TuningEvaluation.samplesFor(model), TuningEvaluation.MAX_SAMPLES,
                    (long) TuningEvaluation.RUN_LENGTH, timeConstant, deadTime));
        }
        for (TuningRule r : rules) {
            TuningResult result = fromModel ? r.tune(model, controllerType, designTime) : r.tune(point, controllerType);
            if (result instanceof TunedGains tuned) {
                candidates.add(fromModel ? TuningEvaluation.onModel(tuned, model)
                        : TuningEvaluation.withoutModel(tuned, ultimatePeriod / SAMPLES_PER_ULTIMATE_PERIOD));
            } else {
                skipped.add((RuleNotApplicable) result);
            }
        }
        if (rule != null && candidates.isEmpty()) {
            RuleNotApplicable why = skipped.get(0);
            throw bad(why.rule().label() + " does not apply: " + why.reason() + " (" + why.citation() + ")");
        }
        if (controllerOut != null) {
            write(controllerOut, ControllerFile.toYaml(candidates.get(0).settings()));
        }
        if (json) {
            out.println(Json.pretty(rule == null ? TuningReport.json(candidates)
                    : TuningReport.json(candidates.get(0))));
        } else {
            out.println(fromModel
                    ? "Model: K=" + processGain + ", T=" + timeConstant + " s, L=" + deadTime + " s (sample period "
                            + TuningReport.num(TuningEvaluation.samplePeriodSeconds(model)) + " s in simulation)"
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

    static ControllerType parseType(String text) {
        return switch (text) {
            case "pi" -> ControllerType.PI;
            case "pid" -> ControllerType.PID;
            default -> throw bad("--type must be pi or pid: --type=" + text);
        };
    }

    /** The rule named on the command line; ziegler-nichols is the step rule for a model, the ultimate rule otherwise. */
    static TuningRule parseRule(String label, boolean fromModel) {
        for (TuningRule r : TuningRule.values()) {
            if (r.label().equals(label) && r.usesModel() == fromModel) {
                return r;
            }
        }
        String allowed = Arrays.stream(TuningRule.values()).filter(r -> r.usesModel() == fromModel)
                .map(TuningRule::label).collect(Collectors.joining(", "));
        throw bad("--rule must be one of " + allowed + (fromModel ? " for a model" : " for an ultimate point")
                + ": --rule=" + label);
    }

    /** The model's and the point's field names as the options the user typed. */
    private static final Map<String, String> OPTION_OF_FIELD = Map.of(
            "processGain", "--process-gain", "timeConstantSeconds", "--time-constant",
            "deadTimeSeconds", "--dead-time", "ultimateGain", "--ultimate-gain",
            "ultimatePeriodSeconds", "--ultimate-period");

    static String inOptionTerms(InvalidSettingException e) {
        String option = OPTION_OF_FIELD.getOrDefault(e.field(), e.field());
        return option + " " + e.rule() + ": " + option + "=" + e.value();
    }

    private static void write(Path file, String text) throws IOException {
        Path absolute = file.toAbsolutePath();
        try (OutputStage stage = OutputStage.in(absolute.getParent(), "--write-controller")) {
            Files.writeString(stage.directory().resolve(absolute.getFileName().toString()), text,
                    StandardCharsets.UTF_8);
            stage.commit();
        }
    }

    private static InputException bad(String message) {
        return new InputException(message, null);
    }
}
