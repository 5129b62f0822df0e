package org.loopwright.sim.report;

import java.util.Optional;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.scenario.Units;

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

    /**
     * The metrics as one typed table, a figure a row with its value and unit in the scenario's
     * units: the text table, the HTML report's table and the JSON keys all come from it.
     *
     * @param m      the metrics
     * @param cycle  the limit cycle of an on-off loop, if any
     * @param units  the scenario's units
     * @return the table
     */
    public static ResultTable table(ResponseMetrics m, Optional<LimitCycle> cycle, Units units) {
        ResultTable table = ResultTable.of("Response metrics (" + NumberText.MISSING + ": the figure does not apply)",
                ResultTable.Column.text("figure", "figure"), ResultTable.Column.number("value", "value", "", 4),
                ResultTable.Column.text("unit", "unit"));
        table.row("rise time (10-90 %)", m.riseTimeSeconds(), "s");
        table.row("settling time (2 %)", m.settlingTimeSeconds(), "s");
        table.row("overshoot", m.overshootPercent(), "%");
        table.row("peak time", m.peakTimeSeconds(), "s");
        table.row("steady-state error", m.steadyStateError(), units.processOrWord());
        table.row("IAE", m.iae(), units.processSeconds());
        table.row("ISE", m.ise(), units.processOrWord() + "²·s");
        table.row("ITAE", m.itae(), units.processOrWord() + "·s²");
        table.row("total variation of output", m.totalVariation(), units.outputOrWord());
        table.row("time saturated", 100.0 * m.saturatedFraction(), "%");
        table.row("limit cycle amplitude", cycle.map(LimitCycle::amplitude).orElse(Double.NaN), units.processOrWord());
        table.row("limit cycle period", cycle.map(LimitCycle::periodSeconds).orElse(Double.NaN), "s");
        return table;
    }
}
