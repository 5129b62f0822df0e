package org.loopwright.sim.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.VectorGraphicsEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.loopwright.sim.scenario.Units;
import org.loopwright.sim.simulate.Trajectory;

/**
 * Plots of closed-loop runs with XChart, saved as PNG and SVG. The response plot shows setpoint and
 * measurement on the left axis and the controller output on the right. Long runs are thinned to at
 * most {@value #MAX_POINTS} points per series (every n-th sample; the last sample is kept), and
 * dropped-out measurements are left out.
 *
 * <p>Example: {@code ResponsePlot.save(ResponsePlot.response(t, "Water bath"), dir, "response");}
 * writes {@code response.png} and {@code response.svg}.
 */
public final class ResponsePlot {

    /** The most points a series is drawn with. */
    public static final int MAX_POINTS = 2_000;

    private static final int WIDTH = 1000;
    private static final int HEIGHT = 600;

    private ResponsePlot() {
    }

    /**
     * Setpoint, measurement and controller output against time, the axes titled in the scenario's units.
     *
     * @param trajectory the run
     * @param title      the plot's title
     * @param units      the scenario's units
     * @return the chart
     */
    public static XYChart response(Trajectory trajectory, String title, Units units) {
        XYChart chart = chart(title, "time (s)", Units.axis("process value", units.process()));
        int stride = Math.max(1, (trajectory.length() + MAX_POINTS - 1) / MAX_POINTS);
        List<Double> time = new ArrayList<>();
        List<Double> setpoint = new ArrayList<>();
        List<Double> measuredTime = new ArrayList<>();
        List<Double> measurement = new ArrayList<>();
        List<Double> output = new ArrayList<>();
        for (int k = 0; k < trajectory.length(); k += stride) {
            add(trajectory, k, time, setpoint, measuredTime, measurement, output);
        }
        int last = trajectory.length() - 1;
        if (last > 0 && last % stride != 0) {
            add(trajectory, last, time, setpoint, measuredTime, measurement, output);
        }
        line(chart, "setpoint", time, setpoint, 0);
        if (!measurement.isEmpty()) {
            line(chart, "measurement", measuredTime, measurement, 0);
        }
        line(chart, "controller output", time, output, 1);
        chart.setYAxisGroupTitle(1, Units.axis("controller output", units.output()));
        PlotStyle.colour(chart, PlotStyle.Palette.fresh());
        PlotStyle.niceAxes(chart);
        chart.getStyler().setYAxisGroupPosition(1, Styler.YAxisPosition.Right);
        return chart;
    }

    /** A cascade's inner loop: its setpoint and measurement against time, the output it drives on the right. */
    public static XYChart innerLoop(Trajectory trajectory, String title) {
        XYChart chart = chart(title + ", inner loop", "time (s)", "inner process value");
        int stride = Math.max(1, (trajectory.length() + MAX_POINTS - 1) / MAX_POINTS);
        List<Double> time = new ArrayList<>();
        List<Double> setpoint = new ArrayList<>();
        List<Double> measurement = new ArrayList<>();
        List<Double> output = new ArrayList<>();
        int last = trajectory.length() - 1;
        for (int k = 0; k <= last; k = k < last && k + stride > last ? last : k + stride) {
            // every stride-th sample, and the last
            time.add(trajectory.time(k));
            setpoint.add(trajectory.innerSetpoint(k));
            measurement.add(trajectory.innerMeasurement(k));
            output.add(trajectory.output(k));
        }
        line(chart, "inner setpoint (outer controller output)", time, setpoint, 0);
        line(chart, "inner measurement", time, measurement, 0);
        line(chart, "controller output", time, output, 1);
        chart.setYAxisGroupTitle(1, "controller output");
        chart.getStyler().setYAxisGroupPosition(1, Styler.YAxisPosition.Right);
        return chart;
    }

    private static void add(Trajectory t, int k, List<Double> time, List<Double> setpoint, List<Double> measuredTime,
            List<Double> measurement, List<Double> output) {
        time.add(t.time(k));
        setpoint.add(t.setpoint(k));
        output.add(t.output(k));
        if (!Double.isNaN(t.measurement(k))) {
            measuredTime.add(t.time(k));
            measurement.add(t.measurement(k));
        }
    }

    /** An empty line chart with this project's size and style, for other plots to reuse. */
    public static XYChart chart(String title, String xAxisTitle, String yAxisTitle) {
        XYChart chart = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(title).xAxisTitle(xAxisTitle)
                .yAxisTitle(yAxisTitle).build();
        chart.getStyler().setMarkerSize(0);
        chart.getStyler().setChartBackgroundColor(java.awt.Color.WHITE);
        chart.getStyler().setXAxisDecimalPattern("0.###");
        chart.getStyler().setXAxisTickMarkSpacingHint(120);
        chart.getStyler().setLegendPosition(Styler.LegendPosition.InsideSE);
        return chart;
    }

    /** Adds a line without markers on a y-axis group (0 left, 1 right). */
    public static XYSeries line(XYChart chart, String name, List<Double> x, List<Double> y, int yAxisGroup) {
        XYSeries series = chart.addSeries(name, x, y);
        series.setMarker(SeriesMarkers.NONE);
        series.setYAxisGroup(yAxisGroup);
        return series;
    }

    /** Saves {@code baseName.png} and {@code baseName.svg} in the directory. */
    public static void save(XYChart chart, Path directory, String baseName) throws IOException {
        savePng(chart, directory, baseName);
        saveSvg(chart, directory, baseName);
    }

    /**
     * Saves {@code baseName.png} in the directory. A chart keeps its layout while it is drawn: two threads that
     * save at once draw two charts.
     */
    public static void savePng(XYChart chart, Path directory, String baseName) throws IOException {
        BitmapEncoder.saveBitmap(chart, directory.resolve(baseName + ".png").toString(),
                BitmapEncoder.BitmapFormat.PNG);
    }

    /** Saves {@code baseName.svg} in the directory (see {@link #savePng} on threads). */
    public static void saveSvg(XYChart chart, Path directory, String baseName) throws IOException {
        VectorGraphicsEncoder.saveVectorGraphic(chart, directory.resolve(baseName + ".svg").toString(),
                VectorGraphicsEncoder.VectorGraphicsFormat.SVG);
    }
}
