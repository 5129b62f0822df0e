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

import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.plant.PlantType;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.HtmlReport;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.report.ResultTable;
import org.loopwright.sim.report.ResultTable.Column;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.scenario.Units;
import org.loopwright.sim.sweep.Distribution;
import org.loopwright.sim.sweep.LoopStability;
import org.loopwright.sim.sweep.Spread;
import org.loopwright.sim.sweep.Sweep;
import org.loopwright.sim.sweep.SweepFiles;
import org.loopwright.sim.sweep.SweepResult;
import org.loopwright.sim.sweep.SweepRun;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code sweep SCENARIO.yaml [--runs N] [--spread gain=20%,time-constant=10%,dead-time=30%] [--seed S]
 * [--threads T] [--out DIR] [--json] [--no-progress]}: the scenario's closed loop on N plants drawn
 * around its linear plant (each factor uniform within the spread, see {@link Spread}), on T threads;
 * prints the distribution of overshoot, settling time, IAE and time in saturation (min, median, p90,
 * max), the shares of unstable and unsettled runs and the worst run, and writes {@code sweep-runs.csv},
 * {@code sweep-measurements.png/.svg} and {@code report.html} into DIR. The same seed gives the same
 * result for any T. A progress bar goes to standard error only when there is a console, no
 * {@code --json} and no {@code --no-progress}. Exit code 2 for a bad file, option or spread, or a
 * nonlinear plant.
 */
@Command(name = "sweep", mixinStandardHelpOptions = true,
        description = {"Simulate the scenario on many plants drawn around its own and report the spread of the response.",
            "Gain, time constants and dead time are each scaled by a factor uniform within the spread; the report",
            "gives overshoot, settling time, IAE, time saturated (min, median, p90, max), unstable and unsettled",
            "shares, the worst run. Writes sweep-runs.csv, sweep-measurements.png/.svg and report.html."})
public final class SweepCommand implements Callable<Integer> {

    /** The most runs one sweep may ask for (each keeps its figures and a thinned measurement). */
    public static final int MAX_RUNS = 10_000;
    /** The most threads one sweep may ask for. */
    public static final int MAX_THREADS = 256;

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO.yaml", description = "The scenario file (linear plant).")
    private Path scenarioFile;

    @Option(names = "--runs", paramLabel = "N", defaultValue = "100",
            description = "How many plants to draw (1 to " + MAX_RUNS + "; default: ${DEFAULT-VALUE}).")
    private int runs;

    @Option(names = "--spread", paramLabel = "KEY=P%[,KEY=P%...]",
            defaultValue = "gain=20%,time-constant=20%,dead-time=20%",
            description = {"How far each parameter strays, keys gain, time-constant, dead-time, each 0%% to below",
                "100%%; the factor is uniform on [1-P, 1+P]; keys left out do not vary (default: ${DEFAULT-VALUE})."})
    private String spreadText;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1",
            description = "Seed of the plant draws; run i's plant depends only on S and i (default: ${DEFAULT-VALUE}).")
    private long seed;

    @Option(names = "--threads", paramLabel = "T",
            description = "Threads to run on (default: the number of processors).")
    private Integer threads;

    @Mixin
    private OutputOptions output;

    @Option(names = "--no-progress", description = "No progress bar (it is shown on standard error only at a console).")
    private boolean noProgress;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        int threadCount = threads != null ? threads : Runtime.getRuntime().availableProcessors();
        if (runs < 1 || runs > MAX_RUNS) {
            throw InputException.option("--runs", runs, "must be from 1 to " + MAX_RUNS);
        }
        if (threadCount < 1 || threadCount > MAX_THREADS) {
            throw InputException.option("--threads", threadCount, "must be from 1 to " + MAX_THREADS);
        }
        Spread spread = Spread.parse(spreadText);
        Scenario scenario = ScenarioFile.read(scenarioFile);
        if (scenario.linearPlant().isEmpty()) {
            throw InputFileException.whole(scenarioFile.toString(), "sweep needs a linear plant ("
                    + PlantType.linearWords() + "): plant.type=" + scenario.plant().type().word());
        }
        if (scenario.inner().isPresent() && scenario.inner().get().plant().linear().isEmpty()) {
            throw InputFileException.whole(scenarioFile.toString(), "sweep needs a linear inner plant ("
                    + PlantType.linearWords() + "): inner.plant.type=" + scenario.inner().get().plant().type().word());
        }
        if (scenario.schedule().isPresent() || scenario.splitRange().isPresent()) {
            throw InputFileException.whole(scenarioFile.toString(), "sweep judges stability on a loop with fixed"
                    + " gains and one actuator: " + (scenario.schedule().isPresent() ? "controller.schedule"
                    : "split-range") + " is given");
        }
        boolean json = output.json();
        Path outDirectory = output.directory("sweep");
        SweepResult result;
        try (SweepProgress progress = !json && !noProgress && System.console() != null
                ? SweepProgress.on(System.err, runs) : SweepProgress.off()) {
            result = new Sweep(scenario, spread, seed).run(runs, threadCount, progress);
        }
        String title = String.valueOf(scenarioFile.getFileName());
        Units units = scenario.units();
        List<Path> written;
        // staged, then moved: a run that fails half way leaves no half-written file behind
        try (OutputStage stage = OutputStage.in(outDirectory, "--out")) {
            written = new ArrayList<>(SweepFiles.write(result, stage.directory(), title, units));
            written.add(HtmlReport.write(stage.directory().resolve(HtmlReport.FILE_NAME), "Sweep of " + title,
                    HtmlReports.record(spec, scenario, scenarioFile), List.of(header(result, threadCount)),
                    List.of(table(result, units).html(), runsTable(result, units).html()), List.of(written.get(1)),
                    title, Files.readString(scenarioFile, StandardCharsets.UTF_8)));
            stage.commit();
        }
        if (json) {
            out.println(JsonOutput.text(SweepJson.of(result, threadCount)));
        } else {
            out.println(header(result, threadCount));
            out.print(table(result, units).text());
            out.println(describe("worst run", result.worst(), units));
            out.println(describe("nominal plant", result.nominal(), units));
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
        List<String> spreads = new ArrayList<>();
        Spread spread = result.spread();
        for (String entry : spread.text().split(",")) {
            if (!entry.endsWith("=0%")) {
                spreads.add(entry.replace("=", " ±"));
            }
        }
        return String.format(Locale.ROOT, "%d runs, seed %d, %d threads; %s.%nunstable: %s (%d of %d, from the closed-loop poles of the sampled linear loop"
                + " or a diverging simulation; %d diverged and were stopped, kept out of the distributions)%s;"
                + " never settled (2 %% band): %s of the runs whose response moved.",
                n, result.seed(), threadCount, spreads.isEmpty() ? "no spread: every run on the nominal plant"
                        : "each plant factor uniform within " + String.join(", ", spreads) + " of the nominal",
                percent(result.unstableShare()), unstable, n, diverged,
                notAssessed == 0 ? "" : String.format(Locale.ROOT, "; stability not assessed for %d", notAssessed),
                Double.isNaN(notSettled) ? "n/a" : percent(notSettled));
    }

    private static long count(SweepResult result, LoopStability stability) {
        return result.runs().stream().filter(r -> r.stability() == stability).count();
    }

    private static String percent(double share) {
        return String.format(Locale.ROOT, "%.1f %%", 100.0 * share);
    }

    /** The figures' distribution over the runs, with their units. */
    private static ResultTable table(SweepResult result, Units units) {
        ResultTable table = ResultTable.of("Distribution over the runs (runs: how many have the figure)",
                Column.text("figure", "figure"), Column.text("runs", "runs"), Column.number("min", "min", "", 4),
                Column.number("median", "median", "", 4), Column.number("p90", "p90", "", 4),
                Column.number("max", "max", "", 4));
        row(table, "overshoot (%)", result.overshootPercent());
        row(table, "settling time (2 %, s)", result.settlingTimeSeconds());
        row(table, "IAE (" + units.processSeconds() + ")", result.iae());
        row(table, "time saturated (%)", result.saturatedPercent());
        return table;
    }

    private static void row(ResultTable table, String name, Distribution d) {
        table.row(name, String.valueOf(d.count()), d.min(), d.median(), d.p90(), d.max());
    }

    /** The nominal and the worst run: the plant factors, the verdict and the figures, with their units. */
    private static ResultTable runsTable(SweepResult result, Units units) {
        ResultTable table = ResultTable.of("The nominal and the worst run (unstable first, then unsettled, then the"
                + " largest IAE)", Column.text("run", "run"), Column.number("gain_factor", "gain x", "", 4),
                Column.number("time_constant_factor", "time constants x", "", 4),
                Column.number("dead_time_factor", "dead time x", "", 4), Column.text("stability", "stability"),
                Column.number("overshoot_percent", "overshoot", "%", 4),
                Column.number("settling_time", "settling time", "s", 4),
                Column.number("iae", "IAE", units.processSeconds(), 4));
        for (SweepRun run : List.of(result.nominal(), result.worst())) {
            table.row(run == result.nominal() ? "nominal" : "worst (#" + run.index() + ")", run.draw().gainFactor(),
                    run.draw().timeConstantFactor(), run.draw().deadTimeFactor(), word(run.stability()),
                    run.metrics().overshootPercent(), run.metrics().settlingTimeSeconds(), run.metrics().iae());
        }
        return table;
    }

    private static String word(LoopStability stability) {
        return stability.name().toLowerCase(Locale.ROOT).replace('_', ' ');
    }

    private static String describe(String name, SweepRun run, Units units) {
        TransferFunction plant = run.plant();
        return String.format(Locale.ROOT, "%s%s: %s; gain x%s, time constants x%s, dead time x%s: plant %s/%s,"
                + " dead time %s s; overshoot %s %%, settling time %s s, IAE %s %s", name,
                run.index() == Sweep.NOMINAL_INDEX ? "" : " #" + run.index(), word(run.stability()),
                number(run.draw().gainFactor()), number(run.draw().timeConstantFactor()),
                number(run.draw().deadTimeFactor()), Arrays.toString(plant.numerator()),
                Arrays.toString(plant.denominator()), number(plant.deadTimeSeconds()),
                number(run.metrics().overshootPercent()), number(run.metrics().settlingTimeSeconds()),
                number(run.metrics().iae()), units.processSeconds());
    }

    private static String number(double value) {
        return NumberText.of(value);
    }
}
