package org.loopwright.sim.plant;

/** The plant of a {@link TankModel}: input inflow in m³/s, output level in metres. Not thread-safe. */
public final class Tank extends SubSteppedPlant {

    private final double area;
    private final double outlet;

    /** A tank at its initial level. */
    public Tank(TankModel model) {
        super(new double[] {model.initialLevelMetres()}, model.integrationStepSeconds());
        area = model.areaSquareMetres();
        outlet = model.outletCoefficient();
    }

    @Override
    void derivatives(double[] x, double input, double[] dxdt) {
        dxdt[0] = (Math.max(input, 0.0) - outlet * Math.sqrt(Math.max(x[0], 0.0))) / area;
    }

    @Override
    void afterSubStep(double input) {
        if (state[0] < 0.0) {
            state[0] = 0.0;
        }
    }

    @Override
    public double output() {
        return state[0];
    }
}
