package org.loopwright.sim.plant;

import java.util.Optional;

import org.loopwright.pid.SettingChecks;

/**
 * A heated zone (a water bath, an oven) as one lumped heat capacity losing heat to the ambient:
 * C·dT/dt = P − G·(T − T_ambient), with heater power P = clamp(u, 0, maxPower): a heater cannot cool.
 * It starts at the ambient temperature.
 *
 * <p>Example: 5 L of water (C ≈ 21 kJ/K) with G = 5 W/K and a 2 kW heater:
 * {@code new ThermalZoneModel(21_000, 5, 20, 2_000, 1.0)}.
 *
 * @param heatCapacityJoulesPerKelvin C &gt; 0
 * @param lossWattsPerKelvin          G &ge; 0, the conductance to ambient
 * @param ambientCelsius              T_ambient, finite
 * @param maxPowerWatts               the heater's rating, &gt; 0 (infinity for no limit)
 * @param integrationStepSeconds      the longest integrator sub-step, &gt; 0
 */
public record ThermalZoneModel(double heatCapacityJoulesPerKelvin, double lossWattsPerKelvin, double ambientCelsius,
        double maxPowerWatts, double integrationStepSeconds) implements PlantModel {

    /** Validates every value; errors name the fields. */
    public ThermalZoneModel {
        SettingChecks.positive("heatCapacityJoulesPerKelvin", heatCapacityJoulesPerKelvin);
        SettingChecks.nonNegative("lossWattsPerKelvin", lossWattsPerKelvin);
        SettingChecks.finite("ambientCelsius", ambientCelsius);
        SettingChecks.positiveOrInfinite("maxPowerWatts", maxPowerWatts, "no limit");
        SettingChecks.positive("integrationStepSeconds", integrationStepSeconds);
    }

    @Override
    public Plant newPlant() {
        return new ThermalZone(this);
    }

    @Override
    public PlantType type() {
        return PlantType.THERMAL_ZONE;
    }

    @Override
    public Optional<TransferFunction> linear() {
        return Optional.empty();
    }
}
