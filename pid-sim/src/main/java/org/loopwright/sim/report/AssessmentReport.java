package org.loopwright.sim.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.loopwright.sim.assess.Assessment;
import org.loopwright.sim.assess.Finding;
import org.loopwright.sim.assess.TimeSpan;
import org.loopwright.sim.replay.LoggedLoop;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

/**
 * Everything {@code assess} shows, in one place: the text table, the JSON object, the two plots
 * (trend with the oscillation stretches marked; output against measurement) and {@code report.html}.
 */
public final class AssessmentReport {

    /** Base name of the trend plot. */
    public static final String TREND = "assess-trend";
    /** Base name of the output-against-measurement plot. */
    public static final String PHASE_PLOT = "assess-output-vs-measurement";

    private static final List<String> COLUMNS = List.of("condition", "status", "value", "threshold", "unit",
            "method", "source", "note");
    private static final int MAX_SCATTER_POINTS = 5_000;

    private AssessmentReport() {
    }

    /** A number as the table shows it: 4 significant digits without trailing zeros, "-" when there is none. */
    public static String number(double value) {
        if (!Double.isFinite(value)) {
            return "-";
        }
        String text = String.format(Locale.ROOT, "%.4g", value);
        return text.contains("e") ? text : new java.math.BigDecimal(text).stripTrailingZeros().toPlainString();
    }

    /**
     * The findings as a text table (condition, status, value, threshold, unit; flagged statuses in
     * capitals) with method, source and note under each.
     */
    public static String table(Assessment a) {
        StringBuilder text = new StringBuilder();
        text.append(String.format(Locale.ROOT, "%-24s %-13s %12s %12s  %s%n", "condition", "status", "value",
                "threshold", "unit"));
        for (Finding f : a.findings()) {
            text.append(String.format(Locale.ROOT, "%-24s %-13s %12s %12s  %s%n", f.name(),
                    f.status().flagged() ? f.status().label().toUpperCase(Locale.ROOT) : f.status().label(),
                    number(f.value()), number(f.threshold()), f.unit()));
            text.append("    ").append(f.method()).append("; ").append(f.source()).append(". ").append(f.note())
                    .append(System.lineSeparator());
        }
        return text.toString();
    }

    /** One line of what the loop has, or that nothing was flagged. */
    public static String verdict(Assessment a) {
        List<String> flagged = new ArrayList<>();
        for (Finding f : a.findings()) {
            if (f.status().flagged()) {
                flagged.add(f.name() + " " + f.status().label());
            }
        }
        String oscillation = Double.isFinite(a.oscillationPeriodSeconds())
                ? String.format(Locale.ROOT, " (oscillation period %s s, amplitude %s)",
                        number(a.oscillationPeriodSeconds()), number(a.oscillationAmplitude())) : "";
        return flagged.isEmpty() ? "nothing flagged" : String.join(", ", flagged) + oscillation;
    }

    /** The JSON object, with exactly the keys {@code assess --json} documents. */
    public static ObjectNode json(Assessment a) {
        ObjectMapper mapper = new ObjectMapper();
        ObjectNode root = mapper.createObjectNode();
        root.put("samples", a.samples());
        number(root, "sample_period", a.samplePeriodSeconds());
        ArrayNode conditions = root.putArray("conditions");
        for (Finding f : a.findings()) {
            ObjectNode c = conditions.addObject();
            c.put("name", f.name());
            c.put("status", f.status().label());
            number(c, "value", f.value());
            number(c, "threshold", f.threshold());
            c.put("unit", f.unit());
            c.put("method", f.method());
            c.put("source", f.source());
            c.put("note", f.note());
        }
        number(root, "oscillation_period", a.oscillationPeriodSeconds());
        number(root, "oscillation_amplitude", a.oscillationAmplitude());
        return root;
    }

    private static void number(ObjectNode node, String key, double value) {
        if (Double.isFinite(value)) {
            node.put(key, value);
        } else {
            node.putNull(key);
        }
    }

    /**
     * Writes the two plots (PNG and SVG) and {@code report.html} into the directory.
     *
     * @param record how the report was made (tool version, time, command line, input checksums, settings)
     * @param inputs lines describing the inputs and assumptions, shown at the end of the page
     * @return the files written
     */
    public static List<Path> write(Path directory, ReportRecord record, LoggedLoop loop, Assessment a, String inputs)
            throws IOException {
        System.setProperty("java.awt.headless", "true");
        ResponsePlot.save(trend(loop, a), directory, TREND);
        ResponsePlot.save(outputAgainstMeasurement(loop), directory, PHASE_PLOT);
        List<List<String>> rows = new ArrayList<>();
        for (Finding f : a.findings()) {
            rows.add(List.of(f.name(), f.status().label(), number(f.value()), number(f.threshold()), f.unit(),
                    f.method(), f.source(), f.note()));
        }
        HtmlTable table = new HtmlTable("Conditions (value judged against the alarm threshold; the note gives the"
                + " warn threshold, the evidence, or why a method was not applied)", COLUMNS, rows);
        String summary = String.format(Locale.ROOT, "%d samples every %s s. Verdict: %s. Oscillation stretches"
                + " flagged by the monitor are marked red on the trend.", a.samples(), number(a.samplePeriodSeconds()),
                verdict(a));
        Path page = HtmlReport.write(directory.resolve(HtmlReport.FILE_NAME), "Assessment of " + loop.name(), record,
                List.of(summary), List.of(table),
                List.of(directory.resolve(TREND + ".png"), directory.resolve(PHASE_PLOT + ".png")),
                loop.name(), inputs);
        return List.of(page, directory.resolve(TREND + ".png"), directory.resolve(TREND + ".svg"),
                directory.resolve(PHASE_PLOT + ".png"), directory.resolve(PHASE_PLOT + ".svg"));
    }

    private static String shortName(LoggedLoop loop) {
        return String.valueOf(Path.of(loop.name()).getFileName());
    }

    /** Setpoint and measurement (left), output (right), and a red bar under the curves where the loop oscillated. */
    static XYChart trend(LoggedLoop loop, Assessment a) {
        XYChart chart = ResponsePlot.chart("Trend of " + shortName(loop), "time (s)", "process value");
        int n = loop.length();
        int stride = Math.max(1, (n + ResponsePlot.MAX_POINTS - 1) / ResponsePlot.MAX_POINTS);
        List<Double> time = new ArrayList<>();
        List<Double> setpoint = new ArrayList<>();
        List<Double> measurement = new ArrayList<>();
        List<Double> output = new ArrayList<>();
        double low = Double.POSITIVE_INFINITY;
        double high = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < n; k += stride) {
            time.add(loop.time(k));
            setpoint.add(loop.setpoint(k));
            measurement.add(loop.measurement(k));
            output.add(loop.output(k));
        }
        for (int k = 0; k < n; k++) {
            for (double v : new double[] {loop.setpoint(k), loop.measurement(k)}) {
                if (Double.isFinite(v)) {
                    low = Math.min(low, v);
                    high = Math.max(high, v);
                }
            }
        }
        ResponsePlot.line(chart, "setpoint", time, setpoint, 0);
        ResponsePlot.line(chart, "measurement", time, measurement, 0);
        ResponsePlot.line(chart, "controller output", time, output, 1);
        chart.setYAxisGroupTitle(1, "controller output");
        chart.getStyler().setYAxisGroupPosition(1, Styler.YAxisPosition.Right);
        if (!a.oscillationStretches().isEmpty() && Double.isFinite(low)) {
            double level = low - 0.05 * Math.max(high - low, 1e-9);
            List<Double> x = new ArrayList<>();
            List<Double> y = new ArrayList<>();
            for (TimeSpan s : a.oscillationStretches()) {
                x.add(s.fromSeconds());
                y.add(level);
                x.add(s.toSeconds());
                y.add(level);
                x.add(s.toSeconds());
                y.add(Double.NaN);
            }
            XYSeries bar = ResponsePlot.line(chart, "oscillation flagged", x, y, 0);
            bar.setLineColor(Color.RED);
            bar.setLineStyle(new BasicStroke(6.0f));
        }
        return chart;
    }

    /** Output against measurement: a stuck actuator draws boxes, a linear loop ellipses. */
    static XYChart outputAgainstMeasurement(LoggedLoop loop) {
        XYChart chart = ResponsePlot.chart("Controller output against measurement, " + shortName(loop), "measurement",
                "controller output");
        int n = loop.length();
        int stride = Math.max(1, (n + MAX_SCATTER_POINTS - 1) / MAX_SCATTER_POINTS);
        List<Double> x = new ArrayList<>();
        List<Double> y = new ArrayList<>();
        for (int k = 0; k < n; k += stride) {
            if (Double.isFinite(loop.measurement(k)) && Double.isFinite(loop.output(k))) {
                x.add(loop.measurement(k));
                y.add(loop.output(k));
            }
        }
        chart.getStyler().setXAxisDecimalPattern(null);
        chart.getStyler().setLegendVisible(false);
        XYSeries series = chart.addSeries("samples", x, y);
        series.setXYSeriesRenderStyle(org.knowm.xchart.XYSeries.XYSeriesRenderStyle.Line);
        series.setMarker(SeriesMarkers.NONE);
        series.setLineStyle(new BasicStroke(0.8f));
        return chart;
    }
}
