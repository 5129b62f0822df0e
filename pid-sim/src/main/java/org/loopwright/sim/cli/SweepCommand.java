package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.plant.PlantParameters;
import org.loopwright.sim.plant.PlantType;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.HtmlReport;
import org.loopwright.sim.report.HtmlTable;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.scenario.Units;
import org.loopwright.sim.sweep.Distribution;
import org.loopwright.sim.sweep.LoopStability;
import org.loopwright.sim.sweep.Spread;
import org.loopwright.sim.sweep.Sweep;
import org.loopwright.sim.sweep.SweepFiles;
import org.loopwright.sim.sweep.SweepResult;
import org.loopwright.sim.sweep.StabilityBasis;
import org.loopwright.sim.sweep.SustainedOscillation;
import org.loopwright.sim.sweep.SweepRun;


import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code sweep SCENARIO.yaml [--runs N] [--spread gain=20%,time-constant=10%,dead-time=30%] [--seed S]
 * [--threads T] [--out DIR] [--json] [--no-progress]}: the scenario's closed loop on N plants drawn
 * around its plant (each factor uniform within the spread, see {@link Spread}; a nonlinear plant's keys
 * are its file keys, {@code --spread static-friction=30%,inertia=10%}), on T threads; prints how
 * stability was judged ({@link StabilityBasis}), the distribution of overshoot, settling time, IAE and
 * time in saturation (min, median, p90, max), the shares of unstable and unsettled runs and the worst
 * run, and writes {@code sweep-runs.csv}, {@code sweep-measurements.png/.svg} and {@code report.html}
 * into DIR. The same seed gives the same result for any T. A progress bar goes to standard error only
 * when there is a console, no {@code --json} and no {@code --no-progress}. Exit code 2 for a bad file,
 * option or spread (a key the plant type does not take is named with the keys it takes).
 */
@Command(name = "sweep", mixinStandardHelpOptions = true, modelTransformer = SweepCommand.KeysAndRulesFooter.class,
        description = {"Simulate the scenario on many plants drawn around its own and report the spread",
            "of the response. Each parameter spread is scaled by a factor uniform within the",
            "spread: a linear plant's gain, time constants and dead time, a nonlinear plant's",
            "parameters by their file keys. Stability: a linear plant's closed-loop poles; a",
            "nonlinear plant's simulation alone (divergence, or a sustained oscillation; see",
            "below). The report gives overshoot, settling time, IAE, time saturated (min,",
            "median, p90, max), unstable and unsettled shares, the worst run. Writes",
            "sweep-runs.csv, sweep-measurements.png/.svg and report.html."})
public final class SweepCommand implements Callable<Integer> {

    /** The most runs one sweep may ask for (each keeps its figures and a thinned measurement). */
    public static final int MAX_RUNS = 10_000;
    /** The most threads one sweep may ask for. */
    public static final int MAX_THREADS = 256;
    /** The spread of a linear plant when {@code --spread} is not given. */
    public static final String LINEAR_DEFAULT_SPREAD = "gain=20%,time-constant=20%,dead-time=20%";

    @Spec
    private CommandSpec spec;

    /** Help's footer: the spread keys of every plant type and how stability is judged, from their one source. */
    static final class KeysAndRulesFooter implements CommandLine.IModelTransformer {
        /** Picocli's usage width less a margin, so it does not wrap these lines again. */
        private static final int WIDTH = 78;

        @Override
        public CommandSpec transform(CommandSpec command) {
            List<String> lines = new ArrayList<>();
            lines.addAll(wrap("Spread keys by plant type (a nonlinear plant has no default: name what is uncertain):"));
            Map<String, List<String>> typesByKeys = new LinkedHashMap<>();
            for (PlantType type : PlantType.values()) {
                String keys = type.spreadKeys().stream().map(FileKey::word).collect(Collectors.joining(", "))
                        + (type.linear() ? " (default " + LINEAR_DEFAULT_SPREAD + ")" : "");
                typesByKeys.computeIfAbsent(keys, k -> new ArrayList<>()).add(type.word());
            }
            typesByKeys.forEach((keys, types) -> lines.addAll(wrap("  " + String.join(", ", types) + ": " + keys)));
            lines.add("Stability:");
            lines.addAll(wrap("  linear plant: " + StabilityBasis.POLES.describe() + "."));
            lines.addAll(wrap("  nonlinear plant: " + StabilityBasis.SIMULATION.describe() + "."));
            command.usageMessage().footer(lines.stream().map(l -> l.replace("%", "%%")).toArray(String[]::new));
            return command;
        }

        /** Breaks a long line at spaces, the continuation lines indented. */
        private static List<String> wrap(String text) {
            List<String> lines = new ArrayList<>();
            String rest = text;
            int cut;
            while (rest.length() > WIDTH && (cut = rest.lastIndexOf(' ', WIDTH)) > 4) {
                lines.add(rest.substring(0, cut));
                rest = "    " + rest.substring(cut + 1);
            }
            lines.add(rest);
            return lines;
        }
    }

    @Parameters(index = "0", paramLabel = "SCENARIO.yaml", description = "The scenario file.")
    private Path scenarioFile;

    @Option(names = "--runs", paramLabel = "N", defaultValue = "100",
            description = "How many plants to draw (1 to " + MAX_RUNS + "; default: ${DEFAULT-VALUE}).")
    private int runs;

    @Option(names = "--spread", paramLabel = "KEY=P%[,KEY=P%...]",
            description = {"How far each parameter strays, each 0%% to below 100%%; the factor is uniform on [1-P, 1+P];",
                "keys left out do not vary; each plant type's keys and default are listed below."})
    private String spreadText;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1",
            description = "Seed of the plant draws; run i's plant depends only on S and i (default: ${DEFAULT-VALUE}).")
    private long seed;

    @Option(names = "--threads", paramLabel = "T",
            description = "Threads to run on (default: the number of processors).")
    private Integer threads;

    @Mixin
    private OutputOptions output;

    @Mixin
    private ProgressOption progressOption;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        int threadCount = threads != null ? threads : Runtime.getRuntime().availableProcessors();
        if (runs < 1 || runs > MAX_RUNS) {
            throw new InputException("--runs must be from 1 to " + MAX_RUNS + ": --runs=" + runs);
        }
        if (threadCount < 1 || threadCount > MAX_THREADS) {
            throw new InputException("--threads must be from 1 to " + MAX_THREADS + ": --threads=" + threadCount);
        }
        Spread given = spreadText == null ? null : Spread.parse(spreadText);
        Scenario scenario = ScenarioFile.read(scenarioFile);
        PlantType type = scenario.plant().type();
        if (given == null && !type.linear()) {
            throw new InputException("--spread is needed for plant type " + type.word()
                    + " (no default: name the parameters that are uncertain), keys "
                    + type.spreadKeys().stream().map(FileKey::word).collect(Collectors.joining(", ")));
        }
        Spread spread = given != null ? given : Spread.parse(LINEAR_DEFAULT_SPREAD);
        boolean byPoles = StabilityBasis.of(scenario) == StabilityBasis.POLES;
        if (byPoles && scenario.inner().isPresent() && scenario.inner().get().plant().linear().isEmpty()) {
            throw InputFileException.whole(scenarioFile.toString(), "sweep needs a linear inner plant ("
                    + PlantType.linearWords() + ") when the outer plant is linear (its poles judge stability):"
                    + " inner.plant.type=" + scenario.inner().get().plant().type().word());
        }
        if (byPoles && (scenario.schedule().isPresent() || scenario.splitRange().isPresent())) {
            throw InputFileException.whole(scenarioFile.toString(), "sweep judges a linear plant's stability"
                    + " by the poles of a loop with fixed gains and one actuator: " + (scenario.schedule().isPresent() ? "controller.schedule"
                    : "split-range") + " is given");
        }
        Sweep sweep = new Sweep(scenario, spread, seed);
        boolean json = output.json();
        Path outDirectory = output.directory();
        SweepResult result;
        try (SweepProgress progress = progressOption.progress(json, runs)) {
            result = sweep.run(runs, threadCount, progress);
        }
        String title = String.valueOf(scenarioFile.getFileName());
        List<Path> written;
        // staged, then moved: a run that fails half way leaves no half-written file behind
        try (OutputStage stage = output.stage()) {
            written = new ArrayList<>(SweepFiles.write(result, stage.directory(), title, scenario.units()));
            written.add(HtmlReport.write(stage.directory().resolve(HtmlReport.FILE_NAME), "Sweep of " + title,
                    HtmlReports.record(spec, scenario, scenarioFile), List.of(header(result, threadCount)), List.of(table(result), runsTable(result)),
                    List.of(written.get(1)), title, Files.readString(scenarioFile, StandardCharsets.UTF_8)));
            stage.commit();
        }
        if (json) {
            out.println(JsonOutput.text(SweepJson.Sweep.of(result, threadCount)));
        } else {
            out.println(header(result, threadCount));
            out.print(text(table(result)));
            out.println(describe("worst run", result.worst(), result));
            out.println(describe("nominal plant", result.nominal(), result));
            out.println("Wrote " + written.stream().map(p -> String.valueOf(p.getFileName())).toList() + " in "
                    + outDirectory);
        }
        out.flush();
        return 0;
    }

    private static String header(SweepResult result, int threadCount) {
        int n = result.runs().size();
        // the same runs as unstableShare(): a diverged run is unstable too
        long unstable = count(result, LoopStability.UNSTABLE) + count(result, LoopStability.DIVERGED);
        long diverged = count(result, LoopStability.DIVERGED);
        long notAssessed = count(result, LoopStability.NOT_ASSESSED);
        double notSettled = result.notSettledShare();
        long oscillating = count(result, LoopStability.OSCILLATING);
        List<String> spreads = result.spread().nonZero();
        return String.format(Locale.ROOT, "%d runs, seed %d, %d threads; %s.%nStability judged by %s.%n"
                + "unstable: %s (%d of %d, %d diverged and were stopped, kept out of the distributions%s)%s;"
                + " never settled (2 %% band): %s of the runs whose response moved.",
                n, result.seed(), threadCount, spreads.isEmpty() ? "no spread: every run on the nominal plant"
                        : "each plant factor uniform within " + String.join(", ", spreads) + " of the nominal",
                result.stabilityBasis() == StabilityBasis.POLES ? "the closed-loop poles of the sampled linear loop"
                        + " (a pole on or outside the unit circle), or a diverging simulation"
                        : "simulation (nonlinear plant, no poles): divergence, or a sustained oscillation (decay"
                        + " ratio >= " + SustainedOscillation.DECAY_RATIO_LIMIT + " over two cycles in the run's final"
                        + " half, swings beyond the 2 % band)",
                percent(result.unstableShare()), unstable + oscillating, n, diverged,
                result.stabilityBasis() == StabilityBasis.POLES ? ""
                        : String.format(Locale.ROOT, ", %d kept oscillating", oscillating),
                notAssessed == 0 ? "" : String.format(Locale.ROOT, "; stability not assessed for %d", notAssessed),
                Double.isNaN(notSettled) ? "n/a" : percent(notSettled));
    }

    private static long count(SweepResult result, LoopStability stability) {
        return result.runs().stream().filter(r -> r.stability() == stability).count();
    }

    private static String percent(double share) {
        return String.format(Locale.ROOT, "%.1f %%", 100.0 * share);
    }

    private static HtmlTable table(SweepResult result) {
        List<List<String>> rows = new ArrayList<>();
        rows.add(row("overshoot (%)", result.overshootPercent()));
        rows.add(row("settling time (2 %, s)", result.settlingTimeSeconds()));
        rows.add(row(iaeTitle(result), result.iae()));
        rows.add(row("time saturated (%)", result.saturatedPercent()));
        return new HtmlTable("Distribution over the runs (runs: how many have the figure)",
                List.of("figure", "runs", "min", "median", "p90", "max"), rows);
    }

    private static List<String> row(String name, Distribution d) {
        return List.of(name, String.valueOf(d.count()), number(d.min()), number(d.median()), number(d.p90()),
                number(d.max()));
    }

    private static HtmlTable runsTable(SweepResult result) {
        List<String> keys = shownKeys(result);
        List<List<String>> rows = new ArrayList<>();
        rows.add(runRow("nominal", result.nominal(), keys));
        rows.add(runRow("worst (#" + result.worst().index() + ")", result.worst(), keys));
        List<String> header = new ArrayList<>(List.of("run"));
        keys.forEach(key -> header.add(key + " x"));
        header.addAll(List.of("stability", "overshoot (%)", "settling time (s)", iaeTitle(result)));
        return new HtmlTable("The nominal and the worst run (unstable first, then unsettled, then the largest IAE)",
                header, rows);
    }

    /** "IAE (bar·s)": in the scenario's process unit, as simulate's table gives it. */
    private static String iaeTitle(SweepResult result) {
        return Units.axis("IAE", iaeUnit(result));
    }

    /** IAE's unit: the scenario's process unit times seconds ("bar·s", "PV·s" when none is named). */
    private static String iaeUnit(SweepResult result) {
        return result.scenario().units().processSeconds();
    }

    /** The factors a run is shown with: all three of a linear plant, the spread ones of a nonlinear plant. */
    private static List<String> shownKeys(SweepResult result) {
        PlantType type = result.scenario().plant().type();
        return type.spreadKeys().stream().map(FileKey::word)
                .filter(key -> type.linear() || result.spread().fraction(key) > 0.0).toList();
    }

    private static List<String> runRow(String name, SweepRun run, List<String> keys) {
        List<String> row = new ArrayList<>(List.of(name));
        keys.forEach(key -> row.add(number(run.draw().factor(key))));
        row.addAll(List.of(word(run.stability()), number(run.metrics().overshootPercent()),
                number(run.metrics().settlingTimeSeconds()), number(run.metrics().iae())));
        return row;
    }

    private static String word(LoopStability stability) {
        return stability.name().toLowerCase(Locale.ROOT).replace('_', ' ');
    }

    private static String text(HtmlTable table) {
        StringBuilder t = new StringBuilder();
        String format = "  %-24s %6s %12s %12s %12s %12s%n";
        t.append(String.format(Locale.ROOT, format, table.header().toArray()));
        for (List<String> row : table.rows()) {
            t.append(String.format(Locale.ROOT, format, row.toArray()));
        }
        return t.toString();
    }

    private static String describe(String name, SweepRun run, SweepResult result) {
        List<String> keys = shownKeys(result);
        String plant;
        if (run.plant() instanceof TransferFunction linear) {
            plant = String.format(Locale.ROOT, "gain x%s, time constants x%s, dead time x%s: plant %s/%s,"
                    + " dead time %s s", number(run.draw().factor("gain")), number(run.draw().factor("time-constant")),
                    number(run.draw().factor("dead-time")), coefficients(linear.numerator()),
                    coefficients(linear.denominator()), number(linear.deadTimeSeconds()));
        } else {
            List<String> parameters = new ArrayList<>();
            for (FileKey<Double> key : run.plant().type().spreadKeys()) {
                if (keys.contains(key.word())) {
                    parameters.add(String.format(Locale.ROOT, "%s x%s = %s", key.word(),
                            number(run.draw().factor(key.word())), number(PlantParameters.value(run.plant(), key))));
                }
            }
            plant = (parameters.isEmpty() ? "the nominal " + run.plant().type().word() : String.join(", ", parameters))
                    + (run.plant().linear().isPresent() ? "; largest pole magnitude " + number(run.largestPoleMagnitude())
                            : "; decay ratio " + number(run.decayRatio()));
        }
        return String.format(Locale.ROOT, "%s%s: %s; %s; overshoot %s, settling time %s, IAE %s", name,
                run.index() == Sweep.NOMINAL_INDEX ? "" : " #" + run.index(), word(run.stability()), plant,
                number(run.metrics().overshootPercent(), " %"), number(run.metrics().settlingTimeSeconds(), " s"),
                number(run.metrics().iae(), " " + iaeUnit(result)));
    }

    private static String number(double value) {
        return number(value, "");
    }

    private static String coefficients(double[] values) {
        return Arrays.stream(values).mapToObj(SweepCommand::number).collect(Collectors.joining(", ", "[", "]"));
    }

    /** A figure with its unit, or "n/a" alone: a missing figure has no unit. */
    private static String number(double value, String unit) {
        return Double.isNaN(value) ? "n/a" : String.format(Locale.ROOT, "%.4g", value) + unit;
    }
}
