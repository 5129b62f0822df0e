package org.loopwright.sim.report;

import java.util.Optional;

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

    private MetricsReport() {
    }

    /**
     * The metrics as JSON: one record, written by {@link JsonOutput} (snake_case keys, null where a
     * figure does not apply).
     *
     * @param riseTime              10–90 % rise time, s
     * @param settlingTime          2 % settling time, s
     * @param overshootPercent      overshoot, % of the step
     * @param peakTime              time of the peak, s
     * @param steadyStateError      setpoint minus measurement at the end, process units
     * @param iae                   integral of |e|
     * @param ise                   integral of e²
     * @param itae                  integral of t·|e|
     * @param totalVariation        total variation of the controller output
     * @param saturatedFraction     share of the run at an output limit, 0–1
     * @param limitCycleAmplitude   an on-off loop's cycle amplitude, process units
     * @param limitCyclePeriod      an on-off loop's cycle period, s
     */
    public record MetricsJson(double riseTime, double settlingTime, double overshootPercent, double peakTime,
            double steadyStateError, double iae, double ise, double itae, double totalVariation,
            double saturatedFraction, double limitCycleAmplitude, double limitCyclePeriod) {
    }

    /**
     * The metrics as a record for JSON.
     *
     * @param m     the metrics
     * @param cycle the limit cycle of an on-off loop, if any
     * @return the record
     */
    public static MetricsJson json(ResponseMetrics m, Optional<LimitCycle> cycle) {
        return new MetricsJson(m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(),
                m.peakTimeSeconds(), m.steadyStateError(), m.iae(), m.ise(), m.itae(), m.totalVariation(),
                m.saturatedFraction(), cycle.map(LimitCycle::amplitude).orElse(Double.NaN),
                cycle.map(LimitCycle::periodSeconds).orElse(Double.NaN));
    }

    /**
     * The metrics as JSON text.
     *
     * @param m     the metrics
     * @param cycle the limit cycle of an on-off loop, if any
     * @return the text
     */
    public static String jsonText(ResponseMetrics m, Optional<LimitCycle> cycle) {
        return JsonOutput.text(json(m, cycle));
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
