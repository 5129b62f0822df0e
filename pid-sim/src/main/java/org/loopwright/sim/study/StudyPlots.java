package org.loopwright.sim.study;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.hipparchus.complex.Complex;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.VectorGraphicsEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.frequency.ContinuousController;
import org.loopwright.sim.frequency.FrequencyResponse;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.report.PlotStyle;
import org.loopwright.sim.simulate.Trajectory;

/**
 * The study's plots, each as PNG and SVG (XChart): per sample period, the Bode magnitude and phase of
 * every controller variant against the continuous controller and their set-point step responses
 * overlaid; across periods (with the scenario's own methods), the Bode magnitude and phase of the loop
 * and its Nyquist curve with the Ms circle |1 + L| = 1/Ms of the continuous design.
 *
 * <p>Frequencies span two decades either side of the continuous crossover ω_c; a sampled curve stops
 * at its Nyquist frequency π/h.
 */
public final class StudyPlots {

    private static final int WIDTH = 900;
    private static final int HEIGHT = 560;
    private static final int POINTS = 200;
    /**
     * The Nyquist plot's width; its height adds room for the legend rows below, so that the plot area
     * shows as many pixels per unit up as across (measured on the rendered PNG).
     */
    private static final int NYQUIST_SIZE = 640;
    private static final int NYQUIST_FRAME_HEIGHT = 16;
    private static final int NYQUIST_LEGEND_ROW = 20;
    /** A step response is thinned to about this many points (the SVG grows with every point). */
    private static final int MAX_STEP_POINTS = 400;
    private static final double DECADES_AROUND_CROSSOVER = 2.0;
    /** The Nyquist plot shows −3 … 1 on the real axis; farther points are left out. */
    private static final double NYQUIST_REACH = 4.0;

    private StudyPlots() {
    }

    /**
     * Writes every plot of {@code result} into {@code directory} (created if missing).
     *
     * @return the files written
     */
    public static List<Path> write(StudyResult result, Path directory) throws IOException {
        Files.createDirectories(directory);
        List<Path> written = new ArrayList<>();
        double crossover = result.crossoverRadPerSecond();
        double low = crossover * Math.pow(10.0, -DECADES_AROUND_CROSSOVER);
        double high = crossover * Math.pow(10.0, DECADES_AROUND_CROSSOVER);
        ControllerSettings settings = result.settings();
        FrequencyResponse design = new ContinuousController(settings);
        // one colour per method in every plot; the scenario's own methods and the continuous design
        // stay coloured when a plot has too many series to tell apart
        PlotStyle.Palette palette = PlotStyle.Palette.fresh();
        String own = result.rows().stream().filter(r -> r.kind() == StudyRow.Kind.SAMPLED
                && r.integralMethod() == settings.integralMethod()
                && (r.derivativeMethod() == null || r.derivativeMethod() == settings.derivativeMethod()))
                .map(StudyRow::label).findFirst().orElse("continuous");


        for (double h : result.periodsSeconds()) {
            String suffix = "-h" + h;
            XYChart magnitude = bodeChart("Controller magnitude, h = " + h + " s", "|C| (dB)");
            XYChart phase = bodeChart("Controller phase, h = " + h + " s", "arg C (deg)");
            addBode(magnitude, phase, "continuous", design, low, high);
            XYChart steps = chart("Set-point step responses, h = " + h + " s", "time (s)", "process output");
            addStep(steps, "continuous", result.rows().get(0).setpointResponse());
            for (StudyRow row : result.rows()) {
                if (row.kind() != StudyRow.Kind.SAMPLED || row.samplePeriodSeconds() != h) {
                    continue;
                }
                ControllerSettings variant = variant(settings, row);
                addBode(magnitude, phase, row.label(), LoopAnalysis.discreteController(variant, h), low,
                        Math.min(high, Math.PI / h));
                addStep(steps, row.label(), row.setpointResponse());
            }
            for (XYChart chart : List.of(magnitude, phase, steps)) {
                PlotStyle.colour(chart, palette, "continuous", own);
            }
            PlotStyle.niceAxes(steps);
            save(magnitude, directory, "controller-magnitude" + suffix, written);
            save(phase, directory, "controller-phase" + suffix, written);
            save(steps, directory, "step" + suffix, written);
        }

        XYChart loopMagnitude = bodeChart("Loop magnitude (" + methods(settings) + ")", "|L| (dB)");
        XYChart loopPhase = bodeChart("Loop phase (" + methods(settings) + ")", "arg L (deg)");
        int legendRows = result.periodsSeconds().size() + 3;
        XYChart nyquist = new XYChartBuilder().width(NYQUIST_SIZE).height(NYQUIST_SIZE + NYQUIST_FRAME_HEIGHT
                + NYQUIST_LEGEND_ROW * legendRows)
                .title("Nyquist (" + methods(settings) + ")").xAxisTitle("Re L").yAxisTitle("Im L").build();
        nyquist.getStyler().setMarkerSize(10); // only the −1 point has a marker
        FrequencyResponse continuousLoop = LoopAnalysis.continuousLoop(result.plant(), settings);
        addBode(loopMagnitude, loopPhase, "continuous", continuousLoop, low, high);
        addNyquist(nyquist, "continuous", continuousLoop, low, high);
        for (double h : result.periodsSeconds()) {
            FrequencyResponse sampled;
            try {
                sampled = LoopAnalysis.sampledLoop(result.loop().atPeriod(h));
            } catch (IllegalArgumentException notApplicable) {
                continue; // the scenario's own forward-Euler derivative cannot run at this period
            }
            double top = Math.min(high, Math.PI / h);
            addBode(loopMagnitude, loopPhase, "h = " + h + " s", sampled, low, top);
            addNyquist(nyquist, "h = " + h + " s", sampled, low, top);
        }
        PlotStyle.referenceLine(loopPhase, "−180°", -180.0, low, high);
        addMsCircle(nyquist, result.continuousMargins().sensitivityPeak().value());
        PlotStyle.criticalPoint(nyquist);
        for (XYChart chart : List.of(loopMagnitude, loopPhase, nyquist)) {
            PlotStyle.colour(chart, palette, "continuous");
        }
        PlotStyle.equalAspect(nyquist, 1.0 - NYQUIST_REACH / 2.0, 0.0, NYQUIST_REACH);
        save(loopMagnitude, directory, "loop-magnitude", written);
        save(loopPhase, directory, "loop-phase", written);
        save(nyquist, directory, "nyquist", written);
        return written;
    }

    /**
     * Writes the Bode plots (magnitude, phase) and the Nyquist plot of one loop, with the Ms circle,
     * as {@code loop-magnitude.png}, {@code loop-phase.png} and {@code nyquist.png} in the directory.
     *
     * @param loop  the loop
     * @param ms    its Ms (the circle of radius 1/Ms around −1)
     * @param title what the loop is, for the plot titles
     * @param low   the lowest frequency, rad/s
     * @param high  the highest frequency, rad/s (π/h for a sampled loop)
     * @return the files written
     */
    public static List<Path> writeLoop(FrequencyResponse loop, double ms, String title, double low, double high,
            Path directory) throws IOException {
        XYChart magnitude = bodeChart("Loop magnitude, " + title, "|L| (dB)");
        XYChart phase = bodeChart("Loop phase, " + title, "arg L (deg)");
        XYChart nyquist = chart("Nyquist, " + title, "Re L", "Im L");
        addBode(magnitude, phase, "L", loop, low, high);
        addNyquist(nyquist, "L", loop, low, high);
        addMsCircle(nyquist, ms);
        nyquist.getStyler().setXAxisMin(-NYQUIST_REACH + 1.0).setXAxisMax(1.0).setYAxisMin(-2.0).setYAxisMax(2.0);
        List<Path> written = new ArrayList<>();
        for (var entry : List.of(Map.entry("loop-magnitude", magnitude), Map.entry("loop-phase", phase),
                Map.entry("nyquist", nyquist))) {
            String base = directory.resolve(entry.getKey()).toString();
            BitmapEncoder.saveBitmap(entry.getValue(), base, BitmapEncoder.BitmapFormat.PNG);
            written.add(Path.of(base + ".png"));
        }
        return written;
    }

    private static ControllerSettings variant(ControllerSettings settings, StudyRow row) {
        return settings.toBuilder().samplePeriodSeconds(row.samplePeriodSeconds())
                .integralMethod(row.integralMethod() == null ? settings.integralMethod() : row.integralMethod())
                .derivativeMethod(row.derivativeMethod() == null ? settings.derivativeMethod() : row.derivativeMethod())
                .build();
    }

    private static String methods(ControllerSettings settings) {
        return "integral " + ControllerFile.INTEGRAL_METHODS.word(settings.integralMethod()) + ", derivative "
                + ControllerFile.DERIVATIVE_METHODS.word(settings.derivativeMethod());
    }

    private static XYChart chart(String title, String xTitle, String yTitle) {
        XYChart chart = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(title).xAxisTitle(xTitle)
                .yAxisTitle(yTitle).build();
        chart.getStyler().setMarkerSize(10); // only the −1 point has a marker
        return chart;
    }

    private static XYChart bodeChart(String title, String yTitle) {
        XYChart chart = chart(title, "ω (rad/s)", yTitle);
        chart.getStyler().setXAxisLogarithmic(true);
        return chart;
    }

    private static double[] logGrid(double low, double high) {
        double[] omega = new double[POINTS];
        for (int i = 0; i < POINTS; i++) {
            omega[i] = low * Math.pow(high / low, i / (POINTS - 1.0));
        }
        return omega;
    }

    private static void addBode(XYChart magnitude, XYChart phase, String name, FrequencyResponse response,
            double low, double high) {
        double[] omega = logGrid(low, high);
        double[] db = new double[POINTS];
        double[] degrees = new double[POINTS];
        double previous = 0.0;
        for (int i = 0; i < POINTS; i++) {
            Complex value = response.at(omega[i]);
            db[i] = 20.0 * Math.log10(value.norm());
            double angle = Math.toDegrees(value.getArgument());
            if (i > 0) { // unwrap: the dead time turns the phase through many turns
                angle += 360.0 * Math.round((previous - angle) / 360.0);
            }
            degrees[i] = angle;
            previous = angle;
        }
        line(magnitude.addSeries(name, omega, db));
        line(phase.addSeries(name, omega, degrees));
    }

    private static void addNyquist(XYChart chart, String name, FrequencyResponse loop, double low, double high) {
        double[] omega = logGrid(low, high);
        List<Double> re = new ArrayList<>();
        List<Double> im = new ArrayList<>();
        for (double w : omega) {
            Complex l = loop.at(w);
            if (l.norm() <= NYQUIST_REACH) {
                re.add(l.getReal());
                im.add(l.getImaginary());
            }
        }
        if (!re.isEmpty()) {
            line(chart.addSeries(name, re, im));
        }
    }

    private static void addMsCircle(XYChart chart, double ms) {
        int n = 361;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double angle = 2.0 * Math.PI * i / (n - 1);
            x[i] = -1.0 + Math.cos(angle) / ms;
            y[i] = Math.sin(angle) / ms;
        }
        XYSeries circle = chart.addSeries("Ms circle of the continuous design, Ms = " + NumberText.of(ms, 3), x, y);
        line(circle);
        circle.setLineColor(PlotStyle.REFERENCE);
    }

    private static void addStep(XYChart chart, String name, Trajectory run) {
        if (run == null) {
            return;
        }
        int stride = Math.max(1, run.length() / MAX_STEP_POINTS);
        int count = (run.length() + stride - 1) / stride;
        double[] t = new double[count];
        double[] y = new double[count];
        for (int i = 0; i < count; i++) {
            t[i] = run.time(i * stride);
            y[i] = run.process(i * stride);
        }
        line(chart.addSeries(name, t, y));
    }

    private static void line(XYSeries series) {
        series.setMarker(SeriesMarkers.NONE);
    }

    private static void save(XYChart chart, Path directory, String name, List<Path> written) throws IOException {
        String base = directory.resolve(name).toString();
        BitmapEncoder.saveBitmap(chart, base, BitmapEncoder.BitmapFormat.PNG);
        VectorGraphicsEncoder.saveVectorGraphic(chart, base, VectorGraphicsEncoder.VectorGraphicsFormat.SVG);
        written.add(Path.of(base + ".png"));
        written.add(Path.of(base + ".svg"));
    }
}
