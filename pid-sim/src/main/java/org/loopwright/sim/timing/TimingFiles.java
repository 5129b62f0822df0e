package org.loopwright.sim.timing;

import java.io.IOException;
import java.io.PrintStream;
import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.HdrHistogram.Histogram;
import org.HdrHistogram.HistogramIterationValue;
import org.HdrHistogram.HistogramLogWriter;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * The files of a timing run, so that two devices can be compared: the HdrHistogram log of both
 * loops' period errors (nanoseconds, tagged {@code runner} and {@code baseline}, readable by
 * HdrHistogram's own log tools) and a PNG of the period error against the percentile. The caller
 * writes them into a staging directory and moves them into place, so a reader never sees half a file.
 */
public final class TimingFiles {

    /** The log's file name. */
    public static final String LOG = "period-error.hlog";
    /** The plot's file name. */
    public static final String PLOT = "period-error.png";

    private static final int WIDTH = 900;
    private static final int HEIGHT = 560;

    private TimingFiles() {
    }

    /** Writes the HdrHistogram log of both runs into the directory. */
    public static Path writeLog(Path directory, TimedRun runner, TimedRun baseline) throws IOException {
        Path file = directory.resolve(LOG);
        try (PrintStream out = new PrintStream(Files.newOutputStream(file), false, "UTF-8")) {
            HistogramLogWriter log = new HistogramLogWriter(out);
            log.outputComment("loopwright timing: period error |(start(k) - start(k-1)) - h| in nanoseconds, "
                    + runner.result().loop() + " and " + baseline.result().loop() + ", h = "
                    + runner.result().periodNanos() + " ns");
            log.outputLogFormatVersion();
            log.outputLegend();
            log.outputIntervalHistogram(tagged(runner.periodErrors(), "runner"));
            log.outputIntervalHistogram(tagged(baseline.periodErrors(), "baseline"));
        }
        return file;
    }

    private static Histogram tagged(Histogram h, String tag) {
        Histogram copy = h.copy();
        copy.setTag(tag);
        return copy;
    }

    /** Writes the percentile plot of both runs into the directory. */
    public static Path writePlot(Path directory, TimedRun runner, TimedRun baseline, double budgetMicros)
            throws IOException {
        long period = runner.result().periodNanos();
        XYChart chart = new XYChartBuilder().width(WIDTH).height(HEIGHT)
                .title(String.format(Locale.ROOT, "Period error at %s (h = %.1f µs)", rate(period), period / 1e3))
                .xAxisTitle("percentile, as 1/(1 − q): 10 = p90, 100 = p99, 1000 = p99.9")
                .yAxisTitle("period error [µs]").build();
        chart.getStyler().setXAxisLogarithmic(true);
        chart.getStyler().setYAxisLogarithmic(true);
        chart.getStyler().setMarkerSize(0);
        double right = Math.max(addPercentiles(chart, runner), addPercentiles(chart, baseline));
        double[] span = {1.0, Math.max(right, 10.0)};
        chart.addSeries(String.format(Locale.ROOT, "budget %.1f µs", budgetMicros), span,
                new double[] {budgetMicros, budgetMicros}).setMarker(SeriesMarkers.NONE);
        Path file = directory.resolve(PLOT);
        BitmapEncoder.saveBitmap(chart, file.toString(), BitmapEncoder.BitmapFormat.PNG);
        return file;
    }

    /** Adds the run's curve; returns its rightmost x. */
    private static double addPercentiles(XYChart chart, TimedRun run) {
        List<Double> x = new ArrayList<>();
        List<Double> y = new ArrayList<>();
        for (HistogramIterationValue v : run.periodErrors().percentiles(5)) {
            double q = v.getPercentileLevelIteratedTo() / 100.0;
            if (q >= 0.99999) {
                break;
            }
            x.add(1.0 / (1.0 - q));
            // a log axis has no room for 0: an error below 10 ns is drawn at 10 ns
            y.add(Math.max(v.getValueIteratedTo(), 10) / 1e3);
        }
        if (x.isEmpty()) {
            return 1.0;
        }
        chart.addSeries(run.result().loop(), x, y).setMarker(SeriesMarkers.NONE);
        return x.get(x.size() - 1);
    }

    /** A rate in words: {@code 1 kHz}, {@code 250 Hz}. */
    public static String rate(long periodNanos) {
        double hertz = 1e9 / periodNanos;
        return hertz >= 1000 ? digits(hertz / 1000) + " kHz" : digits(hertz) + " Hz";
    }

    private static String digits(double value) {
        return new BigDecimal(String.format(Locale.ROOT, "%.4g", value)).stripTrailingZeros().toPlainString();
    }
}
