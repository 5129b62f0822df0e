package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;

import org.loopwright.sim.assess.MonitorVerdict;
import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseWindow;
import org.loopwright.sim.report.MetricsReport;
import org.loopwright.sim.report.ResultTable;
import org.loopwright.sim.report.ResponsePlot;
import org.loopwright.sim.report.TrajectoryCsv;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.simulate.Divergence;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code simulate [SCENARIO.yaml] [--out DIR] [--json] [--show-demo]}: runs a closed-loop scenario, writes
 * {@code trajectory.csv}, {@code response.png}, {@code response.svg} (and, for a cascade, {@code inner-loop.png}
 * and {@code .svg}) and {@code report.html} into DIR, and prints the
 * metrics as a table (or one JSON object with {@code --json}). Without a scenario it runs the
 * built-in water-bath demo and says so (on standard error, so that JSON output stays clean).
 */
@Command(name = "simulate", mixinStandardHelpOptions = true,
        description = {"Simulate a controller on a plant model and report the response.",
            "Writes trajectory.csv, response.png, response.svg and report.html; prints the metrics.",
            "Without SCENARIO.yaml, runs a built-in water-bath demo (numbers of our own invention).",
            "The first row says whether the response settled, did not settle or DIVERGED.",
            "Overshoot: " + ResponseMetrics.OVERSHOOT_DEFINITION + ".",
            "Settled: " + ResponseMetrics.SETTLED_RULE + "; step figures are given only for a settled response,"
                    + " else 'not settled'.",
            "Divergence: " + Divergence.RULE + "; such a run is stopped there and reported DIVERGED."})
public final class SimulateCommand implements Callable<Integer> {

    @Parameters(index = "0", arity = "0..1", paramLabel = "SCENARIO.yaml",
            description = "The scenario file (YAML; --show-demo prints an example of the format).")
    private Path scenarioFile;

    @Mixin
    private OutputOptions output;

    @Option(names = "--show-demo", description = "Print the built-in demo scenario (an example of the format) and stop.")
    private boolean showDemo;

    @Spec
    private CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (showDemo) {
            out.print(ScenarioFile.waterBathDemoText());
            out.flush();
            return 0;
        }
        Scenario scenario;
        String title;
        if (scenarioFile == null) {
            err.println("No scenario given: running the built-in water-bath demo (numbers of our own invention,"
                    + " not a real bath).");
            scenario = ScenarioFile.waterBathDemo();
            title = "Water bath (built-in demo)";
        } else {
            scenario = ScenarioFile.read(scenarioFile);
            title = String.valueOf(scenarioFile.getFileName());
        }
        Trajectory trajectory = Simulation.run(scenario);
        if (trajectory.diverged()) {
            err.println(String.format(Locale.ROOT, "DIVERGED: the process output passed the divergence bound at t = %s s"
                    + " and the run was stopped there (%s).", trajectory.divergedAtSeconds(), Divergence.RULE));
        }
        ResponseMetrics metrics = ResponseMetrics.of(scenario, trajectory);
        Optional<LimitCycle> cycle = scenario.onOffController().isPresent()
                ? LimitCycle.of(trajectory, 0.5 * scenario.durationSeconds()) : Optional.empty();

                ResultTable table = MetricsReport.table(metrics, cycle, scenario.units());
        // staged, then moved: a run that fails half way leaves no half-written file behind
        try (OutputStage stage = output.stage()) {
            Path directory = stage.directory();
            TrajectoryCsv.write(trajectory, directory.resolve("trajectory.csv"));
            System.setProperty("java.awt.headless", "true");
            ResponsePlot.save(ResponsePlot.response(trajectory, title, scenario.units()), directory, "response");
            List<Path> plots = new ArrayList<>(List.of(directory.resolve("response.svg")));
            if (trajectory.hasInnerLoop()) {
                ResponsePlot.save(ResponsePlot.innerLoop(trajectory, title), directory, "inner-loop");
                plots.add(directory.resolve("inner-loop.svg"));
            }
            String summary = String.format(Locale.ROOT, "%d samples every %s s over %s s. Step figures %s"
                    + " (the first setpoint change until the next change or load step); integrals to the end.",
                    trajectory.length(), scenario.samplePeriodSeconds(), scenario.durationSeconds(),
                    ResponseWindow.of(scenario).describe());
            HtmlReports.simulate(directory, HtmlReports.record(spec, scenario, scenarioFile), title, summary, table,
                    plots, scenarioFile == null ? "built-in water-bath demo" : title,
                    scenarioFile == null ? ScenarioFile.waterBathDemoText() : Files.readString(scenarioFile));
            stage.commit();
        }

        if (output.json()) {
            out.println(MetricsReport.jsonText(metrics, cycle));
        } else {
            out.printf("%s: %d samples every %s s over %s s%n", title, trajectory.length(),
                    scenario.samplePeriodSeconds(), scenario.durationSeconds());
            out.println("Step figures " + ResponseWindow.of(scenario).describe()
                    + " (the first setpoint change until the next change or load step); integrals to the end:");
            out.print(table.text());
            out.println(MonitorVerdict.of(scenario, trajectory));
            out.println("Wrote trajectory.csv, response.png, response.svg" + (trajectory.hasInnerLoop()
                    ? ", inner-loop.png, inner-loop.svg" : "") + " and report.html in " + output.directory());
        }
        out.flush();
        return 0;
    }
}
