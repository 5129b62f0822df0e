package org.loopwright.sim.replay;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Fault;

/**
 * The few numbers a person reads after a replay: rows, the time the trace spans, faults by kind, the
 * output's range and mean, the time the actuator spent at an output limit (each row's output holds
 * until the next row's time), and the rows at which time runs backwards. Built a row at a time by an
 * {@link Accumulator}, so a streamed replay needs no memory per row.
 *
 * <p>Thread-safe: immutable.
 */
public final class ReplaySummary {

    private final int rows;
    private final Map<Fault, Integer> faults;
    private final double outputMin;
    private final double outputMax;
    private final double outputMean;
    private final double saturatedSeconds;
    private final double totalSeconds;
    private final double limitMin;
    private final double limitMax;
    private final long backwardSteps;
    private final long firstBackwardRow;
    private final boolean measuredPeriod;

    private ReplaySummary(Accumulator a) {
        rows = a.rows;
        faults = Map.copyOf(a.faults);
        outputMin = a.min;
        outputMax = a.max;
        outputMean = a.sum / a.rows;
        saturatedSeconds = a.saturated;
        totalSeconds = a.rows == 0 ? 0.0 : a.lastTime - a.firstTime;
        limitMin = a.limitMin;
        limitMax = a.limitMax;
        backwardSteps = a.backwardSteps;
        firstBackwardRow = a.firstBackwardRow;
        measuredPeriod = a.measuredPeriod;
    }

    /** The summary of a replay held in memory. */
    public static ReplaySummary of(ReplayResult result) {
        Accumulator a = new Accumulator(result.settings(), result.measuredPeriod());
        for (int k = 0; k < result.rowCount(); k++) {
            a.add(k + 2L, result.trace().timeSeconds(k), result.status(k), result.output(k),
                    result.position(k));
        }
        return a.finish();
    }

    /** Gathers the summary a row at a time. Not thread-safe. */
    public static final class Accumulator {
        private final double limitMin;
        private final double limitMax;
        private final boolean measuredPeriod;
        private final Map<Fault, Integer> faults = new EnumMap<>(Fault.class);
        private int rows;
        private double min = Double.POSITIVE_INFINITY;
        private double max = Double.NEGATIVE_INFINITY;
        private double sum;
        private double saturated;
        private double firstTime;
        private double lastTime;
        private boolean lastSaturated;
        private long backwardSteps;
        private long firstBackwardRow;

        /** An empty summary for a replay of these settings. */
        public Accumulator(ControllerSettings settings, boolean measuredPeriod) {
            this.limitMin = settings.outputMin();
            this.limitMax = settings.outputMax();
            this.measuredPeriod = measuredPeriod;
        }

        /**
         * Adds a replayed row.
         *
         * @param rowNumber the row's number in the file (header = 1)
         * @param time      the row's time, seconds
         * @param status    the fault seen
         * @param output    the controller's output
         * @param position  the actuator position asked for
         */
        public void add(long rowNumber, double time, Fault status, double output, double position) {
            if (rows > 0) {
                double interval = time - lastTime;
                if (interval < 0.0) {
                    if (backwardSteps++ == 0) {
                        firstBackwardRow = rowNumber;
                    }
                } else if (lastSaturated) {
                    saturated += interval;
                }
            } else {
                firstTime = time;
            }
            if (status != Fault.NONE) {
                faults.merge(status, 1, Integer::sum);
            }
            min = Math.min(min, output);
            max = Math.max(max, output);
            sum += output;
            lastSaturated = position <= limitMin || position >= limitMax;
            lastTime = time;
            rows++;
        }

        /** Rows added so far. */
        public int rows() {
            return rows;
        }

        /** The summary of the rows added. */
        public ReplaySummary finish() {
            return new ReplaySummary(this);
        }
    }

    /** Rows replayed. */
    public int rows() {
        return rows;
    }

    /** Rows with a fault. */
    public int faultRows() {
        return faults.values().stream().mapToInt(Integer::intValue).sum();
    }

    /** Rows with this fault. */
    public int faultRows(Fault fault) {
        return faults.getOrDefault(fault, 0);
    }

    /** Smallest output. */
    public double outputMin() {
        return outputMin;
    }

    /** Largest output. */
    public double outputMax() {
        return outputMax;
    }

    /** Mean output over all rows. */
    public double outputMean() {
        return outputMean;
    }

    /** Seconds with the actuator position at an output limit. */
    public double saturatedSeconds() {
        return saturatedSeconds;
    }

    /** Rows whose time is earlier than the row before's. */
    public long backwardSteps() {
        return backwardSteps;
    }

    /** Seconds the trace spans: the last row's time minus the first's. */
    public double totalSeconds() {
        return totalSeconds;
    }

    /** The summary as lines of text for a terminal. */
    public List<String> lines() {
        List<String> lines = new ArrayList<>();
        lines.add("Rows: " + rows + ", spanning " + number(totalSeconds) + " s (first to last time)");
        if (backwardSteps > 0) {
            lines.add("WARNING: time runs backwards at " + backwardSteps + (backwardSteps == 1 ? " row" : " rows")
                    + " (first at row " + firstBackwardRow + ")" + (measuredPeriod
                            ? ": those rows' periods are not positive and count as period faults"
                            : ": the fixed period was used for every row; check the log's clock"));
        }
        if (faults.isEmpty()) {
            lines.add("Faults: none");
        } else {
            List<String> kinds = new ArrayList<>();
            for (Fault fault : Fault.values()) {
                if (faults.containsKey(fault)) {
                    kinds.add(ReplayResult.statusWord(fault) + " " + faults.get(fault));
                }
            }
            lines.add("Faults: " + faultRows() + (faultRows() == 1 ? " row (" : " rows (") + String.join(", ", kinds) + ")");
        }
        lines.add("Output: min " + number(outputMin) + ", max " + number(outputMax) + ", mean " + number(outputMean));
        if (Double.isInfinite(limitMin) && Double.isInfinite(limitMax)) {
            lines.add("Time in saturation: none possible (no output limits)");
        } else {
            double percent = totalSeconds > 0.0 ? 100.0 * saturatedSeconds / totalSeconds : 0.0;
            lines.add("Time in saturation: " + number(saturatedSeconds) + " s of " + number(totalSeconds) + " s ("
                    + String.format(Locale.ROOT, "%.1f", percent) + " %) at " + limits());
        }
        return lines;
    }

    private String limits() {
        List<String> limits = new ArrayList<>();
        if (Double.isFinite(limitMin)) {
            limits.add("output-min " + number(limitMin));
        }
        if (Double.isFinite(limitMax)) {
            limits.add("output-max " + number(limitMax));
        }
        return String.join(" or ", limits);
    }

    /** Three decimals for ordinary magnitudes, scientific notation for very large or small ones. */
    static String number(double value) {
        double magnitude = Math.abs(value);
        boolean ordinary = value == 0.0 || (magnitude >= 1e-3 && magnitude < 1e7);
        return ordinary ? String.format(Locale.ROOT, "%.3f", value) : String.format(Locale.ROOT, "%.3e", value);
    }
}
