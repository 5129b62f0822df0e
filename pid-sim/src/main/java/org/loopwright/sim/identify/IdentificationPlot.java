package org.loopwright.sim.identify;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;

import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/** A PNG of a step test's measured output (points) and the fitted model's response (line), with XChart. */
public final class IdentificationPlot {

    private static final int WIDTH = 900;
    private static final int HEIGHT = 560;

    private IdentificationPlot() {
    }

    /** The most samples plotted per series. */
    static final int PLOT_POINTS = 2_000;

    /**
     * Writes the plot.
     *
     * @param file  the PNG to write (".png" is added by XChart when missing)
     * @param test  the data
     * @param model the fitted model
     * @return the file written
     * @throws IOException when the file cannot be written
     */
    public static Path writePng(Path file, StepTest test, IdentifiedModel model) throws IOException {
        // every stride-th sample: a marker per sample of a long record costs seconds and shows nothing more
        int stride = Math.max(1, (test.length() + PLOT_POINTS - 1) / PLOT_POINTS);
        int n = (test.length() + stride - 1) / stride;
        double[] t = new double[n];
        double[] measuredOutput = new double[n];
        double[] fitted = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = test.timesSeconds()[i * stride];
            measuredOutput[i] = test.outputs()[i * stride];
            fitted[i] = model.responseAt(t[i]);
        }
        String title = String.format(Locale.ROOT, "%s fit of %s: RMSE %.4g, R² %.4f", model.kind().label(),
                Path.of(test.fileName()).getFileName(), model.rmse(), model.rSquared());
        XYChart chart = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(title).xAxisTitle("time [s]")
                .yAxisTitle("output").build();
        chart.getStyler().setMarkerSize(3);
        chart.getStyler().setXAxisTickMarkSpacingHint(120);
        XYSeries measured = chart.addSeries("measured output", t, measuredOutput);
        measured.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        measured.setMarker(SeriesMarkers.CIRCLE);
        chart.addSeries("fitted " + model.kind().label(), t, fitted).setMarker(SeriesMarkers.NONE);
        String name = file.toString();
        String base = name.endsWith(".png") ? name.substring(0, name.length() - 4) : name;
        BitmapEncoder.saveBitmap(chart, base, BitmapEncoder.BitmapFormat.PNG);
        return Path.of(base + ".png");
    }
}
