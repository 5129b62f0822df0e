package org.loopwright.sim.cli;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

import com.fasterxml.jackson.annotation.JsonAnyGetter;
import com.fasterxml.jackson.annotation.JsonUnwrapped;

import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.plant.PlantParameters;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.sweep.Distribution;
import org.loopwright.sim.sweep.SweepResult;
import org.loopwright.sim.sweep.SweepRun;

/**
 * {@code sweep --json}: records written by {@link JsonOutput} (snake_case keys, null for a figure that
 * does not exist; times in s). The spread and a run's plant figures are keyed by the plant type's
 * spread keys, so they are ordered maps.
 */
final class SweepJson {

    private SweepJson() {
    }

    /**
     * The whole sweep.
     *
     * @param runs             the number of drawn runs
     * @param seed             the random seed
     * @param threads          the worker threads used
     * @param distribution     how factors are drawn
     * @param stabilityBasis   how stability was judged
     * @param spread           each spread key's fraction
     * @param unstableShare    the share of runs judged unstable
     * @param notAssessedShare the share of runs whose stability could not be judged
     * @param notSettledShare  the share of runs that did not settle
     * @param overshootPercent the overshoot distribution
     * @param settlingTime     the settling time distribution
     * @param iae              the IAE distribution
     * @param saturatedPercent the saturated time share distribution
     * @param worstRun         the worst run
     * @param nominalRun       the run on the nominal plant
     */
    record Sweep(int runs, long seed, int threads, String distribution, String stabilityBasis,
            Map<String, Double> spread, double unstableShare, double notAssessedShare, double notSettledShare,
            Figures overshootPercent, Figures settlingTime, Figures iae, Figures saturatedPercent, Run worstRun,
            Run nominalRun) {

        static Sweep of(SweepResult result, int threadCount) {
            Map<String, Double> spread = new LinkedHashMap<>();
            for (FileKey<Double> key : result.scenario().plant().type().spreadKeys()) {
                spread.put(name(key), result.spread().fraction(key.word()));
            }
            return new Sweep(result.runs().size(), result.seed(), threadCount, "uniform",
                    result.stabilityBasis().name().toLowerCase(Locale.ROOT), spread, result.unstableShare(),
                    result.notAssessedShare(), result.notSettledShare(), Figures.of(result.overshootPercent()),
                    Figures.of(result.settlingTimeSeconds()), Figures.of(result.iae()),
                    Figures.of(result.saturatedPercent()), Run.of(result.worst()), Run.of(result.nominal()));
        }
    }

    /**
     * One figure's distribution over the runs that have it.
     *
     * @param count  the runs that have the figure
     * @param min    the smallest
     * @param median the median
     * @param p90    the 90th percentile
     * @param max    the largest
     */
    record Figures(int count, double min, double median, double p90, double max) {

        static Figures of(Distribution d) {
            return new Figures(d.count(), d.min(), d.median(), d.p90(), d.max());
        }
    }

    /**
     * One run: its draw and plant (keys depend on the plant type), then its step response figures.
     *
     * @param run               the run's index
     * @param stability         stable, unstable or not-assessed
     * @param plant             the drawn factors and the plant they give, in order
     * @param overshootPercent  the overshoot
     * @param settlingTime      the settling time
     * @param steadyStateError  the steady-state error
     * @param iae               the IAE
     * @param saturatedFraction the share of time at an output limit
     */
    record Run(int run, String stability, @JsonUnwrapped Plant plant, double overshootPercent,
            double settlingTime, double steadyStateError, double iae, double saturatedFraction) {

        static Run of(SweepRun run) {
            Map<String, Object> plant = new LinkedHashMap<>();
            for (FileKey<Double> key : run.plant().type().spreadKeys()) {
                plant.put(name(key) + "_factor", run.draw().factor(key.word()));
            }
            if (run.plant() instanceof TransferFunction linear) {
                plant.put("numerator", linear.numerator());
                plant.put("denominator", linear.denominator());
                plant.put("dead_time", linear.deadTimeSeconds());
                plant.put("largest_pole_magnitude", run.largestPoleMagnitude());
            } else {
                for (FileKey<Double> key : run.plant().type().spreadKeys()) {
                    plant.put(name(key), PlantParameters.value(run.plant(), key));
                }
                if (run.plant().linear().isPresent()) {
                    plant.put("largest_pole_magnitude", run.largestPoleMagnitude());
                } else {
                    plant.put("decay_ratio", run.decayRatio());
                }
            }
            return new Run(run.index(), run.stability().name().toLowerCase(Locale.ROOT).replace('_', '-'), new Plant(plant),
                    run.metrics().overshootPercent(), run.metrics().settlingTimeSeconds(),
                    run.metrics().steadyStateError(), run.metrics().iae(), run.metrics().saturatedFraction());
        }
    }

    /**
     * A run's drawn factors and the plant they give, keyed by the plant type's spread keys; unwrapped into
     * the run, where a map keeps its place (a bare any-getter would be written last).
     *
     * @param values the keys and figures, in order
     */
    record Plant(@JsonAnyGetter Map<String, Object> values) {
    }

    /** A spread key as JSON and CSV name it: {@code static-friction} is {@code static_friction}. */
    static String name(FileKey<Double> key) {
        return key.word().replace('-', '_');
    }
}
