package org.loopwright.sim.plant;

import java.util.Arrays;

/**
 * A nonlinear plant integrated by the classical fourth-order Runge–Kutta method with fixed sub-steps:
 * each advance is split into the fewest equal sub-steps no longer than the model's integration step.
 * Allocation-free: the stage vectors are fields.
 */
abstract class SubSteppedPlant implements Plant {

    /** The state, in the order the subclass defines. */
    final double[] state;
    private final double[] initial;
    private final double maxStepSeconds;
    private final double[] k1;
    private final double[] k2;
    private final double[] k3;
    private final double[] k4;
    private final double[] probe;

    SubSteppedPlant(double[] initialState, double maxStepSeconds) {
        this.initial = initialState.clone();
        this.state = initialState.clone();
        this.maxStepSeconds = maxStepSeconds;
        int n = initialState.length;
        k1 = new double[n];
        k2 = new double[n];
        k3 = new double[n];
        k4 = new double[n];
        probe = new double[n];
    }

    /** dx/dt at state x under input u; must not allocate. */
    abstract void derivatives(double[] x, double input, double[] dxdt);

    /** Called after each sub-step, for discrete events (friction sticking, a level that reaches zero). */
    void afterSubStep(double input) {
    }

    /** Called at the start of each sub-step, for discrete events decided on the state before it. */
    void beforeSubStep(double input) {
    }

    @Override
    public void reset() {
        System.arraycopy(initial, 0, state, 0, state.length);
    }

    @Override
    public final void advance(double inputHeldOverInterval, double seconds) {
        if (!(seconds > 0.0)) {
            return;
        }
        // the tiny relative margin keeps 0.1 s / 0.01 s at 10 sub-steps despite rounding
        int steps = Math.max(1, (int) Math.ceil(seconds / maxStepSeconds * (1.0 - 1e-12)));
        double dt = seconds / steps;
        for (int s = 0; s < steps; s++) {
            beforeSubStep(inputHeldOverInterval);
            rungeKutta(inputHeldOverInterval, dt);
            afterSubStep(inputHeldOverInterval);
        }
    }

    private void rungeKutta(double u, double dt) {
        int n = state.length;
        derivatives(state, u, k1);
        for (int i = 0; i < n; i++) {
            probe[i] = state[i] + 0.5 * dt * k1[i];
        }
        derivatives(probe, u, k2);
        for (int i = 0; i < n; i++) {
            probe[i] = state[i] + 0.5 * dt * k2[i];
        }
        derivatives(probe, u, k3);
        for (int i = 0; i < n; i++) {
            probe[i] = state[i] + dt * k3[i];
        }
        derivatives(probe, u, k4);
        for (int i = 0; i < n; i++) {
            state[i] += dt / 6.0 * (k1[i] + 2.0 * k2[i] + 2.0 * k3[i] + k4[i]);
        }
    }

    @Override
    public String toString() {
        return getClass().getSimpleName() + Arrays.toString(state);
    }
}
