package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Callable;

import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.report.MetricsReport;
import org.loopwright.sim.report.ResponsePlot;
import org.loopwright.sim.report.TrajectoryCsv;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code simulate [SCENARIO.yaml] [--out DIR] [--json]}: runs a closed-loop scenario, writes
 * {@code trajectory.csv}, {@code response.png} and {@code response.svg} into DIR, and prints the
 * metrics as a table (or one JSON object with {@code --json}). Without a scenario it runs the
 * built-in water-bath demo and says so (on standard error, so that JSON output stays clean).
 */
@Command(name = "simulate", mixinStandardHelpOptions = true,
        description = {"Simulate a controller on a plant model and report the response.",
            "Writes trajectory.csv, response.png and response.svg; prints the metrics.",
            "Without SCENARIO.yaml, runs a built-in water-bath demo (numbers of our own invention)."})
public final class SimulateCommand implements Callable<Integer> {

    @Parameters(index = "0", arity = "0..1", paramLabel = "SCENARIO.yaml",
            description = "The scenario file (see the scenario file format in the README).")
    private Path scenarioFile;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = ".",
            description = "Directory for trajectory.csv and the plots (created if need be; default: ${DEFAULT-VALUE}).")
    private Path outDirectory;

    @Option(names = "--json", description = "Print the metrics as one JSON object instead of a table.")
    private boolean json;

    @Spec
    private CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Scenario scenario;
        String title;
        try {
            if (scenarioFile == null) {
                err.println("No scenario given: running the built-in water-bath demo (numbers of our own invention,"
                        + " not a real bath).");
                scenario = ScenarioFile.waterBathDemo();
                title = "Water bath (built-in demo)";
            } else {
                scenario = ScenarioFile.read(scenarioFile);
                title = String.valueOf(scenarioFile.getFileName());
            }
        } catch (InputFileException e) {
            err.println(e.getMessage());
            return LoopwrightCommand.BAD_INPUT;
        }
        Trajectory trajectory = Simulation.run(scenario);
        ResponseMetrics metrics = ResponseMetrics.of(scenario, trajectory);
        Optional<LimitCycle> cycle = scenario.onOffController().isPresent()
                ? LimitCycle.of(trajectory, 0.5 * scenario.durationSeconds()) : Optional.empty();

        Files.createDirectories(outDirectory);
        TrajectoryCsv.write(trajectory, outDirectory.resolve("trajectory.csv"));
        System.setProperty("java.awt.headless", "true");
        ResponsePlot.save(ResponsePlot.response(trajectory, title), outDirectory, "response");

        if (json) {
            out.println(MetricsReport.jsonText(metrics, cycle));
        } else {
            out.printf("%s: %d samples every %s s over %s s%n", title, trajectory.length(),
                    scenario.samplePeriodSeconds(), scenario.durationSeconds());
            out.print(MetricsReport.table(metrics, cycle));
            out.println("Wrote trajectory.csv, response.png and response.svg in " + outDirectory);
        }
        out.flush();
        return 0;
    }
}
