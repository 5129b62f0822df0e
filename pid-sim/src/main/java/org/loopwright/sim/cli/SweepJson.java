package org.loopwright.sim.cli;

import java.util.Locale;

import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.sweep.Distribution;
import org.loopwright.sim.sweep.SweepResult;
import org.loopwright.sim.sweep.SweepRun;

/**
 * {@code sweep --json}: a record written by {@link JsonOutput} (snake_case keys, null for a figure that
 * does not exist or apply; times in seconds, shares from 0 to 1).
 *
 * @param runs              how many plants were drawn
 * @param seed              the seed of the draws
 * @param threads           the threads that ran them
 * @param distribution      how each factor is drawn ("uniform")
 * @param spread            each factor's half-width, as a share of the nominal
 * @param unstableShare     the share of runs whose loop is unstable or diverged
 * @param notAssessedShare  the share whose stability could not be assessed
 * @param notSettledShare   the share, of the runs whose response moved, that never settled
 * @param overshootPercent  overshoot over the runs, %
 * @param settlingTime      2 % settling time over the runs
 * @param iae               IAE over the runs
 * @param saturatedPercent  time at an output limit over the runs, %
 * @param worstRun          the worst run: unstable first, then unsettled, then the largest IAE
 * @param nominalRun        the run on the nominal plant
 */
record SweepJson(int runs, long seed, int threads, String distribution, SpreadJson spread, double unstableShare,
        double notAssessedShare, double notSettledShare, Distribution overshootPercent, Distribution settlingTime,
        Distribution iae, Distribution saturatedPercent, RunJson worstRun, RunJson nominalRun) {

    /** Each plant factor's half-width, as a share of the nominal. */
    record SpreadJson(double gain, double timeConstant, double deadTime) {
    }

    /**
     * One run: its plant factors, the plant simulated, the verdict and the figures.
     *
     * @param run                  its index
     * @param stability            stable, unstable, diverged or not-assessed
     * @param gainFactor           the process gain's factor
     * @param timeConstantFactor   the time constants' factor
     * @param deadTimeFactor       the dead time's factor
     * @param numerator            the plant's numerator, descending powers of s
     * @param denominator          its denominator
     * @param deadTime             its dead time, s
     * @param largestPoleMagnitude the sampled closed loop's largest pole |z|
     * @param overshootPercent     overshoot, %
     * @param settlingTime         2 % settling time, s
     * @param steadyStateError     setpoint minus measurement at the end
     * @param iae                  integral of |e|
     * @param saturatedFraction    share of the run at an output limit, 0–1
     */
    record RunJson(int run, String stability, double gainFactor, double timeConstantFactor, double deadTimeFactor,
            double[] numerator, double[] denominator, double deadTime, double largestPoleMagnitude,
            double overshootPercent, double settlingTime, double steadyStateError, double iae,
            double saturatedFraction) {

        static RunJson of(SweepRun run) {
            return new RunJson(run.index(), run.stability().name().toLowerCase(Locale.ROOT).replace('_', '-'),
                    run.draw().gainFactor(), run.draw().timeConstantFactor(), run.draw().deadTimeFactor(),
                    run.plant().numerator(), run.plant().denominator(), run.plant().deadTimeSeconds(),
                    run.largestPoleMagnitude(), run.metrics().overshootPercent(), run.metrics().settlingTimeSeconds(),
                    run.metrics().steadyStateError(), run.metrics().iae(), run.metrics().saturatedFraction());
        }
    }

    static SweepJson of(SweepResult result, int threads) {
        return new SweepJson(result.runs().size(), result.seed(), threads, "uniform",
                new SpreadJson(result.spread().gain(), result.spread().timeConstant(), result.spread().deadTime()),
                result.unstableShare(), result.notAssessedShare(), result.notSettledShare(), result.overshootPercent(),
                result.settlingTimeSeconds(), result.iae(), result.saturatedPercent(), RunJson.of(result.worst()),
                RunJson.of(result.nominal()));
    }
}
