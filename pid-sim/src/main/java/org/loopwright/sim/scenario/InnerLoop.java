package org.loopwright.sim.scenario;

import java.util.Objects;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.plant.PlantModel;

/**
 * The inner (secondary) loop of a cascade: its controller, whose output drives the actuator, and
 * the plant from the actuator to the inner measurement. The scenario's own plant then runs from the
 * inner measurement to the outer one, and the scenario's controller is the outer (primary) one.
 *
 * @param controller the inner controller; its sample period is the scenario's
 * @param plant      actuator → inner measurement
 */
public record InnerLoop(ControllerSettings controller, PlantModel plant) {

    /** Requires both parts. */
    public InnerLoop {
        Objects.requireNonNull(controller, "controller");
        Objects.requireNonNull(plant, "plant");
    }
}
