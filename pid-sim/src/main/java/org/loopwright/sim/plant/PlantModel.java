package org.loopwright.sim.plant;

import java.util.Optional;

/**
 * An immutable description of a plant from which fresh {@link Plant} instances at rest are made,
 * one per simulation (so simulations may run in parallel).
 */
public sealed interface PlantModel permits TransferFunction, DcMotorModel, ThermalZoneModel, TankModel {

    /** A new plant at rest. */
    Plant newPlant();

    /** The model as a transfer function with dead time, when it is linear; empty for nonlinear plants. */
    Optional<TransferFunction> linear();

    /**
     * The longest integrator sub-step of a nonlinear plant, in seconds; infinite for a linear plant,
     * which is stepped exactly in one piece.
     */
    default double integrationStepSeconds() {
        return Double.POSITIVE_INFINITY;
    }

    /** @return the kind of model, as a scenario file names it (any transfer function is {@link PlantType#TRANSFER_FUNCTION}) */
    PlantType type();
}
