package org.loopwright.sim.plant;

import java.util.Optional;

import org.loopwright.pid.SettingChecks;

/**
 * A tank draining through an outlet by gravity (Torricelli): A·dh/dt = q_in − k·√h, with the inflow
 * clipped at 0 (a pump cannot suck back) and the level never below 0.
 *
 * <p>Example: a 0.5 m² tank with k = 0.01 m^2.5/s starting at 0.2 m:
 * {@code new TankModel(0.5, 0.01, 0.2, 0.05)}.
 *
 * @param areaSquareMetres        A &gt; 0
 * @param outletCoefficient       k &gt; 0, in m^2.5/s (outflow k·√h in m³/s)
 * @param initialLevelMetres      the level at rest, &ge; 0
 * @param integrationStepSeconds  the longest integrator sub-step, &gt; 0
 */
public record TankModel(double areaSquareMetres, double outletCoefficient, double initialLevelMetres,
        double integrationStepSeconds) implements PlantModel {

    /** Validates every value; errors name the fields. */
    public TankModel {
        SettingChecks.positive("areaSquareMetres", areaSquareMetres);
        SettingChecks.positive("outletCoefficient", outletCoefficient);
        SettingChecks.nonNegative("initialLevelMetres", initialLevelMetres);
        SettingChecks.positive("integrationStepSeconds", integrationStepSeconds);
    }

    @Override
    public Plant newPlant() {
        return new Tank(this);
    }

    @Override
    public PlantType type() {
        return PlantType.TANK;
    }

    @Override
    public Optional<TransferFunction> linear() {
        return Optional.empty();
    }
}
