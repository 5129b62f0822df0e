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
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.IntToDoubleFunction;
import java.util.stream.Collectors;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.hipparchus.util.KthSelector;
import org.hipparchus.util.PivotingStrategy;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.PlantParameters;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.ResponsePlot;
import org.loopwright.sim.scenario.Units;

/**
 * A sweep's files: {@value #CSV} with one row per run (Commons CSV) and {@value #PLOT_NAME}.png/.svg
 * with the runs' measurement as an envelope (min to max, 10th to 90th percentile, median), the nominal
 * run in black (XChart). The CSV's columns ({@link #header(PlantModel)}): the run's index, its factor
 * per spread key ({@code gain_factor}, ...), the plant simulated, the stability verdict ({@code stable},
 * {@code unstable}, {@code oscillating}, {@code diverged}, {@code not-assessed}) with its evidence, and
 * the response figures (seconds, percent, process units; empty where a figure does not apply). For a
 * linear plant ({@link #HEADER}) the plant is its coefficients in descending powers of s, separated by
 * spaces, and dead time in seconds, and the evidence the largest closed-loop pole magnitude; for a
 * nonlinear plant the plant is the drawn value of each spread key (in the file's units) and the
 * evidence the decay ratio of {@link SustainedOscillation}.
 */
public final class SweepFiles {

    /** The CSV file's name. */
    public static final String CSV = "sweep-runs.csv";
    /** The plot's base name. */
    public static final String PLOT_NAME = "sweep-measurements";
    /** The CSV's header, in column order. */
    public static final List<String> HEADER = List.of("run", "gain_factor", "time_constant_factor",
            "dead_time_factor", "numerator", "denominator", "dead_time", "stability", "largest_pole_magnitude",
            "rise_time", "settling_time", "overshoot_percent", "steady_state_error", "iae", "saturated_fraction");
    private static final List<String> FIGURES = HEADER.subList(HEADER.indexOf("rise_time"), HEADER.size());

    private static final Color OUTER_BAND = new Color(31, 119, 180, 60);
    private static final Color INNER_BAND = new Color(31, 119, 180, 120);
    private static final Color MEDIAN_COLOUR = new Color(31, 119, 180);
    private static final Color UNSTABLE_COLOUR = new Color(214, 39, 40, 110);
    /** Unstable runs are clipped to the stable runs' range widened by this share of it. */
    private static final double CLIP_MARGIN = 0.25;
    /** The most unstable or diverged runs drawn one by one. */
    private static final int UNSTABLE_DRAWN = 20;
    /** The pivots a selection keeps for the next rank (KthSelector's heap: its first 10 levels). */
    private static final int PIVOTS = (1 << 10) - 1;

    private SweepFiles() {
    }

    /**
     * Writes the CSV and the plot into {@code directory} (created if missing).
     *
     * @return the files written
     */
    public static List<Path> write(SweepResult result, Path directory, String title, Units units) throws IOException {
        Files.createDirectories(directory);
        Path csv = directory.resolve(CSV);
        System.setProperty("java.awt.headless", "true");
        // the three files are independent: written side by side on the cores the runs used, the plot's figures
        // worked out once; each picture draws a chart of its own (a chart keeps its layout while it is drawn)
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            Future<?> rows = pool.submit(() -> {
                writeCsv(result, csv);
                return null;
            });
            PlotFigures figures = PlotFigures.of(result);
            Future<?> vector = pool.submit(() -> {
                ResponsePlot.saveSvg(chart(figures, title, units), directory, PLOT_NAME);
                return null;
            });
            ResponsePlot.savePng(chart(figures, title, units), directory, PLOT_NAME);
            awaitWriting(rows);
            awaitWriting(vector);
        } finally {
            pool.shutdownNow();
        }
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

    /** Waits for a file being written on another thread; its failure is thrown here. */
    private static void awaitWriting(Future<?> writing) throws IOException {
        try {
            writing.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted while the sweep's files were written", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof IOException io) {
                throw io;
            }
            if (e.getCause() instanceof RuntimeException runtime) {
                throw runtime;
            }
            throw new IllegalStateException("writing a sweep file failed", e.getCause());
        }
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

    /**
     * The runs' measurement against time as an envelope, drawn at the same cost for 10 or 10,000 runs:
     * at each thinned instant, over the stable runs (not unstable, oscillating or diverged), the band
     * from the smallest to the largest value and the band from the 10th to the 90th percentile, with the
     * median dashed; the nominal run in black on top; and the first {@value #UNSTABLE_DRAWN} unstable,
     * oscillating or diverged runs in red, each clipped to the stable runs' range widened by a quarter of it.
     */
    public static XYChart plot(SweepResult result, String title) {
        return plot(result, title, Units.NONE);
    }

    /** The envelope plot with the measurement's unit on its axis (the scenario's {@code units}). */
    public static XYChart plot(SweepResult result, String title, Units units) {
        return chart(PlotFigures.of(result), title, units);
    }

    /**
     * What the plot shows, worked out from the runs once: the instants, the stable runs' envelope, the range
     * the unstable runs are clipped to, and the runs drawn in red.
     */
    private record PlotFigures(SweepResult result, String unstableWord, double[] times, int stableRuns,
            double[][] bands, double low, double high, List<SweepRun> unstable) {

        static PlotFigures of(SweepResult result) {
            // a nonlinear plant's runs are judged by simulation: name what was seen, not a pole verdict
            String unstableWord = result.stabilityBasis() == StabilityBasis.POLES ? "unstable" : "oscillating or diverged";
            double[] times = result.nominal().plot().times();
            List<PlotTrace> stable = new ArrayList<>();
            List<SweepRun> unstable = new ArrayList<>();
            for (SweepRun run : result.runs()) {
                if (run.stability() == LoopStability.UNSTABLE || run.stability() == LoopStability.OSCILLATING
                        || run.stability() == LoopStability.DIVERGED) {
                    unstable.add(run);
                } else if (run.plot().length() == times.length) {
                    stable.add(run.plot());
                }
            }
            double[][] envelope = envelope(stable, times.length);
            double low = Double.POSITIVE_INFINITY;
            double high = Double.NEGATIVE_INFINITY;
            for (double y : concat(envelope[0], envelope[4], result.nominal().plot().measurements())) {
                if (Double.isFinite(y)) {
                    low = Math.min(low, y);
                    high = Math.max(high, y);
                }
            }
            return new PlotFigures(result, unstableWord, times, stable.size(), envelope, low, high, unstable);
        }
    }

    private static XYChart chart(PlotFigures f, String title, Units units) {
        SweepResult result = f.result();
        List<SweepRun> unstable = f.unstable();
        double[] times = f.times();
        double[][] envelope = f.bands();
        double low = f.low();
        double high = f.high();
        int drawn = Math.min(UNSTABLE_DRAWN, unstable.size());
        XYChart chart = ResponsePlot.chart(title + ": " + result.runs().size() + " runs"
                + (unstable.isEmpty() ? "" : ", " + unstable.size() + " " + f.unstableWord() + " ("
                        + (drawn < unstable.size() ? "first " + drawn + " shown" : "shown") + " in red, clipped)"),
                "time (s)", Units.axis("measurement", units.process()));
        if (f.stableRuns() > 0) {
            band(chart, f.stableRuns() + " stable runs: min to max", times, envelope[0], envelope[4], OUTER_BAND);
            band(chart, "10th to 90th percentile", times, envelope[1], envelope[3], INNER_BAND);
            XYSeries median = line(chart, "median", times, envelope[2], low, high, false);
            if (median != null) {
                median.setLineColor(MEDIAN_COLOUR);
                median.setLineStyle(new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10.0f,
                        new float[] {6.0f, 4.0f}, 0.0f));
            }
        }
        boolean clip = low < high;
        double margin = CLIP_MARGIN * (high - low);
        for (int i = 0; i < drawn; i++) {
            SweepRun run = unstable.get(i);
            XYSeries series = line(chart, i == 0 ? f.unstableWord() + " runs" : "run " + run.index(), run.plot().times(),
                    run.plot().measurements(), low - margin, high + margin, clip);
            if (series != null) {
                series.setLineColor(UNSTABLE_COLOUR);
                series.setLineStyle(new BasicStroke(1.0f));
                series.setShowInLegend(i == 0);
            }
        }
        XYSeries nominal = line(chart, "nominal plant", times, result.nominal().plot().measurements(), low - margin,
                high + margin, clip);
        if (nominal != null) {
            nominal.setLineColor(Color.BLACK);
            nominal.setLineStyle(new BasicStroke(2.0f));
        }
        chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.InsideSE);
        return chart;
    }

    /**
     * Min, 10th percentile, median, 90th percentile and max at each instant over the runs (NaN where no
     * run has a value: a dropout in every run), percentiles as {@link Distribution} defines them.
     */
    static double[][] envelope(List<PlotTrace> runs, int instants) {
        // the runs' values gathered instant by instant, reading each run once from start to end (gathering
        // one instant across 10^4 runs at a time would touch a different run's memory at every value)
        double[][] columns = new double[instants][runs.size()];
        int[] counts = new int[instants];
        for (PlotTrace run : runs) {
            for (int i = 0; i < instants; i++) {
                double y = run.measurement(i);
                if (!Double.isNaN(y)) {
                    columns[i][counts[i]++] = y;
                }
            }
        }
        double[][] envelope = new double[5][instants];
        // the three percentiles by selection (Hoare's, median-of-3 pivots, the pivots kept for the next rank):
        // about half the time of sorting 10^4 values at each instant
        KthSelector selector = new KthSelector(PivotingStrategy.MEDIAN_OF_3);
        int[] pivots = new int[PIVOTS];
        for (int i = 0; i < instants; i++) {
            int n = counts[i];
            double[] values = columns[i];
            double min = n == 0 ? Double.NaN : Double.POSITIVE_INFINITY;
            double max = n == 0 ? Double.NaN : Double.NEGATIVE_INFINITY;
            for (int r = 0; r < n; r++) {
                min = Math.min(min, values[r]);
                max = Math.max(max, values[r]);
            }
            Arrays.fill(pivots, -1);
            // the column is this method's own scratch: selected in place unless dropouts left it short
            IntToDoubleFunction kthSmallest = selectorOf(selector, n == values.length ? values : Arrays.copyOf(values, n),
                    pivots);
            envelope[0][i] = min;
            envelope[1][i] = n == 0 ? Double.NaN : Distribution.percentile(kthSmallest, n, 10.0);
            envelope[2][i] = n == 0 ? Double.NaN : Distribution.percentile(kthSmallest, n, 50.0);
            envelope[3][i] = n == 0 ? Double.NaN : Distribution.percentile(kthSmallest, n, 90.0);
            envelope[4][i] = max;
        }
        return envelope;
    }

    private static IntToDoubleFunction selectorOf(KthSelector selector, double[] values, int[] pivots) {
        return k -> selector.select(values, pivots, k);
    }

    /** A filled band between two curves: one polygon, along the upper curve and back along the lower. */
    private static void band(XYChart chart, String name, double[] times, double[] lower, double[] upper, Color fill) {
        List<Double> x = new ArrayList<>();
        List<Double> y = new ArrayList<>();
        for (int i = 0; i < times.length; i++) {
            if (Double.isFinite(upper[i])) {
                x.add(times[i]);
                y.add(upper[i]);
            }
        }
        for (int i = times.length - 1; i >= 0; i--) {
            if (Double.isFinite(lower[i])) {
                x.add(times[i]);
                y.add(lower[i]);
            }
        }
        if (!x.isEmpty()) {
            XYSeries series = ResponsePlot.line(chart, name, x, y, 0);
            series.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.PolygonArea);
            series.setFillColor(fill);
            series.setLineColor(fill);
        }
    }

    /** A line through the finite points (clipped to [low, high] when asked); null when there is none. */
    private static XYSeries line(XYChart chart, String name, double[] t, double[] y, double low, double high,
            boolean clip) {
        List<Double> times = new ArrayList<>();
        List<Double> values = new ArrayList<>();
        for (int i = 0; i < t.length; i++) {
            if (Double.isNaN(y[i]) || !clip && Double.isInfinite(y[i])) {
                continue; // a dropout, or a diverged run with nothing stable to clip it to
            }
            times.add(t[i]);
            values.add(clip ? Math.max(low, Math.min(high, y[i])) : y[i]);
        }
        return times.isEmpty() ? null : ResponsePlot.line(chart, name, times, values, 0);
    }

    private static double[] concat(double[]... arrays) {
        return Arrays.stream(arrays).flatMapToDouble(Arrays::stream).toArray();
    }
}
