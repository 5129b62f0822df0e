package org.loopwright.sim.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.design.Candidate;
import org.loopwright.sim.design.DesignModel;
import org.loopwright.sim.design.DesignPlots;
import org.loopwright.sim.design.DesignResult;
import org.loopwright.sim.design.DesignSpec;
import org.loopwright.sim.design.DiscretisationCheck;
import org.loopwright.sim.report.HtmlReport;
import org.loopwright.sim.report.HtmlTable;
import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.report.ReportRecord;
import org.loopwright.sim.report.ResultTable;
import org.loopwright.sim.report.ResultTable.Column;

/**
 * The design's {@code report.html} (see {@link HtmlReport}): the verdict, the inputs, the candidate
 * table, the rules that did not apply, the discretisation check at h, a commissioning checklist, the
 * plots (fit and residuals, responses, Bode and Nyquist, sweep) and the recommended scenario.
 */
final class DesignReport {

    /** What to do before and while the settings first run on the plant (common practice). */
    static final List<List<String>> CHECKLIST = List.of(
            List.of("1", "Interlocks in place and tested: over-temperature or over-pressure cut-outs, limit switches,"
                    + " emergency stop. They do not depend on this controller."),
            List.of("2", "Load controller.yaml in manual mode; check the action (direct or reverse), the output"
                    + " limits and the sample period against the device."),
            List.of("3", "First run at reduced range or power, someone watching, with a hand on the manual switch."),
            List.of("4", "Make a small setpoint step; compare the response with the responses plot. Stop if it"
                    + " oscillates or drifts away from it."),
            List.of("5", "Watch a load change; then widen to the full range. Keep this report with the"
                    + " commissioning record."));

    private DesignReport() {
    }

    static Path write(DesignResult result, Path directory, ReportRecord record) throws IOException {
        List<Path> plots = DesignPlots.write(result, directory);
        DesignModel m = result.model();
        DesignSpec s = result.spec();
        List<String> paragraphs = new ArrayList<>();
        paragraphs.add(DesignFiles.recommendation(result));
        paragraphs.add("Margins, Ms, Mt and stability are those of the loop sampled at h = " + s.samplePeriodSeconds()
                + " s with the controller's own discretisation and " + s.sensorDelaySamples() + " samples of sensor"
                + " delay; stability is decided from the closed-loop poles. Unstable candidates are neither simulated"
                + " nor swept. The steps are simulated with the output limits and slew, in deviation from the"
                + " operating point (see the scenario at the end).");
        List<List<String>> inputs = new ArrayList<>();
        inputs.add(List.of("model", m.describe()));
        inputs.add(List.of("model source", m.source() + m.test().map(t -> " " + Path.of(t.fileName()).getFileName())
                .orElse("")));
        if (m.fit().isPresent()) {
            inputs.add(List.of("fit", String.format(Locale.ROOT, "RMSE %.4g, R² %.5f; %s", m.rmse(), m.rSquared(),
                    m.choice())));
        }
        inputs.add(List.of("sample period", s.samplePeriodSeconds() + " s"));
        inputs.add(List.of("output limits", DesignFiles.limit(s.outputMin()) + " .. "
                + DesignFiles.limit(s.outputMax())));
        inputs.add(List.of("output slew", Double.isFinite(s.outputSlewPerSecond()) ? s.outputSlewPerSecond() + " per s"
                : "none"));
        inputs.add(List.of("sensor delay", s.sensorDelaySamples() + " samples"));
        inputs.add(List.of("limit on Ms", String.valueOf(s.maxSensitivity())));
        inputs.add(List.of("discretisation", "integral " + ControllerFile.INTEGRAL_METHODS.word(s.integralMethod())
                + ", derivative " + ControllerFile.DERIVATIVE_METHODS.word(s.derivativeMethod())));
        inputs.add(List.of("steps", String.format(Locale.ROOT, "setpoint %.4g at 0 s, load %.4g at %.4g s, run %.4g s,"
                + " around the output %s", result.experiment().setpointStep(), result.experiment().loadStep(),
                result.experiment().loadAtSeconds(), result.experiment().durationSeconds(),
                result.experiment().operatingOutput())));
        inputs.add(List.of("robustness sweep", s.runs() + " plants, " + s.spread().text() + ", seed " + s.seed()));
        List<HtmlTable> tables = new ArrayList<>();
        tables.add(new HtmlTable("Inputs", List.of("item", "value"), inputs));
        // the figures in one table, the words (shortfall, design notes, source) in the next
        tables.add(DesignFiles.candidates(result, false).html());
        if (!result.notApplicable().isEmpty()) {
            tables.add(new HtmlTable("Rules that do not apply", List.of("rule (type): why"),
                    result.notApplicable().stream().map(List::of).toList()));
        }
        List<List<String>> notes = new ArrayList<>();
        result.candidates().forEach(c -> notes.add(List.of(c.name(), c.shortfall().isEmpty() ? "meets them"
                : c.shortfall(), c.note(), c.source())));
        tables.add(new HtmlTable("Candidates: the constraints, the design choices, the sources", List.of("candidate",
                "constraints", "design notes", "source"), notes));
        if (!result.discretisation().isEmpty()) {
            ResultTable check = ResultTable.of("Discretisation check at h = " + NumberText.of(s.samplePeriodSeconds())
                    + " s: the recommended gains with each method (sampled loop)", Column.text("integral", "integral"),
                    Column.text("derivative", "derivative"), Column.text("chosen", ""),
                    Column.number("phase_margin_deg", "PM", "deg", 4), Column.number("ms", "Ms", "", 4),
                    Column.text("stable", "stable"));
            for (DiscretisationCheck row : result.discretisation()) {
                check.row(ControllerFile.INTEGRAL_METHODS.word(row.integralMethod()), row.derivativeMethod() == null
                        ? "-" : ControllerFile.DERIVATIVE_METHODS.word(row.derivativeMethod()), row.chosen() ? "chosen"
                        : "", row.phaseMarginDegrees(), row.ms(), row.note().isEmpty() ? row.stable() : row.note());
            }
            tables.add(check.html());
        }
        tables.add(new HtmlTable("Commissioning checklist (common practice)", List.of("step", "what"), CHECKLIST));
        String title = "Design " + result.recommended().map(c -> "of " + c.name()).orElse("without a recommendation")
                + " for " + m.describe();
        return HtmlReport.write(directory.resolve(HtmlReport.FILE_NAME), title, record, paragraphs, tables, plots,
                result.recommended().isPresent() ? DesignFiles.SCENARIO : "none (no stable candidate)",
                result.recommended().map(Candidate::scenarioText).orElse(""));
    }
}
