package org.loopwright.sim.report;

import java.util.Locale;
import java.util.Optional;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;

/**
 * The metrics of a run as a readable table or as one JSON object with the keys {@code rise_time},
 * {@code settling_time}, {@code overshoot_percent}, {@code peak_time}, {@code steady_state_error},
 * {@code iae}, {@code ise}, {@code itae}, {@code total_variation}, {@code saturated_fraction},
 * {@code limit_cycle_amplitude}, {@code limit_cycle_period} (seconds and engineering units; null
 * where a figure does not apply).
 */
public final class MetricsReport {

    private static final ObjectMapper JSON = new ObjectMapper();

    private MetricsReport() {
    }

    /** The metrics as a JSON object. */
    public static ObjectNode json(ResponseMetrics m, Optional<LimitCycle> cycle) {
        ObjectNode o = JSON.createObjectNode();
        put(o, "rise_time", m.riseTimeSeconds());
        put(o, "settling_time", m.settlingTimeSeconds());
        put(o, "overshoot_percent", m.overshootPercent());
        put(o, "peak_time", m.peakTimeSeconds());
        put(o, "steady_state_error", m.steadyStateError());
        put(o, "iae", m.iae());
        put(o, "ise", m.ise());
        put(o, "itae", m.itae());
        put(o, "total_variation", m.totalVariation());
        put(o, "saturated_fraction", m.saturatedFraction());
        put(o, "limit_cycle_amplitude", cycle.map(LimitCycle::amplitude).orElse(Double.NaN));
        put(o, "limit_cycle_period", cycle.map(LimitCycle::periodSeconds).orElse(Double.NaN));
        return o;
    }

    /** One line of compact JSON. */
    public static String jsonText(ResponseMetrics m, Optional<LimitCycle> cycle) {
        return json(m, cycle).toString();
    }

    private static void put(ObjectNode o, String key, double value) {
        if (Double.isFinite(value)) {
            o.put(key, value);
        } else {
            o.putNull(key);
        }
    }

    /** A table for people, one figure a line, "n/a" where a figure does not apply. */
    public static String table(ResponseMetrics m, Optional<LimitCycle> cycle) {
        StringBuilder t = new StringBuilder();
        row(t, "rise time (10-90 %)", m.riseTimeSeconds(), "s");
        row(t, "settling time (2 %)", m.settlingTimeSeconds(), "s");
        row(t, "overshoot", m.overshootPercent(), "%");
        row(t, "peak time", m.peakTimeSeconds(), "s");
        row(t, "steady-state error", m.steadyStateError(), "");
        row(t, "IAE", m.iae(), "·s");
        row(t, "ISE", m.ise(), "·s");
        row(t, "ITAE", m.itae(), "·s²");
        row(t, "total variation of output", m.totalVariation(), "");
        row(t, "time saturated", 100.0 * m.saturatedFraction(), "%");
        row(t, "limit cycle amplitude", cycle.map(LimitCycle::amplitude).orElse(Double.NaN), "");
        row(t, "limit cycle period", cycle.map(LimitCycle::periodSeconds).orElse(Double.NaN), "s");
        return t.toString();
    }

    private static void row(StringBuilder t, String name, double value, String unit) {
        String shown = Double.isFinite(value) ? String.format(Locale.ROOT, "%.6g", value) + (unit.isEmpty() ? "" : " "
                + unit) : "n/a";
        t.append(String.format(Locale.ROOT, "  %-27s %s%n", name, shown));
    }
}
