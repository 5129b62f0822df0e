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
 * @param plot                 the measurement y(k) thinned for the plot (NaN for a dropout)
 */
public record SweepRun(int index, PlantDraw draw, PlantModel plant, ResponseMetrics metrics,
        LoopStability stability, double largestPoleMagnitude, double decayRatio, PlotTrace plot) {

    /** Whether the response settled within the 2 % band (false also when the step figures do not apply). */
    public boolean settled() {
        return metrics.state() == ResponseState.SETTLED;
    }

    /** Whether the run had a setpoint step to respond to and did not diverge (settled or not). */
    public boolean stepFiguresApply() {
        return metrics.state() == ResponseState.SETTLED || metrics.state() == ResponseState.NOT_SETTLED;
    }
}
