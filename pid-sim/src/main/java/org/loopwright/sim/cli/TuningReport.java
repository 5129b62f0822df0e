package org.loopwright.sim.cli;

import java.io.PrintWriter;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;

import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.form.SeriesGains;
import org.loopwright.pid.tuning.RuleNotApplicable;
import org.loopwright.sim.frequency.GainCrossing;
import org.loopwright.sim.frequency.PhaseCrossing;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseState;
import org.loopwright.sim.tuning.TuningCandidate;

/** Writes tuning candidates as text (one block, or a comparison table) and as JSON, for tune and autotune. */
final class TuningReport {

    private TuningReport() {
    }

    /** One candidate in full: the rule and its paper, the three forms, margins and simulation figures. */
    static void printOne(PrintWriter out, TuningCandidate c) {
        out.println("Rule: " + c.tuning().rule().label() + " (" + c.tuning().type() + ")"
                + (c.tuning().note().isEmpty() ? "" : ", " + c.tuning().note()));
        out.println("  source: " + c.tuning().citation());
        IdealGains i = c.ideal();
        ParallelGains p = c.parallel();
        out.println("  ideal:    gain " + num(i.gain()) + ", integral time " + num(i.integralTime()) + " s, derivative time "
                + num(i.derivativeTime()) + " s");
        out.println("  parallel: proportional gain " + num(p.proportionalGain()) + ", integral gain "
                + num(p.integralGain()) + " 1/s, derivative gain " + num(p.derivativeGain()) + " s");
        Optional<SeriesGains> series = c.series();
        out.println(series.map(s -> "  series:   gain " + num(s.gain()) + ", integral time " + num(s.integralTime())
                + " s, derivative time " + num(s.derivativeTime()) + " s")
                .orElse("  series:   none (Ti < 4*Td)"));
        if (c.margins().isEmpty()) {
            out.println("  margins:  no model to check them on");
        } else {
            StabilityMargins m = c.margins().get();
            out.println("  margins:  phase margin " + num(phaseMargin(m)) + " deg, gain margin " + num(gainMargin(m))
                    + ", Ms " + num(m.sensitivityPeak().value()) + " (" + loopKind(c) + " on the model)");
        }
        c.sampled().ifPresent(sm -> out.println(sm.stable()
                ? "  sampled loop: stable (closed-loop poles at h = " + num(c.settings().samplePeriodSeconds()) + " s)"
                : "  sampled loop: UNSTABLE at h = " + num(c.settings().samplePeriodSeconds()) + " s (a closed-loop pole"
                        + " at |z| = " + num(sm.largestPoleMagnitude()) + "): do not use these settings"));
        c.setpointResponse().ifPresent(r -> out.println("  setpoint step: rise time " + num(r.riseTimeSeconds())
                + " s, settling time " + num(r.settlingTimeSeconds()) + " s, overshoot " + num(r.overshootPercent())
                + " %, IAE " + num(r.iae())));
        c.loadResponse().ifPresent(r -> out.println("  load step:     IAE " + num(r.iae()) + ", peak deviation "
                + num(r.peakDeviation())));
    }

    /** Every candidate in one table, then the rules that do not apply and why. */
    static void printTable(PrintWriter out, List<TuningCandidate> candidates, List<RuleNotApplicable> skipped) {
        String format = "%-16s %-4s %10s %10s %10s %12s %9s %9s %-8s %10s %10s %10s%n";
        String loop = candidates.stream().anyMatch(TuningCandidate::sampledMargins) ? "sampled " : "cont. ";
        out.printf(Locale.ROOT, format, "rule", "type", "gain", "Ti [s]", "Td [s]", loop + "PM", loop + "GM",
                loop + "Ms", "stable", "overshoot%", "settle [s]", "load IAE");
        for (TuningCandidate c : candidates) {
            IdealGains i = c.ideal();
            Optional<StabilityMargins> m = c.margins();
            Optional<ResponseMetrics> r = c.setpointResponse();
            out.printf(Locale.ROOT, format, c.tuning().rule().label(),
                    c.tuning().type().name().toLowerCase(Locale.ROOT), num(i.gain()), num(i.integralTime()),
                    num(i.derivativeTime()), m.map(x -> num(phaseMargin(x))).orElse("-"),
                    m.map(x -> num(gainMargin(x))).orElse("-"), m.map(x -> num(x.sensitivityPeak().value())).orElse("-"),
                    c.stable().map(s -> s ? "yes" : "UNSTABLE").orElse("-"),
                    r.map(x -> step(x, x.overshootPercent())).orElse("-"),
                    r.map(x -> step(x, x.settlingTimeSeconds())).orElse("-"),
                    c.loadResponse().map(x -> num(x.iae())).orElse("-"));
        }
        long unstable = candidates.stream().filter(c -> c.stable().orElse(true) == Boolean.FALSE).count();
        if (unstable > 0) {
            out.println("WARNING: " + unstable + " of these settings make the sampled loop UNSTABLE: do not use them.");
        }
        for (RuleNotApplicable s : skipped) {
            out.println("not applicable: " + s.rule().label() + " (" + s.type() + "): " + s.reason());
        }
        Set<String> cited = new LinkedHashSet<>();
        for (TuningCandidate c : candidates) {
            cited.add("source of " + c.tuning().rule().label() + ": " + c.tuning().citation()
                    + (c.tuning().note().isEmpty() ? "" : "; " + c.tuning().note()));
        }
        cited.forEach(out::println);
        candidates.stream().findFirst().ifPresent(c -> out.println("margins (PM in degrees): of the " + loopKind(c)
                + (c.sampledMargins() ? "" : "; give --sample-period for the sampled loop")));
    }

    /** Which loop a candidate's margins belong to, in words. */
    static String loopKind(TuningCandidate c) {
        return c.sampledMargins() ? "loop sampled at h = " + num(c.settings().samplePeriodSeconds()) + " s"
                : "continuous design";
    }

    /** The JSON object of one candidate. */
    static ObjectNode json(TuningCandidate c) {
        ObjectNode node = Json.object();
        node.put("rule", c.tuning().rule().label());
        node.put("type", c.tuning().type().name().toLowerCase(Locale.ROOT));
        node.put("citation", c.tuning().citation());
        node.put("note", c.tuning().note());
        IdealGains i = c.ideal();
        ObjectNode ideal = node.putObject("ideal");
        Json.number(ideal, "gain", i.gain());
        Json.number(ideal, "integral_time", i.integralTime());
        Json.number(ideal, "derivative_time", i.derivativeTime());
        ParallelGains p = c.parallel();
        ObjectNode parallel = node.putObject("parallel");
        Json.number(parallel, "proportional_gain", p.proportionalGain());
        Json.number(parallel, "integral_gain", p.integralGain());
        Json.number(parallel, "derivative_gain", p.derivativeGain());
        Optional<SeriesGains> series = c.series();
        if (series.isPresent()) {
            ObjectNode s = node.putObject("series");
            Json.number(s, "gain", series.get().gain());
            Json.number(s, "integral_time", series.get().integralTime());
            Json.number(s, "derivative_time", series.get().derivativeTime());
        } else {
            node.putNull("series");
        }
        Optional<StabilityMargins> m = c.margins();
        node.put("margins_of", m.isEmpty() ? null : c.sampledMargins() ? "sampled" : "continuous");
        Json.number(node, "phase_margin_deg", m.map(TuningReport::phaseMargin).orElse(Double.NaN));
        Json.number(node, "gain_margin", m.map(TuningReport::gainMargin).orElse(Double.NaN));
        Json.number(node, "ms", m.map(x -> x.sensitivityPeak().value()).orElse(Double.NaN));
        if (c.stable().isPresent()) {
            node.put("stable", c.stable().get());
        } else {
            node.putNull("stable");
        }
        if (c.setpointResponse().isPresent()) {
            ResponseMetrics r = c.setpointResponse().get();
            ObjectNode s = node.putObject("setpoint_step");
            Json.number(s, "rise_time", r.riseTimeSeconds());
            Json.number(s, "settling_time", r.settlingTimeSeconds());
            Json.number(s, "overshoot_percent", r.overshootPercent());
            s.put("response", r.state().name().toLowerCase(Locale.ROOT).replace('_', '-'));
            Json.number(s, "iae", r.iae());
        } else {
            node.putNull("setpoint_step");
        }
        if (c.loadResponse().isPresent()) {
            ObjectNode l = node.putObject("load_step");
            Json.number(l, "iae", c.loadResponse().get().iae());
            Json.number(l, "peak_deviation", c.loadResponse().get().peakDeviation());
        } else {
            node.putNull("load_step");
        }
        return node;
    }

    /** The JSON array of candidates. */
    static ArrayNode json(List<TuningCandidate> candidates) {
        ArrayNode array = Json.array();
        candidates.forEach(c -> array.add(json(c)));
        return array;
    }

    /** The smallest phase margin, NaN when |L| never crosses 1. */
    static double phaseMargin(StabilityMargins m) {
        return m.gainCrossover().map(GainCrossing::phaseMarginDegrees).orElse(Double.NaN);
    }

    /** The smallest gain margin, infinity when the phase never reaches −180°. */
    static double gainMargin(StabilityMargins m) {
        return m.phaseCrossover().map(PhaseCrossing::gainMargin).orElse(Double.POSITIVE_INFINITY);
    }

    /** A step figure, or why there is none ("not settled", "DIVERGED"). */
    private static String step(ResponseMetrics r, double value) {
        return Double.isNaN(value) && r.state() != ResponseState.SETTLED && r.state() != ResponseState.NO_STEP
                ? r.state().words() : num(value);
    }

    static String num(double value) {
        if (Double.isNaN(value)) {
            return "n/a";
        }
        if (Double.isInfinite(value)) {
            return value > 0 ? "inf" : "-inf";
        }
        return String.format(Locale.ROOT, "%.4g", value);
    }
}
