package org.loopwright.sim.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * The one style of the harness's plots, shared by every command's report: a palette that gives
 * each method or candidate one colour in every plot of a report, nice axis limits (1, 2 or 5 times
 * a power of ten, so ticks fall on round values), a reference line (the −180° line of a phase plot,
 * the critical point), an equal-aspect Nyquist plot, and grey for the many series of a crowded plot
 * with a few highlighted in colour.
 *
 * <p>Usage for a new report: make one {@link Palette} per report, call {@link #colour} on each chart
 * after adding its series (same series name, same colour), then {@link #niceAxes}.
 *
 * <p>Not thread-safe: a palette belongs to one report being drawn.
 */
public final class PlotStyle {

    /** More series than this in one plot: the rest are drawn grey behind the highlighted ones. */
    public static final int MAX_COLOURED = 8;

    /** A light grey for series in the background. */
    public static final Color BACKGROUND_SERIES = new Color(190, 190, 190);

    /** The colour of reference lines and points (critical point, −180°). */
    public static final Color REFERENCE = new Color(90, 90, 90);

    /** Colours told apart by most readers, colour-blind ones included (Okabe and Ito's set, common practice). */
    private static final List<Color> COLOURS = List.of(new Color(0, 114, 178), new Color(213, 94, 0),
            new Color(0, 158, 115), new Color(204, 121, 167), new Color(86, 180, 233), new Color(230, 159, 0),
            new Color(0, 0, 0), new Color(120, 94, 240));

    private PlotStyle() {
    }

    /** Colours by series name, handed out in order of first use and kept for the whole report. */
    public static final class Palette {
        private final Map<String, Color> byName = new HashMap<>();

        private Palette() {
        }

        /** @return an empty palette, for one report */
        public static Palette fresh() {
            return new Palette();
        }

        /**
         * The colour of a series name; the same name always gets the same colour.
         *
         * @param name the series name
         * @return its colour
         */
        public Color of(String name) {
            return byName.computeIfAbsent(name, n -> COLOURS.get(byName.size() % COLOURS.size()));
        }
    }

    /**
     * Colours every series of a chart from the palette, except reference series already styled.
     * With more than {@link #MAX_COLOURED} series, only the highlighted names keep their colour and
     * the rest turn grey.
     *
     * @param chart       the chart
     * @param palette     the report's palette
     * @param highlighted names that keep their colour in a crowded plot (empty: the first few)
     */
    public static void colour(XYChart chart, Palette palette, String... highlighted) {
        boolean crowded = chart.getSeriesMap().size() > MAX_COLOURED;
        List<String> keep = List.of(highlighted);
        for (XYSeries s : List.copyOf(chart.getSeriesMap().values())) {
            if (s.getLineColor() == REFERENCE || s.getMarkerColor() == REFERENCE) {
                continue;
            }
            boolean grey = crowded && !keep.contains(s.getName());
            XYSeries styled = s;
            if (crowded && !grey) {
                // drawn last, so that the grey ones do not hide it
                chart.removeSeries(s.getName());
                styled = chart.addSeries(s.getName(), s.getXData(), s.getYData());
                styled.setYAxisGroup(s.getYAxisGroup());
                styled.setMarker(SeriesMarkers.NONE);
                styled.setLineWidth(2.5f);
            }
            Color colour = grey ? BACKGROUND_SERIES : palette.of(s.getName());
            styled.setLineColor(colour);
            styled.setMarkerColor(colour);
            styled.setFillColor(colour);
        }
    }

    /**
     * Sets the axis limits of a chart (linear axes only) to nice round values around its data, so
     * that XChart's ticks fall on 1, 2 or 5 times a power of ten instead of odd steps.
     *
     * @param chart the chart
     */
    public static void niceAxes(XYChart chart) {
        double xMin = Double.POSITIVE_INFINITY;
        double xMax = Double.NEGATIVE_INFINITY;
        Map<Integer, double[]> yRanges = new HashMap<>();
        for (XYSeries s : chart.getSeriesMap().values()) {
            double[] y = yRanges.computeIfAbsent(s.getYAxisGroup(),
                    g -> new double[] {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY});
            for (double x : s.getXData()) {
                if (Double.isFinite(x)) {
                    xMin = Math.min(xMin, x);
                    xMax = Math.max(xMax, x);
                }
            }
            for (double v : s.getYData()) {
                if (Double.isFinite(v)) {
                    y[0] = Math.min(y[0], v);
                    y[1] = Math.max(y[1], v);
                }
            }
        }
        if (!chart.getStyler().isXAxisLogarithmic() && xMin < xMax) {
            double step = niceStep(xMax - xMin);
            chart.getStyler().setXAxisMin(Math.floor(xMin / step) * step).setXAxisMax(Math.ceil(xMax / step) * step);
        }
        if (!chart.getStyler().isYAxisLogarithmic()) {
            yRanges.forEach((group, y) -> {
                if (y[0] < y[1]) {
                    double step = niceStep(y[1] - y[0]);
                    chart.getStyler().setYAxisMin(group, Math.floor(y[0] / step) * step)
                            .setYAxisMax(group, Math.ceil(y[1] / step) * step);
                }
            });
        }
    }

    /**
     * A tick step of 1, 2 or 5 times a power of ten that cuts a span into about five to ten parts.
     *
     * @param span the axis span, &gt; 0
     * @return the step
     */
    public static double niceStep(double span) {
        double raw = span / 6.0;
        double power = Math.pow(10.0, Math.floor(Math.log10(raw)));
        double mantissa = raw / power;
        double nice = mantissa < 1.5 ? 1.0 : mantissa < 3.5 ? 2.0 : mantissa < 7.5 ? 5.0 : 10.0;
        return nice * power;
    }

    /**
     * A horizontal reference line across the chart's x range (the −180° line of a phase plot),
     * dashed and grey, named in the legend.
     *
     * @param chart the chart
     * @param name  its legend entry
     * @param y     its value
     * @param xLow  where it starts
     * @param xHigh where it ends
     */
    public static void referenceLine(XYChart chart, String name, double y, double xLow, double xHigh) {
        XYSeries line = chart.addSeries(name, new double[] {xLow, xHigh}, new double[] {y, y});
        line.setMarker(SeriesMarkers.NONE);
        line.setLineColor(REFERENCE);
        line.setLineStyle(new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                new float[] {6f, 4f}, 0f));
    }

    /**
     * The critical point −1 of a Nyquist plot, as a grey cross named in the legend.
     *
     * @param chart the chart
     */
    public static void criticalPoint(XYChart chart) {
        XYSeries critical = chart.addSeries("critical point −1", new double[] {-1.0}, new double[] {0.0});
        critical.setMarker(SeriesMarkers.CROSS);
        critical.setMarkerColor(REFERENCE);
        critical.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
    }

    /**
     * Draws a Nyquist chart at equal scale: the plot is made square and both axes get the same span,
     * centred on the given point, so that circles (the Ms circle) are drawn as circles.
     *
     * @param chart   the chart, built {@code size} by {@code size} pixels
     * @param centreX the real part at the centre
     * @param centreY the imaginary part at the centre
     * @param span    the span of each axis
     */
    public static void equalAspect(XYChart chart, double centreX, double centreY, double span) {
        chart.getStyler().setXAxisMin(centreX - span / 2).setXAxisMax(centreX + span / 2)
                .setYAxisMin(centreY - span / 2).setYAxisMax(centreY + span / 2);
        chart.getStyler().setLegendPosition(org.knowm.xchart.style.Styler.LegendPosition.OutsideS);
    }
}
