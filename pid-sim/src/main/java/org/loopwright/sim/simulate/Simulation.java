package org.loopwright.sim.simulate;

import org.loopwright.sim.scenario.Scenario;

/** Runs a scenario from start to end. Thread-safe: every run has its own loop. */
public final class Simulation {

    private Simulation() {
    }

    /** The whole trajectory of the scenario, from rest. */
    public static Trajectory run(Scenario scenario) {
        return new ClosedLoop(scenario).run();
    }
}
