package org.loopwright.sim.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseState;

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
        o.put("response", m.state().name().toLowerCase(Locale.ROOT).replace('_', '-'));
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

    /**
     * The metrics as rows of (figure, value with its unit): the response's state first, then every
     * figure; a figure that does not apply reads "n/a", or the state ("not settled", "DIVERGED") when
     * that is why.
     */
    public static List<List<String>> rows(ResponseMetrics m, Optional<LimitCycle> cycle) {
        String missing = m.state() == ResponseState.NOT_SETTLED || m.state() == ResponseState.DIVERGED
                ? m.state().words() : "n/a";
        String missingOverall = m.state() == ResponseState.DIVERGED ? m.state().words() : "n/a";
        List<List<String>> rows = new ArrayList<>();
        rows.add(List.of("response", m.state().words()));
        rows.add(row("rise time (10-90 %)", m.riseTimeSeconds(), "s", missing));
        rows.add(row("settling time (2 %)", m.settlingTimeSeconds(), "s", missing));
        rows.add(row("overshoot", m.overshootPercent(), "%", missing));
        rows.add(row("peak time", m.peakTimeSeconds(), "s", m.state() == ResponseState.SETTLED ? "n/a" : missing));
        rows.add(row("steady-state error", m.steadyStateError(), "", missing));
        rows.add(row("IAE", m.iae(), "·s", missingOverall));
        rows.add(row("ISE", m.ise(), "·s", missingOverall));
        rows.add(row("ITAE", m.itae(), "·s²", missingOverall));
        rows.add(row("total variation of output", m.totalVariation(), "", missingOverall));
        rows.add(row("time saturated", 100.0 * m.saturatedFraction(), "%", missingOverall));
        rows.add(row("limit cycle amplitude", cycle.map(LimitCycle::amplitude).orElse(Double.NaN), "", "n/a"));
        rows.add(row("limit cycle period", cycle.map(LimitCycle::periodSeconds).orElse(Double.NaN), "s", "n/a"));
        return rows;
    }

    /** A table for people, one figure a line (see {@link #rows}). */
    public static String table(ResponseMetrics m, Optional<LimitCycle> cycle) {
        StringBuilder t = new StringBuilder();
        for (List<String> row : rows(m, cycle)) {
            t.append(String.format(Locale.ROOT, "  %-27s %s%n", row.get(0), row.get(1)));
        }
        return t.toString();
    }

    private static List<String> row(String name, double value, String unit, String missing) {
        return List.of(name, Double.isFinite(value) ? String.format(Locale.ROOT, "%.6g", value)
                + (unit.isEmpty() ? "" : " " + unit) : missing);
    }
}
