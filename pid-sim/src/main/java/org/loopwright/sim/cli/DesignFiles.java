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
import java.util.function.Function;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.design.Candidate;
import org.loopwright.sim.design.DesignExperiment;
import org.loopwright.sim.design.DesignModel;
import org.loopwright.sim.design.DesignResult;
import org.loopwright.sim.design.DesignSpec;
import org.loopwright.sim.design.DiscretisationCheck;
import org.loopwright.sim.report.ReportRecord;

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

    /**
     * One column of the candidate table.
     *
     * @param key     the JSON key and CSV header
     * @param heading the text and report heading
     * @param value   the cell: a String, a Boolean or a Double (NaN and infinities become null)
     */
    record Column(String key, String heading, Function<Candidate, Object> value) {
    }

    /** Every candidate column, in order. Margins are those of the sampled loop. */
    static final List<Column> COLUMNS = List.of(
            new Column("name", "candidate", Candidate::name),
            new Column("rule", "rule", Candidate::rule),
            new Column("type", "type", c -> c.type().name().toLowerCase(Locale.ROOT)),
            new Column("gain", "Kc", c -> c.gains().gain()),
            new Column("integral_time", "Ti [s]", c -> c.gains().integralTime()),
            new Column("derivative_time", "Td [s]", c -> c.gains().derivativeTime()),
            new Column("gain_margin", "sampled GM", Candidate::gainMargin),
            new Column("phase_margin_deg", "sampled PM [deg]", Candidate::phaseMarginDegrees),
            new Column("ms", "sampled Ms", Candidate::ms),
            new Column("mt", "sampled Mt", Candidate::mt),
            new Column("delay_margin", "delay margin [s]", Candidate::delayMarginSeconds),
            new Column("stable", "stable", Candidate::stable),
            new Column("overshoot_pct", "overshoot [%]", Candidate::overshootPercent),
            new Column("settling_time", "settling [s]", Candidate::settlingTimeSeconds),
            new Column("load_iae", "load IAE", Candidate::loadIae),
            new Column("total_variation", "output TV", Candidate::totalVariation),
            new Column("sweep_unstable_share", "sweep unstable", Candidate::sweepUnstableShare),
            new Column("sweep_p90_overshoot_pct", "sweep p90 overshoot [%]", Candidate::sweepP90OvershootPercent),
            new Column("meets_constraints", "meets", Candidate::meetsConstraints),
            new Column("note", "note", c -> join(c.shortfall(), c.note())));

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
            CSVPrinter csv = CSVFormat.DEFAULT.builder().setHeader(COLUMNS.stream().map(Column::key)
                    .toArray(String[]::new)).setRecordSeparator('\n').get().print(out);
            for (Candidate c : result.candidates()) {
                List<String> row = new ArrayList<>();
                for (Column column : COLUMNS) {
                    Object v = column.value().apply(c);
                    row.add(v instanceof Double d ? (Double.isFinite(d) ? Double.toString(d) : "") : String.valueOf(v));
                }
                csv.printRecord(row);
            }
            csv.flush();
        }
        files.add(CANDIDATES);
        files.add(JSON);
        files.add(org.loopwright.sim.report.HtmlReport.FILE_NAME);
        Files.writeString(directory.resolve(JSON), Json.pretty(json(result, files)) + "\n", StandardCharsets.UTF_8);
        DesignReport.write(result, directory, record);
        return files;
    }

    /** design.json. */
    static ObjectNode json(DesignResult result, List<String> files) {
        ObjectNode root = Json.object();
        DesignModel m = result.model();
        ObjectNode model = root.putObject("model");
        model.put("type", m.type());
        Json.number(model, "gain", m.model().processGain());
        Json.number(model, "time_constant", m.timeConstantSeconds());
        Json.number(model, "second_time_constant", m.secondTimeConstantSeconds());
        Json.number(model, "dead_time", m.model().deadTimeSeconds());
        Json.number(model, "rmse", m.rmse());
        Json.number(model, "r_squared", m.rSquared());
        model.put("source", m.source());
        model.put("choice", m.choice());
        DesignSpec s = result.spec();
        Json.number(root, "sample_period", s.samplePeriodSeconds());
        Json.number(root, "max_sensitivity", s.maxSensitivity());
        root.put("sensor_delay_samples", s.sensorDelaySamples());
        Json.number(root, "output_min", s.outputMin());
        Json.number(root, "output_max", s.outputMax());
        Json.number(root, "output_slew", s.outputSlewPerSecond());
        root.put("integral_method", ControllerFile.INTEGRAL_METHODS.word(s.integralMethod()));
        root.put("derivative_method", ControllerFile.DERIVATIVE_METHODS.word(s.derivativeMethod()));
        DesignExperiment e = result.experiment();
        ObjectNode experiment = root.putObject("experiment");
        Json.number(experiment, "operating_output", e.operatingOutput());
        Json.number(experiment, "setpoint_step", e.setpointStep());
        Json.number(experiment, "load_step", e.loadStep());
        Json.number(experiment, "load_at", e.loadAtSeconds());
        Json.number(experiment, "duration", e.durationSeconds());
        experiment.put("spread", s.spread().text());
        experiment.put("runs", s.runs());
        experiment.put("seed", s.seed());
        ArrayNode candidates = root.putArray("candidates");
        for (Candidate c : result.candidates()) {
            ObjectNode node = candidates.addObject();
            for (Column column : COLUMNS) {
                Object v = column.value().apply(c);
                if (v instanceof Double d) {
                    Json.number(node, column.key(), d);
                } else if (v instanceof Boolean b) {
                    node.put(column.key(), b);
                } else {
                    node.put(column.key(), String.valueOf(v));
                }
            }
            node.put("source", c.source());
        }
        result.notApplicable().forEach(root.putArray("not_applicable")::add);
        if (result.recommended().isPresent()) {
            root.put("recommended", result.recommended().get().name());
        } else {
            root.putNull("recommended");
        }
        root.put("verdict", result.verdict());
        ArrayNode check = root.putArray("discretisation_check");
        for (DiscretisationCheck row : result.discretisation()) {
            ObjectNode node = check.addObject();
            node.put("integral_method", ControllerFile.INTEGRAL_METHODS.word(row.integralMethod()));
            node.put("derivative_method", row.derivativeMethod() == null ? null
                    : ControllerFile.DERIVATIVE_METHODS.word(row.derivativeMethod()));
            node.put("chosen", row.chosen());
            Json.number(node, "phase_margin_deg", row.phaseMarginDegrees());
            Json.number(node, "ms", row.ms());
            node.put("stable", row.stable());
            node.put("note", row.note());
        }
        files.forEach(root.putArray("files")::add);
        return root;
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
        List<Column> shown = COLUMNS.subList(0, COLUMNS.size() - 1);
        StringBuilder format = new StringBuilder();
        for (Column c : shown) {
            format.append(c.key().equals("name") ? "%-24s " : c.key().equals("rule") ? "%-17s " : "%-" + Math.max(
                    c.heading().length(), 7) + "s ");
        }
        format.setLength(format.length() - 1);
        format.append("%n");
        out.printf(Locale.ROOT, format.toString(), shown.stream().map(Column::heading).toArray());
        for (Candidate c : result.candidates()) {
            out.printf(Locale.ROOT, format.toString(), shown.stream().map(col -> cell(col.value().apply(c))).toArray());
        }
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

    static String cell(Object value) {
        if (value instanceof Double d) {
            return Double.isNaN(d) ? "-" : Double.isInfinite(d) ? "inf" : String.format(Locale.ROOT, "%.4g", d);
        }
        if (value instanceof Boolean b) {
            return b ? "yes" : "NO";
        }
        return String.valueOf(value);
    }

    static String join(String a, String b) {
        return a.isEmpty() ? b : b.isEmpty() ? a : a + "; " + b;
    }
}
