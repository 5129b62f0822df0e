package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import com.fasterxml.jackson.databind.JsonNode;

import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.design.Candidate;
import org.loopwright.sim.design.DesignExperiment;
import org.loopwright.sim.design.DesignModel;
import org.loopwright.sim.design.DesignResult;
import org.loopwright.sim.design.DesignSpec;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.report.ReportRecord;
import org.loopwright.sim.report.ResultTable;
import org.loopwright.sim.report.ResultTable.Column;

/**
 * The outputs of {@code design}: the candidate columns (one list for the text table, the CSV, the JSON
 * and the report), {@code controller.yaml}, {@code scenario.yaml}, {@code candidates.csv},
 * {@code design.json} and the text printed.
 */
final class DesignFiles {

    static final String CONTROLLER = "controller.yaml";
    static final String SCENARIO = "scenario.yaml";
    static final String CANDIDATES = "candidates.csv";
    static final String JSON = "design.json";

    /** The candidate table's caption. */
    static final String CAPTION = "Candidates (margins of the sampled loop; n/a: not applicable or not simulated)";

    /**
     * The candidate table, one declaration for the text table, the report, {@code candidates.csv} and
     * {@code design.json}; margins are those of the sampled loop.
     *
     * @param result the design
     * @param words  whether to add the note and source columns (the text and the report give them apart)
     * @return the table
     */
    static ResultTable candidates(DesignResult result, boolean words) {
        List<Column> columns = new ArrayList<>(List.of(Column.text("name", "candidate"), Column.text("rule", "rule"),
                Column.text("type", "type"), Column.number("gain", "Kc", "", 4),
                Column.number("integral_time", "Ti", "s", 4), Column.number("derivative_time", "Td", "s", 4),
                Column.number("gain_margin", "GM", "", 4), Column.number("phase_margin_deg", "PM", "deg", 4),
                Column.number("ms", "Ms", "", 4), Column.number("mt", "Mt", "", 4),
                Column.number("delay_margin", "delay margin", "s", 4), Column.text("stable", "stable"),
                Column.number("overshoot_pct", "overshoot", "%", 4), Column.number("settling_time", "settling", "s", 4),
                Column.number("load_iae", "load IAE", "", 4), Column.number("total_variation", "output TV", "", 4),
                Column.number("sweep_unstable_share", "sweep unstable", "", 4),
                Column.number("sweep_p90_overshoot_pct", "sweep p90 overshoot", "%", 4),
                Column.text("meets_constraints", "meets")));
        if (words) {
            columns.add(Column.text("note", "note"));
            columns.add(Column.text("source", "source"));
        }
        ResultTable table = ResultTable.of(CAPTION, columns.toArray(Column[]::new));
        for (Candidate c : result.candidates()) {
            List<Object> row = new ArrayList<>(List.of(c.name(), c.rule(), OptionWords.CONTROLLER_TYPES.word(c.type()),
                    c.gains().gain(), c.gains().integralTime(), c.gains().derivativeTime(), c.gainMargin(),
                    c.phaseMarginDegrees(), c.ms(), c.mt(), c.delayMarginSeconds(), c.stable(), c.overshootPercent(),
                    c.settlingTimeSeconds(), c.loadIae(), c.totalVariation(), c.sweepUnstableShare(),
                    c.sweepP90OvershootPercent(), c.meetsConstraints()));
            if (words) {
                row.add(join(c.shortfall(), c.note()));
                row.add(c.source());
            }
            table.row(row.toArray());
        }
        return table;
    }

    private DesignFiles() {
    }

    /**
     * Writes every file into the directory.
     *
     * @return the names written, in order
     */
    static List<String> write(DesignResult result, Path directory, ReportRecord record) throws IOException {
        List<String> files = new ArrayList<>();
        if (result.recommended().isPresent()) {
            Candidate c = result.recommended().get();
            String header = "# Recommended by loopwright design: " + c.name() + " (" + result.verdict() + ").\n"
                    + "# Try it in simulation first, then on the plant at reduced range, with someone watching.\n";
            Files.writeString(directory.resolve(CONTROLLER), header + ControllerFile.toYaml(c.device()),
                    StandardCharsets.UTF_8);
            Files.writeString(directory.resolve(SCENARIO), c.scenarioText(), StandardCharsets.UTF_8);
            files.add(CONTROLLER);
            files.add(SCENARIO);
        }
        try (Writer out = Files.newBufferedWriter(directory.resolve(CANDIDATES), StandardCharsets.UTF_8)) {
            candidates(result, true).csv(out);
        }
        files.add(CANDIDATES);
        files.add(JSON);
        files.add(org.loopwright.sim.report.HtmlReport.FILE_NAME);
        Files.writeString(directory.resolve(JSON), JsonOutput.text(json(result, files)) + "\n", StandardCharsets.UTF_8);
        DesignReport.write(result, directory, record);
        return files;
    }

    /**
     * design.json (snake_case keys, null for a figure that does not exist or apply).
     *
     * @param model               the model designed for
     * @param samplePeriod        h, s
     * @param maxSensitivity      the limit on the sampled loop's Ms
     * @param sensorDelaySamples  whole samples of measurement delay
     * @param outputMin           lower output limit (null: none)
     * @param outputMax           upper output limit (null: none)
     * @param outputSlew          output slew limit per second (null: none)
     * @param integralMethod      the controller file's word
     * @param derivativeMethod    the controller file's word
     * @param experiment          the simulated steps and the sweep
     * @param candidates          the candidate table's rows
     * @param notApplicable       the rules that do not apply, with why
     * @param recommended         the recommended candidate's name, or null
     * @param verdict             the verdict's word
     * @param discretisationCheck the recommended gains with each discretisation method
     * @param files               the files written
     */
    record DesignJson(ModelJson model, double samplePeriod, double maxSensitivity, int sensorDelaySamples,
            double outputMin, double outputMax, double outputSlew, String integralMethod, String derivativeMethod,
            ExperimentJson experiment, JsonNode candidates, List<String> notApplicable, String recommended,
            String verdict, List<CheckJson> discretisationCheck, List<String> files) {
    }

    /** The model: its type, K, T, T2 and L in s, the fit's RMSE and R² (null without a fit), where it came from. */
    record ModelJson(String type, double gain, double timeConstant, double secondTimeConstant, double deadTime,
            double rmse, double rSquared, String source, String choice) {
    }

    /** The simulated steps (seconds, output units) and the robustness sweep. */
    record ExperimentJson(double operatingOutput, double setpointStep, double loadStep, double loadAt, double duration,
            String spread, int runs, long seed) {
    }

    /** One discretisation method pair with the recommended gains. */
    record CheckJson(String integralMethod, String derivativeMethod, boolean chosen, double phaseMarginDeg, double ms,
            boolean stable, String note) {
    }

    /** design.json's record. */
    static DesignJson json(DesignResult result, List<String> files) {
        DesignModel m = result.model();
        DesignSpec s = result.spec();
        DesignExperiment e = result.experiment();
        return new DesignJson(new ModelJson(m.type(), m.model().processGain(), m.timeConstantSeconds(),
                m.secondTimeConstantSeconds(), m.model().deadTimeSeconds(), m.rmse(), m.rSquared(), m.source(),
                m.choice()), s.samplePeriodSeconds(), s.maxSensitivity(), s.sensorDelaySamples(), s.outputMin(),
                s.outputMax(), s.outputSlewPerSecond(), ControllerFile.INTEGRAL_METHODS.word(s.integralMethod()),
                ControllerFile.DERIVATIVE_METHODS.word(s.derivativeMethod()),
                new ExperimentJson(e.operatingOutput(), e.setpointStep(), e.loadStep(), e.loadAtSeconds(),
                        e.durationSeconds(), s.spread().text(), s.runs(), s.seed()),
                candidates(result, true).json(), result.notApplicable(),
                result.recommended().map(Candidate::name).orElse(null), result.verdict(),
                result.discretisation().stream().map(row -> new CheckJson(
                        ControllerFile.INTEGRAL_METHODS.word(row.integralMethod()), row.derivativeMethod() == null
                                ? null : ControllerFile.DERIVATIVE_METHODS.word(row.derivativeMethod()), row.chosen(),
                        row.phaseMarginDegrees(), row.ms(), row.stable(), row.note())).toList(), files);
    }

    /** The text output: the model, the candidate table, the recommendation, the files. */
    static void printText(PrintWriter out, DesignResult result, List<String> files, Path directory) {
        DesignModel m = result.model();
        DesignSpec s = result.spec();
        out.println("Model: " + m.describe() + " (" + m.source()
                + (m.fit().isPresent() ? String.format(Locale.ROOT, "; RMSE %.4g, R² %.5f", m.rmse(), m.rSquared()) : "")
                + ")");
        if (!m.choice().isEmpty()) {
            out.println("  " + m.choice());
        }
        DesignExperiment e = result.experiment();
        out.println(String.format(Locale.ROOT, "Device: h = %s s, output %s .. %s, slew %s, sensor delay %d samples;"
                + " limit Ms <= %s", s.samplePeriodSeconds(), limit(s.outputMin()), limit(s.outputMax()),
                Double.isFinite(s.outputSlewPerSecond()) ? s.outputSlewPerSecond() + " per s" : "none",
                s.sensorDelaySamples(), s.maxSensitivity()));
        out.println(String.format(Locale.ROOT, "Checks: sampled loop (sensor delay included); setpoint step %.4g at 0 s,"
                + " load step %.4g at %.4g s, run %.4g s (around the output %s); sweep of %d plants (%s, seed %d)",
                e.setpointStep(), e.loadStep(), e.loadAtSeconds(), e.durationSeconds(), e.operatingOutput(),
                s.runs(), s.spread().text(), s.seed()));
        out.print(candidates(result, false).text());
        for (Candidate c : result.candidates()) {
            String why = join(c.shortfall(), c.note());
            if (!why.isEmpty()) {
                out.println("  " + c.name() + ": " + why);
            }
        }
        result.notApplicable().forEach(n -> out.println("  not applicable: " + n));
        out.println(recommendation(result));
        out.println("Wrote " + String.join(", ", files) + " in " + directory);
    }

    /** The one line naming the recommendation and the verdict. */
    static String recommendation(DesignResult result) {
        if (result.recommended().isEmpty()) {
            return "NO RECOMMENDATION: no candidate gives a stable sampled loop. Nothing to load; look at the model,"
                    + " the sample period and the sensor delay.";
        }
        Candidate c = result.recommended().get();
        String figures = String.format(Locale.ROOT, "Kc %.4g, Ti %.4g s, Td %.4g s; sampled Ms %.3f, load IAE %.4g",
                c.gains().gain(), c.gains().integralTime(), c.gains().derivativeTime(), c.ms(), c.loadIae());
        if (result.constraintsMet()) {
            return "Recommended: " + c.name() + " (" + figures + "): the smallest load IAE among the candidates that"
                    + " meet every constraint.";
        }
        return "NO CANDIDATE MEETS THE CONSTRAINTS (stable, Ms <= " + result.spec().maxSensitivity() + ", no unstable"
                + " sweep run). Least bad, by the smallest Ms: " + c.name() + " (" + figures + "; " + c.shortfall()
                + "). Review before loading it.";
    }

    /** An output limit in words: the number, or "none". */
    static String limit(double value) {
        return Double.isFinite(value) ? String.valueOf(value) : "none";
    }

    static String join(String a, String b) {
        return a.isEmpty() ? b : b.isEmpty() ? a : a + "; " + b;
    }
}
