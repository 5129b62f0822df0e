package org.loopwright.sim.sweep;

/**
 * A sweep run's stability verdict. From the closed-loop poles of the sampled linear loop (PID
 * controller, plant, sensor delay; limits, slew, dead zone, noise and quantisation left out) when they
 * can be computed; a run whose simulated output left the finite numbers is unstable in any case.
 */
public enum LoopStability {
    /** Every closed-loop pole strictly inside the unit circle, and the simulated output stayed finite. */
    STABLE,
    /** A closed-loop pole on or outside the unit circle; the simulation did not reach the divergence bound. */
    UNSTABLE,
    /**
     * The simulation diverged (see {@link org.loopwright.sim.simulate.Divergence}) and was stopped: the run
     * is counted, but none of its figures enters the distributions.
     */
    DIVERGED,
    /**
     * The poles were not computed (an on-off controller, or more than
     * {@value Sweep#MAX_DELAY_PERIODS} periods of dead time) and the simulated output stayed finite.
     */
    NOT_ASSESSED
}
