package org.loopwright.sim.design;

import java.util.Objects;
import java.util.Optional;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.sim.frequency.GainCrossing;
import org.loopwright.sim.frequency.PhaseCrossing;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Trajectory;
import org.loopwright.sim.sweep.SweepResult;

/**
 * One candidate setting and its evidence: the sampled loop's margins and poles (sensor delay
 * included), the simulated setpoint and load steps with the device's limits, and the robustness
 * sweep. An unstable loop is neither simulated nor swept: its step and sweep figures are NaN.
 *
 * @param name         unique, such as {@code "simc-pi"}
 * @param rule         the rule's label, or {@value Design#OPTIMISED_RULE} for the optimised design
 * @param type         PI or PID
 * @param source       the paper or method the gains come from
 * @param note         the design choices behind the gains (τc, half rule, ...), or empty
 * @param gains        the gains, ideal form
 * @param device       the settings to load on the device (absolute output limits)
 * @param scenarioText the scenario the candidate was checked with (in deviation from the operating point)
 * @param scenario     that scenario as read
 * @param margins      the sampled loop's margins and closed-loop poles
 * @param run          the simulated run, when the loop is stable
 * @param metrics      its figures (setpoint step window; integrals to the end)
 * @param loadIae      ∫|r − y| dt from the load step on
 * @param sweep        the robustness sweep, when the loop is stable
 * @param maxSensitivity the Ms limit the candidate is judged against
 */
public record Candidate(String name, String rule, ControllerType type, String source, String note, IdealGains gains,
        ControllerSettings device, String scenarioText, Scenario scenario, SampledMargins margins,
        Optional<Trajectory> run, Optional<ResponseMetrics> metrics, double loadIae, Optional<SweepResult> sweep,
        double maxSensitivity) {

    /** Checks that nothing is null. */
    public Candidate {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(gains, "gains");
        Objects.requireNonNull(margins, "margins");
        Objects.requireNonNull(run, "run");
        Objects.requireNonNull(metrics, "metrics");
        Objects.requireNonNull(sweep, "sweep");
    }

    /** The same candidate judged against another limit on Ms. */
    public Candidate judgedAgainst(double limit) {
        return new Candidate(name, rule, type, source, note, gains, device, scenarioText, scenario, margins, run,
                metrics, loadIae, sweep, limit);
    }

    /** Whether every closed-loop pole of the sampled loop lies inside the unit circle. */
    public boolean stable() {
        return margins.stable();
    }

    /** The smallest gain margin of the sampled loop (infinite when the phase never reaches −180°). */
    public double gainMargin() {
        return margins.margins().phaseCrossover().map(PhaseCrossing::gainMargin).orElse(Double.POSITIVE_INFINITY);
    }

    /** The smallest phase margin of the sampled loop, degrees (NaN without a gain crossover). */
    public double phaseMarginDegrees() {
        return margins.margins().gainCrossover().map(GainCrossing::phaseMarginDegrees).orElse(Double.NaN);
    }

    /** Ms of the sampled loop. */
    public double ms() {
        return margins.margins().sensitivityPeak().value();
    }

    /** Mt of the sampled loop. */
    public double mt() {
        return margins.margins().complementaryPeak().value();
    }

    /** The delay margin of the sampled loop, seconds (NaN without a gain crossover). */
    public double delayMarginSeconds() {
        return margins.margins().delayMarginSeconds().orElse(Double.NaN);
    }

    /** Overshoot of the setpoint step, percent (NaN when not simulated). */
    public double overshootPercent() {
        return metrics.map(ResponseMetrics::overshootPercent).orElse(Double.NaN);
    }

    /** 2 % settling time of the setpoint step, seconds (NaN when not simulated or not settled). */
    public double settlingTimeSeconds() {
        return metrics.map(ResponseMetrics::settlingTimeSeconds).orElse(Double.NaN);
    }

    /** Total variation of the controller output over the run (NaN when not simulated). */
    public double totalVariation() {
        return metrics.map(ResponseMetrics::totalVariation).orElse(Double.NaN);
    }

    /** The share of sweep runs judged unstable, 0 to 1 (NaN when not swept). */
    public double sweepUnstableShare() {
        return sweep.map(SweepResult::unstableShare).orElse(Double.NaN);
    }

    /** The 90th percentile of the sweep's overshoot, percent (NaN when not swept). */
    public double sweepP90OvershootPercent() {
        return sweep.map(s -> s.overshootPercent().p90()).orElse(Double.NaN);
    }

    /** Whether the candidate meets the constraints: stable, Ms within the limit, no unstable sweep run. */
    public boolean meetsConstraints() {
        return stable() && ms() <= maxSensitivity && sweepUnstableShare() == 0.0;
    }

    /** Why the candidate fails the constraints, in words; empty when it meets them. */
    public String shortfall() {
        if (!stable()) {
            return String.format(java.util.Locale.ROOT, "UNSTABLE sampled loop (largest closed-loop pole |z| = %.4f):"
                    + " not simulated", margins.largestPoleMagnitude());
        }
        StringBuilder why = new StringBuilder();
        if (ms() > maxSensitivity) {
            why.append(String.format(java.util.Locale.ROOT, "Ms %.3f > %.3g", ms(), maxSensitivity));
        }
        if (!(sweepUnstableShare() == 0.0)) {
            why.append(why.length() == 0 ? "" : "; ").append(String.format(java.util.Locale.ROOT,
                    "%.1f %% of sweep runs unstable", 100.0 * sweepUnstableShare()));
        }
        return why.toString();
    }
}
