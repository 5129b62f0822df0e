package org.loopwright.sim.design;

import java.awt.BasicStroke;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.loopwright.sim.frequency.FrequencyResponse;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.identify.IdentificationPlot;
import org.loopwright.sim.identify.IdentifiedModel;
import org.loopwright.sim.identify.StepTest;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.simulate.Trajectory;
import org.loopwright.sim.study.StudyPlots;
import org.loopwright.sim.sweep.SweepFiles;

/**
 * The plots of a design's report, as PNG files (XChart): the step test with the fit and its
 * residuals, every stable candidate's measurement and output overlaid, the recommended loop's Bode
 * and Nyquist plots (with the Ms circle) and its robustness sweep.
 */
public final class DesignPlots {

    private static final int WIDTH = 1000;
    private static final int HEIGHT = 520;
    private static final int MAX_POINTS = 1000;

    private DesignPlots() {
    }

    /**
     * Writes every plot into the directory.
     *
     * @return the files, in the order the report shows them
     */
    public static List<Path> write(DesignResult result, Path directory) throws IOException {
        System.setProperty("java.awt.headless", "true");
        List<PlotTask> tasks = new ArrayList<>();
        DesignModel model = result.model();
        if (model.fit().isPresent() && model.test().isPresent()) {
            tasks.add(() -> List.of(IdentificationPlot.writePng(directory.resolve("fit.png"), model.test().get(),
                    model.fit().get()), save(residuals(model.test().get(), model.fit().get()), directory,
                    "fit-residuals")));
        }
        String recommended = result.recommended().map(Candidate::name).orElse("");
        if (result.candidates().stream().anyMatch(Candidate::stable)) {
            tasks.add(() -> List.of(save(overlay(result, recommended, true), directory, "responses")));
            tasks.add(() -> List.of(save(overlay(result, recommended, false), directory, "outputs")));
        }
        if (result.recommended().isPresent()) {
            Candidate c = result.recommended().get();
            tasks.add(() -> loopPlots(c, directory));
            if (c.sweep().isPresent()) {
                tasks.add(() -> List.of(save(SweepFiles.plot(c.sweep().get(), "Robustness sweep of " + c.name()
                        + ", plants within " + result.spec().spread().text()), directory, "sweep")));
            }
        }
        // rendering PNGs is a good share of the command's time: the plots are drawn side by side
        List<Path> files = new ArrayList<>();
        for (List<Path> written : tasks.parallelStream().map(PlotTask::unchecked).toList()) {
            files.addAll(written);
        }
        return files;
    }

    /** One or more plots written to files. */
    private interface PlotTask {
        List<Path> write() throws IOException;

        default List<Path> unchecked() {
            try {
                return write();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
    }

    private static List<Path> loopPlots(Candidate c, Path directory) throws IOException {
        double h = c.device().samplePeriodSeconds();
        FrequencyResponse loop = LoopAnalysis.sampledLoop(c.scenario().sampledLoop().orElseThrow());
        double crossover = c.margins().margins().gainCrossover().map(g -> g.frequencyRadPerSecond())
                .orElse(c.margins().margins().sensitivityPeak().frequencyRadPerSecond());
        if (!(crossover > 0.0)) {
            crossover = 0.1 * Math.PI / h;
        }
        return StudyPlots.writeLoop(loop, c.ms(), "sampled loop of " + c.name() + ", h = " + h + " s",
                Math.min(crossover / 100.0, 0.01 * Math.PI / h), Math.PI / h, directory);
    }

    private static XYChart residuals(StepTest test, IdentifiedModel fit) {
        double[] t = test.timesSeconds();
        double[] y = test.outputs();
        double[] r = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            r[i] = y[i] - fit.responseAt(t[i]);
        }
        XYChart chart = chart("Residuals of the " + fit.kind().label() + " fit (measured − fitted)", "time [s]",
                "residual [measurement units]");
        XYSeries series = chart.addSeries("residual", t, r);
        series.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
        series.setMarker(SeriesMarkers.CIRCLE);
        chart.getStyler().setMarkerSize(3);
        return chart;
    }

    private static XYChart overlay(DesignResult result, String recommended, boolean measurement) {
        XYChart chart = chart((measurement ? "Process output" : "Controller output") + ", setpoint step at 0 s, load"
                        + " step at " + DesignModel.num(result.experiment().loadAtSeconds()) + " s",
                "time [s]", measurement ? "process output, deviation from the operating point"
                        : "controller output, deviation from the operating point");
        boolean setpointDrawn = false;
        for (Candidate c : result.candidates()) {
            if (c.run().isEmpty()) {
                continue;
            }
            Trajectory run = c.run().get();
            int stride = Math.max(1, run.length() / MAX_POINTS);
            int count = (run.length() + stride - 1) / stride;
            double[] t = new double[count];
            double[] v = new double[count];
            double[] r = new double[count];
            for (int i = 0; i < count; i++) {
                t[i] = run.time(i * stride);
                v[i] = measurement ? run.process(i * stride) : run.output(i * stride);
                r[i] = run.setpoint(i * stride);
            }
            if (measurement && !setpointDrawn) {
                XYSeries sp = chart.addSeries("setpoint", t, r);
                sp.setMarker(SeriesMarkers.NONE);
                sp.setLineStyle(new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                        new float[] {6f, 4f}, 0f));
                setpointDrawn = true;
            }
            boolean chosen = c.name().equals(recommended);
            XYSeries series = chart.addSeries(c.name() + (chosen ? " (recommended)" : ""), t, v);
            series.setMarker(SeriesMarkers.NONE);
            series.setLineStyle(new BasicStroke(chosen ? 3.5f : 1.2f));
        }
        return chart;
    }

    private static XYChart chart(String title, String xTitle, String yTitle) {
        XYChart chart = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(title).xAxisTitle(xTitle)
                .yAxisTitle(yTitle).build();
        chart.getStyler().setChartTitleFont(chart.getStyler().getChartTitleFont().deriveFont(13f));
        chart.getStyler().setXAxisTickMarkSpacingHint(120);
        return chart;
    }

    private static Path save(XYChart chart, Path directory, String name) throws IOException {
        String base = directory.resolve(name).toString();
        BitmapEncoder.saveBitmap(chart, base, BitmapEncoder.BitmapFormat.PNG);
        return Path.of(base + ".png");
    }
}
