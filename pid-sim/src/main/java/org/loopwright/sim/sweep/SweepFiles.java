package org.loopwright.sim.sweep;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.PlantParameters;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.ResponsePlot;

/**
 * A sweep's files: {@value #CSV} with one row per run (Commons CSV) and {@value #PLOT_NAME}.png/.svg
 * with every run's measurement overlaid, the nominal run in black (XChart). The CSV's columns
 * ({@link #header(PlantModel)}): the run's index, its factor per spread key ({@code gain_factor}, ...),
 * the plant simulated, the stability verdict ({@code stable}, {@code unstable}, {@code oscillating},
 * {@code diverged}, {@code not-assessed}) with its evidence, and the response figures (seconds,
 * percent, process units; empty where a figure does not apply). For a linear plant ({@link #HEADER})
 * the plant is its coefficients in descending powers of s, separated by spaces, and dead time in
 * seconds, and the evidence the largest closed-loop pole magnitude; for a nonlinear plant the plant is
 * the drawn value of each spread key (in the file's units) and the evidence the decay ratio of
 * {@link SustainedOscillation}.
 */
public final class SweepFiles {

    /** The CSV file's name. */
    public static final String CSV = "sweep-runs.csv";
    /** The plot's base name. */
    public static final String PLOT_NAME = "sweep-measurements";
    /** The CSV's header for a linear plant, in column order. */
    public static final List<String> HEADER = List.of("run", "gain_factor", "time_constant_factor",
            "dead_time_factor", "numerator", "denominator", "dead_time", "stability", "largest_pole_magnitude",
            "rise_time", "settling_time", "overshoot_percent", "steady_state_error", "iae", "saturated_fraction");
    private static final List<String> FIGURES = HEADER.subList(HEADER.indexOf("rise_time"), HEADER.size());

    private static final Color RUN_COLOUR = new Color(31, 119, 180, 70);
    private static final Color UNSTABLE_COLOUR = new Color(214, 39, 40, 110);
    /** Unstable runs are clipped to the stable runs' range widened by this share of it. */
    private static final double CLIP_MARGIN = 0.25;
    /** About the most points all runs together are drawn with. */
    private static final int PLOT_POINT_BUDGET = 40_000;

    private SweepFiles() {
    }

    /**
     * Writes the CSV and the plot into {@code directory} (created if missing).
     *
     * @return the files written
     */
    public static List<Path> write(SweepResult result, Path directory, String title) throws IOException {
        Files.createDirectories(directory);
        Path csv = directory.resolve(CSV);
        writeCsv(result, csv);
        System.setProperty("java.awt.headless", "true");
        ResponsePlot.save(plot(result, title), directory, PLOT_NAME);
        return List.of(csv, directory.resolve(PLOT_NAME + ".png"), directory.resolve(PLOT_NAME + ".svg"));
    }

    /**
     * The CSV's header for a sweep around a plant: {@link #HEADER} for a transfer function; for another model the
     * run, a factor and a drawn value per spread key, the stability and its evidence (the largest pole magnitude
     * when the model is linear, a motor without friction or load; the decay ratio otherwise), and the figures.
     */
    public static List<String> header(PlantModel nominal) {
        if (nominal instanceof TransferFunction) {
            return HEADER;
        }
        List<String> header = new ArrayList<>();
        header.add("run");
        List<String> columns = nominal.type().spreadKeys().stream().map(k -> k.word().replace('-', '_')).toList();
        columns.forEach(column -> header.add(column + "_factor"));
        header.addAll(columns);
        header.add("stability");
        header.add(nominal.linear().isPresent() ? "largest_pole_magnitude" : "decay_ratio");
        header.addAll(FIGURES);
        return header;
    }

    /** Writes one row per run. */
    public static void writeCsv(SweepResult result, Path file) throws IOException {
        PlantModel nominal = result.scenario().plant();
        try (Writer out = Files.newBufferedWriter(file, StandardCharsets.UTF_8);
                CSVPrinter csv = CSVFormat.DEFAULT.builder().setHeader(header(nominal).toArray(String[]::new))
                        .setRecordSeparator('\n').get().print(out)) {
            for (SweepRun run : result.runs()) {
                List<Object> row = new ArrayList<>();
                row.add(run.index());
                for (FileKey<Double> key : nominal.type().spreadKeys()) {
                    row.add(run.draw().factor(key.word()));
                }
                if (run.plant() instanceof TransferFunction plant) {
                    row.addAll(List.of(coefficients(plant.numerator()), coefficients(plant.denominator()),
                            plant.deadTimeSeconds(), word(run.stability()), cell(run.largestPoleMagnitude())));
                } else {
                    for (FileKey<Double> key : nominal.type().spreadKeys()) {
                        row.add(PlantParameters.value(run.plant(), key));
                    }
                    row.addAll(List.of(word(run.stability()), cell(nominal.linear().isPresent()
                            ? run.largestPoleMagnitude() : run.decayRatio())));
                }
                ResponseMetrics m = run.metrics();
                row.addAll(List.of(cell(m.riseTimeSeconds()), cell(m.settlingTimeSeconds()),
                        cell(m.overshootPercent()), cell(m.steadyStateError()), cell(m.iae()),
                        cell(m.saturatedFraction())));
                csv.printRecord(row);
            }
        }
    }

    private static String word(LoopStability stability) {
        return stability.name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    private static String coefficients(double[] values) {
        return Arrays.stream(values).mapToObj(Double::toString).collect(Collectors.joining(" "));
    }

    private static String cell(double value) {
        return Double.isNaN(value) ? "" : Double.toString(value);
    }

    /** Every run's measurement against time, the nominal run on top. */
    public static XYChart plot(SweepResult result, String title) {
        double low = Double.POSITIVE_INFINITY;
        double high = Double.NEGATIVE_INFINITY;
        boolean anyUnstable = false;
        for (SweepRun run : plotted(result)) {
            if (unstable(run)) {
                anyUnstable = true;
                continue;
            }
            for (double y : run.plotMeasurements()) {
                if (Double.isFinite(y)) {
                    low = Math.min(low, y);
                    high = Math.max(high, y);
                }
            }
        }
        boolean clip = anyUnstable && low < high;
        double margin = CLIP_MARGIN * (high - low);
        XYChart chart = ResponsePlot.chart(title + ": " + result.runs().size() + " runs"
                + (clip ? " (" + (result.stabilityBasis() == StabilityBasis.POLES ? "unstable" : "oscillating")
                        + " runs in red, clipped)" : ""), "time (s)", "measurement");
        // the SVG grows with every point: many runs are thinned further, the nominal run is not
        int stride = Math.max(1, result.runs().size() * Sweep.PLOT_POINTS / PLOT_POINT_BUDGET);
        for (SweepRun run : result.runs()) {
            XYSeries series = add(chart, "run " + run.index(), run, stride, clip, low - margin, high + margin);
            if (series != null) {
                series.setLineColor(unstable(run) ? UNSTABLE_COLOUR : RUN_COLOUR);
                series.setLineStyle(new BasicStroke(1.0f));
                series.setShowInLegend(false);
            }
        }
        XYSeries nominal = add(chart, "nominal plant", result.nominal(), 1, clip, low - margin, high + margin);
        if (nominal != null) {
            nominal.setLineColor(Color.BLACK);
            nominal.setLineStyle(new BasicStroke(2.0f));
        }
        chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideSE);
        return chart;
    }

    /** Runs drawn in red and left out of the plot's range: unstable by the poles, or oscillating. */
    private static boolean unstable(SweepRun run) {
        return run.stability() == LoopStability.UNSTABLE || run.stability() == LoopStability.OSCILLATING;
    }

    private static List<SweepRun> plotted(SweepResult result) {
        List<SweepRun> all = new ArrayList<>(result.runs());
        all.add(result.nominal());
        return all;
    }

    private static XYSeries add(XYChart chart, String name, SweepRun run, int stride, boolean clip, double low,
            double high) {
        double[] t = run.plotTimes();
        double[] y = run.plotMeasurements();
        List<Double> times = new ArrayList<>();
        List<Double> values = new ArrayList<>();
        int last = t.length - 1;
        for (int i = 0; i <= last; i += stride) {
            point(t[i], y[i], clip, low, high, times, values);
        }
        if (last % stride != 0) {
            point(t[last], y[last], clip, low, high, times, values);
        }
        return times.isEmpty() ? null : ResponsePlot.line(chart, name, times, values, 0);
    }

    private static void point(double t, double y, boolean clip, double low, double high, List<Double> times,
            List<Double> values) {
        if (Double.isNaN(y) || !clip && Double.isInfinite(y)) {
            return; // a dropout, or a diverged run with nothing stable to clip it to
        }
        times.add(t);
        values.add(clip ? Math.max(low, Math.min(high, y)) : y);
    }
}
