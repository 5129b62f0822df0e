package org.loopwright.sim.replay;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.loopwright.pid.Fault;

/**
 * The few numbers a person reads after a replay: rows, faults by kind, the output's range and
 * mean, and the time the actuator spent at an output limit (each saturated row counts its period).
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

    private ReplaySummary(ReplayResult result) {
        rows = result.rowCount();
        limitMin = result.settings().outputMin();
        limitMax = result.settings().outputMax();
        Map<Fault, Integer> counts = new EnumMap<>(Fault.class);
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        double sum = 0.0;
        double saturated = 0.0;
        double total = 0.0;
        for (int k = 0; k < rows; k++) {
            if (result.status(k) != Fault.NONE) {
                counts.merge(result.status(k), 1, Integer::sum);
            }
            double output = result.output(k);
            min = Math.min(min, output);
            max = Math.max(max, output);
            sum += output;
            double period = result.periodSeconds(k);
            if (period > 0.0 && period < Double.POSITIVE_INFINITY) {
                total += period;
                double position = result.position(k);
                if (position <= limitMin || position >= limitMax) {
                    saturated += period;
                }
            }
        }
        faults = Map.copyOf(counts);
        outputMin = min;
        outputMax = max;
        outputMean = sum / rows;
        saturatedSeconds = saturated;
        totalSeconds = total;
    }

    /** The summary of a replay. */
    public static ReplaySummary of(ReplayResult result) {
        return new ReplaySummary(result);
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

    /** Seconds replayed (the sum of the valid periods). */
    public double totalSeconds() {
        return totalSeconds;
    }

    /** The summary as lines of text for a terminal. */
    public List<String> lines() {
        List<String> lines = new ArrayList<>();
        lines.add("Rows: " + rows + ", " + number(totalSeconds) + " s");
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
