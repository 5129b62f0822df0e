package org.loopwright.sim.cli;

import java.io.PrintWriter;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;

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

    /**
     * One candidate as JSON (snake_case keys, null for a figure that does not exist or apply).
     *
     * @param rule          the rule's label
     * @param type          pi or pid, as {@code --type} spells it
     * @param citation      the rule's source
     * @param note          what the rule chose (its design time, its form), or empty
     * @param ideal         the settings in ideal form
     * @param parallel      the settings in parallel form
     * @param series        the settings in series form, null when there is none (Ti &lt; 4 Td)
     * @param marginsOf     continuous or sampled, null without a model
     * @param phaseMarginDeg the smallest phase margin, degrees
     * @param gainMargin    the smallest gain margin
     * @param ms            the sensitivity peak Ms
     * @param stable        whether the sampled loop is stable, null when not checked
     * @param setpointStep  the unit setpoint step's figures, null without a model
     * @param loadStep      the unit load step's figures, null without a model
     */
    record CandidateJson(String rule, String type, String citation, String note, GainsJson ideal,
            ParallelJson parallel, GainsJson series, String marginsOf, double phaseMarginDeg, double gainMargin,
            double ms, Boolean stable, StepJson setpointStep, LoadJson loadStep) {
    }

    /** Ideal or series settings: gain, integral time and derivative time in seconds. */
    record GainsJson(double gain, double integralTime, double derivativeTime) {
    }

    /** Parallel settings: Kp, Ki in 1/s, Kd in s. */
    record ParallelJson(double proportionalGain, double integralGain, double derivativeGain) {
    }

    /** A setpoint step's figures, seconds and percent; the response's state in simulate's words. */
    record StepJson(double riseTime, double settlingTime, double overshootPercent, String response, double iae) {
    }

    /** A load step's figures. */
    record LoadJson(double iae, double peakDeviation) {
    }

    /** The JSON record of one candidate. */
    static CandidateJson json(TuningCandidate c) {
        IdealGains i = c.ideal();
        ParallelGains p = c.parallel();
        Optional<StabilityMargins> m = c.margins();
        return new CandidateJson(c.tuning().rule().label(), OptionWords.CONTROLLER_TYPES.word(c.tuning().type()),
                c.tuning().citation(), c.tuning().note(),
                new GainsJson(i.gain(), i.integralTime(), i.derivativeTime()),
                new ParallelJson(p.proportionalGain(), p.integralGain(), p.derivativeGain()),
                c.series().map(s -> new GainsJson(s.gain(), s.integralTime(), s.derivativeTime())).orElse(null),
                m.isEmpty() ? null : c.sampledMargins() ? "sampled" : "continuous",
                m.map(TuningReport::phaseMargin).orElse(Double.NaN), m.map(TuningReport::gainMargin).orElse(Double.NaN),
                m.map(x -> x.sensitivityPeak().value()).orElse(Double.NaN), c.stable().orElse(null),
                c.setpointResponse().map(r -> new StepJson(r.riseTimeSeconds(), r.settlingTimeSeconds(),
                        r.overshootPercent(), r.state().words(), r.iae()))
                        .orElse(null),
                c.loadResponse().map(l -> new LoadJson(l.iae(), l.peakDeviation())).orElse(null));
    }

    /** The JSON records of candidates. */
    static List<CandidateJson> json(List<TuningCandidate> candidates) {
        return candidates.stream().map(TuningReport::json).toList();
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
