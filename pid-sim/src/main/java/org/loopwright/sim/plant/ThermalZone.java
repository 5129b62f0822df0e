package org.loopwright.sim.plant;

/**
 * The plant of a {@link ThermalZoneModel}: input heater power in watts (clipped to 0..max), output
 * temperature in °C. Not thread-safe.
 */
public final class ThermalZone extends SubSteppedPlant {

    private final double capacity;
    private final double loss;
    private final double ambient;
    private final double maxPower;

    /** A zone at the ambient temperature. */
    public ThermalZone(ThermalZoneModel model) {
        super(new double[] {model.ambientCelsius()}, model.integrationStepSeconds());
        capacity = model.heatCapacityJoulesPerKelvin();
        loss = model.lossWattsPerKelvin();
        ambient = model.ambientCelsius();
        maxPower = model.maxPowerWatts();
    }

    @Override
    void derivatives(double[] x, double input, double[] dxdt) {
        double power = Math.min(Math.max(input, 0.0), maxPower);
        dxdt[0] = (power - loss * (x[0] - ambient)) / capacity;
    }

    @Override
    public double output() {
        return state[0];
    }
}
