package org.loopwright.sim.report;

import java.util.Optional;

import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseState;
import org.loopwright.sim.scenario.Units;

/**
 * The metrics of a run as a readable table or as one JSON object with the keys {@code response}
 * (settled, not settled, DIVERGED or no setpoint change), {@code rise_time},
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
     * @param response              the response's state in words ({@link ResponseState#words()})
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
    public record MetricsJson(String response, double riseTime, double settlingTime, double overshootPercent, double peakTime,
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
        return new MetricsJson(m.state().words(), m.riseTimeSeconds(), m.settlingTimeSeconds(), m.overshootPercent(),
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
     * units, for the text table and the HTML report. The response's state comes first; a figure
     * that is missing because the response did not settle or diverged reads as that state
     * ("not settled", "DIVERGED"), not as a number that would assume a settled loop.
     *
     * @param m      the metrics
     * @param cycle  the limit cycle of an on-off loop, if any
     * @param units  the scenario's units
     * @return the table
     */
    public static ResultTable table(ResponseMetrics m, Optional<LimitCycle> cycle, Units units) {
        ResultTable table = ResultTable.of("Response metrics",
                ResultTable.Column.text("figure", "figure"), ResultTable.Column.number("value", "value", "", 4),
                ResultTable.Column.text("unit", "unit"));
        table.note(NumberText.MISSING + ": the figure does not apply. Overshoot: " + ResponseMetrics.OVERSHOOT_DEFINITION
                + ". Step figures only once settled: " + ResponseMetrics.SETTLED_RULE + ".");
        boolean unsettled = m.state() == ResponseState.NOT_SETTLED || m.state() == ResponseState.DIVERGED;
        Object stepMissing = unsettled ? m.state().words() : null;
        Object runMissing = m.state() == ResponseState.DIVERGED ? m.state().words() : null;
        table.row("response", m.state().words(), "");
        figure(table, "rise time (10-90 %)", or(m.riseTimeSeconds(), stepMissing), "s");
        figure(table, "settling time (2 %)", or(m.settlingTimeSeconds(), stepMissing), "s");
        figure(table, "overshoot", or(m.overshootPercent(), stepMissing), "%");
        figure(table, "peak time", or(m.peakTimeSeconds(), m.state() == ResponseState.SETTLED ? null : stepMissing),
                "s");
        figure(table, "steady-state error", or(m.steadyStateError(), stepMissing), units.processOrWord());
        figure(table, "IAE", or(m.iae(), runMissing), units.processSeconds());
        figure(table, "ISE", or(m.ise(), runMissing), units.processOrWord() + "²·s");
        figure(table, "ITAE", or(m.itae(), runMissing), units.processOrWord() + "·s²");
        figure(table, "total variation of output", or(m.totalVariation(), runMissing), units.outputOrWord());
        figure(table, "time saturated", or(100.0 * m.saturatedFraction(), runMissing), "%");
        figure(table, "limit cycle amplitude", cycle.map(LimitCycle::amplitude).orElse(Double.NaN),
                units.processOrWord());
        figure(table, "limit cycle period", cycle.map(LimitCycle::periodSeconds).orElse(Double.NaN), "s");
        return table;
    }

    /** A figure's row; a figure that is missing has no unit beside it ("not settled", not "not settled s"). */
    private static void figure(ResultTable table, String name, Object value, String unit) {
        boolean number = value instanceof Double d && Double.isFinite(d);
        table.row(name, value, number ? unit : "");
    }

    /** The figure, or the reason it is missing when there is one (null leaves the table's own mark). */
    private static Object or(double value, Object reason) {
        if (Double.isFinite(value) || reason == null) {
            return value;
        }
        return reason;
    }
}
