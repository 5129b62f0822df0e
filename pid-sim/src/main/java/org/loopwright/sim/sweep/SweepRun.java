package org.loopwright.sim.sweep;

import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseState;
import org.loopwright.sim.plant.PlantModel;

/**
 * One run of a sweep: the plant it drew, its response figures, its stability verdict, and its
 * measurement thinned for plotting.
 *
 * @param index                the run's number, from 0 (its random stream is derived from it)
 * @param draw                 the factors applied to the nominal plant
 * @param plant                the plant simulated
 * @param metrics              the response figures over the scenario's response window
 * @param stability            the stability verdict
 * @param largestPoleMagnitude the largest closed-loop pole magnitude of the sampled loop (NaN when not computed)
 * @param decayRatio           for a plant judged by simulation, the process error's last swing over the swing
 *                             a cycle before ({@link SustainedOscillation}; NaN with fewer swings or a linear plant)
 * @param plotTimes            sample instants of the thinned measurement, seconds
 * @param plotMeasurements     the measurement y(k) at those instants (NaN for a dropout)
 */
public record SweepRun(int index, PlantDraw draw, PlantModel plant, ResponseMetrics metrics,
        LoopStability stability, double largestPoleMagnitude, double decayRatio, double[] plotTimes,
        double[] plotMeasurements) {

    /** Copies the arrays. */
    public SweepRun {
        plotTimes = plotTimes.clone();
        plotMeasurements = plotMeasurements.clone();
    }

    /** Whether the response settled within the 2 % band (false also when the step figures do not apply). */
    public boolean settled() {
        return metrics.state() == ResponseState.SETTLED;
    }

    /** Whether the run had a setpoint step to respond to and did not diverge (settled or not). */
    public boolean stepFiguresApply() {
        return metrics.state() == ResponseState.SETTLED || metrics.state() == ResponseState.NOT_SETTLED;
    }

    @Override
    public double[] plotTimes() {
        return plotTimes.clone();
    }

    @Override
    public double[] plotMeasurements() {
        return plotMeasurements.clone();
    }
}
