package org.loopwright.sim.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;

import org.loopwright.sim.report.HtmlReport;
import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.report.ReportRecord;
import org.loopwright.sim.report.ResultTable;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.study.SamplingVerdict;
import org.loopwright.sim.study.StudyResult;

import picocli.CommandLine.Model.CommandSpec;

/** The {@code report.html} pages of {@code simulate} and {@code compare} (see {@link HtmlReport}). */
final class HtmlReports {

    private HtmlReports() {
    }

    /**
     * The record of a report on a scenario: tool version, time, the command line as typed, the
     * scenario and its controller file with their SHA-256, and the controller settings in full.
     *
     * @param spec     the command's spec (for the command line)
     * @param scenario the scenario as read
     * @param file     the scenario file, or null for a built-in demo
     */
    static ReportRecord record(CommandSpec spec, Scenario scenario, Path file) throws IOException {
        List<Path> inputs = file == null ? List.of() : ScenarioFile.inputFiles(file);
        return ReportRecord.of(BuildVersion.line(), arguments(spec), inputs, ScenarioFile.resolvedController(scenario));
    }

    /** The arguments the command was given, after the tool's name. */
    private static List<String> arguments(CommandSpec spec) {
        return spec.root().commandLine().getParseResult().originalArgs();
    }

    /** The page of one simulation: its metrics, its response plots (the inner loop's too, for a cascade), its scenario. */
    static Path simulate(Path directory, ReportRecord record, String title, String summary, ResultTable metrics,
            List<Path> plots, String scenarioName, String scenarioText) throws IOException {
        return HtmlReport.write(directory.resolve(HtmlReport.FILE_NAME), "Simulation of " + title, record,
                List.of(summary), List.of(metrics.html()), plots, scenarioName, scenarioText);
    }

    /** The page of a discretisation study: its table, its plots, its scenario. */
    static Path compare(Path directory, ReportRecord record, String title, StudyResult result, ResultTable table,
            List<Path> plots, String scenarioText) throws IOException {
        String summary = "Continuous gain crossover ωc = " + NumberText.of(result.crossoverRadPerSecond())
                + " rad/s; periods " + result.periodsSeconds() + " s; set-point step " + result.setpointStepSize()
                + ", load step " + result.loadStepSize() + "; common practice ωc·h from " + SamplingVerdict.TYPICAL_LOW
                + " to " + SamplingVerdict.TYPICAL_HIGH + ". Continuous row: " + result.rows().get(0).note();
        // PNG, not SVG: XChart draws text as paths, so a study's SVGs make a page of 10 MB or more
        List<Path> pngs = plots.stream().filter(p -> p.toString().endsWith(".png")).toList();
        return HtmlReport.write(directory.resolve(HtmlReport.FILE_NAME), "Discretisation study of " + title, record,
                List.of(summary), List.of(table.html()), pngs, title, scenarioText);
    }
}
