package org.loopwright.sim.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.report.HtmlReport;
import org.loopwright.sim.report.MetricsReport;
import org.loopwright.sim.report.HtmlTable;
import org.loopwright.sim.study.SamplingVerdict;
import org.loopwright.sim.study.StudyResult;
import org.loopwright.sim.study.StudyRow;

import picocli.CommandLine.Model.CommandSpec;

/** The {@code report.html} pages of {@code simulate} and {@code compare} (see {@link HtmlReport}). */
final class HtmlReports {

    private HtmlReports() {
    }

    /** The root command's version line, e.g. "loopwright 0.1.0". */
    static String version(CommandSpec spec) {
        String[] lines = spec.root().version();
        return lines.length == 0 ? "loopwright" : lines[0];
    }

    /** The page of one simulation: its metrics, its response plots (the inner loop's too, for a cascade), its scenario. */
    static Path simulate(CommandSpec spec, Path directory, String title, String summary, ResponseMetrics m,
            Optional<LimitCycle> cycle, List<Path> plots, String scenarioName, String scenarioText) throws IOException {
        List<List<String>> rows = MetricsReport.rows(m, cycle);
        HtmlTable table = new HtmlTable("Response metrics (n/a: the figure does not apply). Overshoot: "
                + ResponseMetrics.OVERSHOOT_DEFINITION + ".", List.of("figure", "value"), rows);
        return HtmlReport.write(directory.resolve(HtmlReport.FILE_NAME), "Simulation of " + title, version(spec),
                List.of(summary), List.of(table), plots, scenarioName, scenarioText);
    }

    /** The page of a discretisation study: its table, its SVG plots, its scenario. */
    static Path compare(CommandSpec spec, Path directory, String title, StudyResult result, List<Path> plots,
            String scenarioName, String scenarioText) throws IOException {
        List<List<String>> rows = new ArrayList<>();
        for (StudyRow row : result.rows()) {
            boolean applicable = row.kind() != StudyRow.Kind.NOT_APPLICABLE;
            rows.add(List.of(row.label(),
                    row.kind() == StudyRow.Kind.CONTINUOUS ? "-" : String.valueOf(row.samplePeriodSeconds()),
                    number("%.3f", row.crossoverTimesPeriod()),
                    applicable ? row.verdict() == null ? "-" : row.verdict().description()
                            : "not applicable: " + row.note(),
                    number("%.2f", row.phaseMarginDegrees()), number("%.3f", row.gainMargin()),
                    number("%.3f", row.ms()), row.stable() == null ? "-" : row.stable() ? "yes" : "NO",
                    number("%.2f", row.overshootPercent()), number("%.4g", row.iae()), number("%.4g", row.loadIae()),
                    number("%.3f", row.magnitudeErrorDb()), number("%.2f", row.phaseErrorDegrees())));
        }
        HtmlTable table = new HtmlTable("Each discretisation at each sample period against the continuous design",
                List.of("integral/derivative", "h (s)", "wc*h", "rule of thumb", "PM (deg)", "GM", "Ms", "stable",
                        "overshoot %", "IAE", "load IAE", "|C| error (dB)", "arg C error (deg)"), rows);
        String summary = String.format(Locale.ROOT, "Continuous gain crossover omega_c = %.4g rad/s; periods %s s;"
                + " set-point step %s, load step %s; common practice omega_c*h from %s to %s. Continuous row: %s",
                result.crossoverRadPerSecond(), result.periodsSeconds(), result.setpointStepSize(),
                result.loadStepSize(), SamplingVerdict.TYPICAL_LOW, SamplingVerdict.TYPICAL_HIGH,
                result.rows().get(0).note());
        // PNG, not SVG: XChart draws text as paths, so a study's SVGs make a page of 10 MB or more
        List<Path> pngs = plots.stream().filter(p -> p.toString().endsWith(".png")).toList();
        return HtmlReport.write(directory.resolve(HtmlReport.FILE_NAME), "Discretisation study of " + title,
                version(spec), List.of(summary), List.of(table), pngs, scenarioName, scenarioText);
    }

    private static String number(String format, double value) {
        return Double.isFinite(value) ? String.format(Locale.ROOT, format, value) : "-";
    }
}
