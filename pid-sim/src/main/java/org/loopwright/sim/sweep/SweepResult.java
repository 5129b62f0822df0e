package org.loopwright.sim.sweep;

import java.util.Comparator;
import java.util.List;
import java.util.function.ToDoubleFunction;

import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseState;
import org.loopwright.sim.scenario.Scenario;

/**
 * The runs of a sweep, in index order, with the nominal run beside them, and their summary: the
 * distributions of overshoot, settling time, IAE and time in saturation, the share of unstable runs,
 * the share of runs that never settled, and the worst run.
 *
 * @param scenario the nominal scenario
 * @param spread   the spread the plants were drawn with
 * @param seed     the seed of the draws
 * @param nominal  the run on the nominal plant (index {@value Sweep#NOMINAL_INDEX})
 * @param runs     every drawn run, by index
 */
public record SweepResult(Scenario scenario, Spread spread, long seed, SweepRun nominal, List<SweepRun> runs) {

    /** Copies the runs. */
    public SweepResult {
        runs = List.copyOf(runs);
    }

    /**
     * The share of runs judged {@link LoopStability#UNSTABLE}, {@link LoopStability#OSCILLATING} or
     * {@link LoopStability#DIVERGED}, 0 to 1.
     */
    public double unstableShare() {
        return (double) runs.stream().filter(r -> r.stability() != LoopStability.STABLE
                && r.stability() != LoopStability.NOT_ASSESSED).count() / runs.size();
    }

    /** What the stability verdicts rest on: poles for a linear plant, the simulation for a nonlinear one. */
    public StabilityBasis stabilityBasis() {
        return StabilityBasis.of(scenario);
    }

    /** The share of runs whose simulation diverged and was stopped, 0 to 1. */
    public double divergedShare() {
        return (double) runs.stream().filter(r -> r.stability() == LoopStability.DIVERGED).count() / runs.size();
    }

    /** The share of runs whose stability was not assessed, 0 to 1. */
    public double notAssessedShare() {
        return (double) runs.stream().filter(r -> r.stability() == LoopStability.NOT_ASSESSED).count() / runs.size();
    }

    /**
     * The share of runs that did not settle within the 2 % band by the end of the response window, among
     * the runs whose response moved (NaN when none moved: a scenario without a setpoint step).
     */
    public double notSettledShare() {
        long moved = runs.stream().filter(SweepRun::stepFiguresApply).count();
        long unsettled = runs.stream().filter(r -> r.metrics().state() == ResponseState.NOT_SETTLED).count();
        return moved == 0 ? Double.NaN : (double) unsettled / moved;
    }

    /** Overshoot in percent. */
    public Distribution overshootPercent() {
        return of(ResponseMetrics::overshootPercent);
    }

    /** Settling time in seconds, over the runs that settled. */
    public Distribution settlingTimeSeconds() {
        return of(ResponseMetrics::settlingTimeSeconds);
    }

    /** Integral of absolute error. */
    public Distribution iae() {
        return of(ResponseMetrics::iae);
    }

    /** Time in saturation, in percent of the samples. */
    public Distribution saturatedPercent() {
        return of(m -> 100.0 * m.saturatedFraction());
    }

    private Distribution of(ToDoubleFunction<ResponseMetrics> figure) {
        return Distribution.of(runs.stream().mapToDouble(r -> figure.applyAsDouble(r.metrics())).toArray());
    }

    /**
     * The worst run: diverged runs first, then unstable or oscillating ones, then runs that never settled, then the largest IAE (a NaN
     * IAE counts as the largest); ties go to the lowest index.
     */
    public SweepRun worst() {
        Comparator<SweepRun> badness = Comparator.<SweepRun>comparingInt(r -> r.stability() == LoopStability.DIVERGED
                ? 3 : r.stability() == LoopStability.UNSTABLE || r.stability() == LoopStability.OSCILLATING ? 2 : !r.settled() && r.metrics().state()
                        == ResponseState.NOT_SETTLED ? 1 : 0)
                .thenComparingDouble(r -> Double.isNaN(r.metrics().iae()) ? Double.POSITIVE_INFINITY : r.metrics().iae())
                .thenComparing(Comparator.comparingInt(SweepRun::index).reversed());
        return runs.stream().max(badness).orElseThrow();
    }
}
