package org.loopwright.sim.sweep;

/**
 * A sweep run's stability verdict. For a linear plant, from the closed-loop poles of the sampled linear
 * loop (PID controller, plant, sensor delay; limits, slew, dead zone, noise and quantisation left out)
 * when they can be computed; for a nonlinear plant, from the simulation alone ({@link StabilityBasis}).
 * A run whose simulated output left the divergence bound is unstable in any case.
 */
public enum LoopStability {
    /**
     * Linear plant: every closed-loop pole strictly inside the unit circle. Nonlinear plant: the simulation
     * neither diverged nor kept oscillating ({@link SustainedOscillation}).
     */
    STABLE,
    /** A closed-loop pole on or outside the unit circle; the simulation did not reach the divergence bound. */
    UNSTABLE,
    /**
     * Nonlinear plant: the simulated loop was still oscillating at the end of the run by the rule of
     * {@link SustainedOscillation} (a limit cycle, or a growth too slow to reach the divergence bound).
     */
    OSCILLATING,
    /**
     * The simulation diverged (see {@link org.loopwright.sim.simulate.Divergence}) and was stopped: the run
     * is counted, but none of its figures enters the distributions.
     */
    DIVERGED,
    /**
     * The simulated output stayed finite, but the verdict could not be made: the poles were not computed
     * (more than {@value Sweep#MAX_DELAY_PERIODS} periods of dead time), or an on-off controller, whose
     * loop cycles by design.
     */
    NOT_ASSESSED
}
