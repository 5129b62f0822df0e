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
import org.loopwright.sim.report.ResultTable.Column;


/**
 * Everything {@code assess} shows, in one place: the text table, the JSON object, the two plots
 * (trend with the oscillation stretches marked; output against measurement) and {@code report.html}.
 */
public final class AssessmentReport {

    /** Base name of the trend plot. */
    public static final String TREND = "assess-trend";
    /** Base name of the output-against-measurement plot. */
    public static final String PHASE_PLOT = "assess-output-vs-measurement";

    private static final int MAX_SCATTER_POINTS = 5_000;

    private AssessmentReport() {
    }

    /** A number as the table shows it: {@link NumberText}'s 4 significant digits, "n/a" when there is none. */
    public static String number(double value) {
        return NumberText.of(value);
    }

    /**
     * The findings as one table for the text output and the report: condition, status (flagged ones in
     * capitals), value, threshold, unit and, with {@code words}, the method, source and note.
     *
     * @param a     the assessment
     * @param words whether to add the method, source and note columns (the text gives them under the table)
     * @return the table
     */
    public static ResultTable conditions(Assessment a, boolean words) {
        List<Column> columns = new ArrayList<>(List.of(Column.text("condition", "condition"),
                Column.text("status", "status"), Column.number("value", "value", "", NumberText.DEFAULT_DIGITS),
                Column.number("threshold", "threshold", "", NumberText.DEFAULT_DIGITS), Column.text("unit", "unit")));
        if (words) {
            columns.addAll(List.of(Column.text("method", "method"), Column.text("source", "source"),
                    Column.text("note", "note")));
        }
        ResultTable table = ResultTable.of("Conditions (value judged against the alarm threshold; the note gives the"
                + " warn threshold, the evidence, or why a method was not applied)", columns.toArray(Column[]::new));
        for (Finding f : a.findings()) {
            List<Object> row = new ArrayList<>(List.of(f.name(), f.status().flagged()
                    ? f.status().label().toUpperCase(Locale.ROOT) : f.status().label(), f.value(), f.threshold(),
                    f.unit()));
            if (words) {
                row.addAll(List.of(f.method(), f.source(), f.note()));
            }
            table.row(row.toArray());
        }
        return table;
    }

    /** The findings as text: the table, then each condition's method, source and note. */
    public static String table(Assessment a) {
        StringBuilder text = new StringBuilder(conditions(a, false).text());
        for (Finding f : a.findings()) {
            text.append("  ").append(f.name()).append(": ").append(f.method()).append("; ").append(f.source())
                    .append(". ").append(f.note()).append(System.lineSeparator());
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

    /**
     * {@code assess --json}, with exactly the keys it documents (snake_case, null for a missing figure).
     *
     * @param samples              samples in the record
     * @param samplePeriod         h, s
     * @param conditions           one per condition assessed
     * @param oscillationPeriod    the oscillation's period, s, or null
     * @param oscillationAmplitude its amplitude, or null
     */
    public record AssessmentJson(int samples, double samplePeriod, List<ConditionJson> conditions,
            double oscillationPeriod, double oscillationAmplitude) {
    }

    /**
     * One condition.
     *
     * @param name      the condition
     * @param status    its status word (ok, warn, alarm, not-assessed...)
     * @param value     the figure judged, or null
     * @param threshold the alarm threshold, or null
     * @param unit      the figure's unit
     * @param method    how it was judged
     * @param source    where the method comes from
     * @param note      the evidence, the warn threshold, or why it was not assessed
     */
    public record ConditionJson(String name, String status, double value, double threshold, String unit, String method,
            String source, String note) {
    }

    /** The JSON record of an assessment. */
    public static AssessmentJson json(Assessment a) {
        return new AssessmentJson(a.samples(), a.samplePeriodSeconds(), a.findings().stream().map(f -> new ConditionJson(
                f.name(), f.status().label(), f.value(), f.threshold(), f.unit(), f.method(), f.source(), f.note()))
                .toList(), a.oscillationPeriodSeconds(), a.oscillationAmplitude());
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
        HtmlTable table = conditions(a, true).html();
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
