package org.loopwright.sim.sweep;

import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Divergence;

/** What a sweep's stability verdicts rest on, decided by the scenario's plant. */
public enum StabilityBasis {
    /** A linear plant: the closed-loop poles of the sampled loop, and divergence of the simulation. */
    POLES("the closed-loop poles of the sampled linear loop (a pole on or outside the unit circle is unstable),"
            + " or a diverging simulation"),
    /** A nonlinear plant: the simulation alone, divergence and sustained oscillation. */
    SIMULATION("the simulation alone (the plant is nonlinear, so it has no poles): " + Divergence.RULE + "; "
            + SustainedOscillation.RULE);

    private final String describe;

    StabilityBasis(String describe) {
        this.describe = describe;
    }

    /** The basis of a scenario's sweep: poles when its plant is linear, the simulation otherwise. */
    public static StabilityBasis of(Scenario scenario) {
        return scenario.linearPlant().isPresent() ? POLES : SIMULATION;
    }

    /** @return how the verdicts are judged, in a sentence for output, help and reports */
    public String describe() {
        return describe;
    }
}
