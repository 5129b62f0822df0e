package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;

class ClosedLoopAnalyticTest {

    private static ControllerSettings pi(double gain, double integralTime, double h) {
        return ControllerSettings.builder().gains(IdealGains.pi(gain, integralTime)).samplePeriodSeconds(h).build();
    }

    /** The largest |y(t) − (1 − e^(−t/Tcl))| over a run. */
    private static double worstDeviationFromFirstOrder(double h) {
        double plantGain = 2.0;
        double plantTime = 10.0;
        double controllerGain = 1.5;
        double closedLoopTime = plantTime / (controllerGain * plantGain);
        Scenario s = Scenario.setpointStep(TransferFunction.firstOrder(plantGain, plantTime),
                pi(controllerGain, plantTime, h), 1.0, 20.0);
        Trajectory t = Simulation.run(s);
        double worst = 0.0;
        for (int k = 0; k < t.length(); k++) {
            double expected = 1.0 - Math.exp(-t.time(k) / closedLoopTime);
            worst = Math.max(worst, Math.abs(t.process(k) - expected));
        }
        return worst;
    }

    /**
     * Analytic (Åström &amp; Hägglund, Advanced PID Control, 2006, pole–zero cancellation): PI with
     * Ti = T on K/(Ts+1) gives L(s) = Kc·K/(Ts), so the closed loop is 1/((T/(Kc·K))·s + 1). The
     * sampled loop approaches it as h → 0, with an error of order h (the hold's half-period lag).
     */
    @Test
    void piWithIntegralTimeEqualToPlantTimeGivesFirstOrderClosedLoop() {
        double coarse = worstDeviationFromFirstOrder(0.01);
        double fine = worstDeviationFromFirstOrder(0.005);
        assertThat(fine).isLessThan(2e-3);
        assertThat(coarse / fine).as("first-order convergence in h").isBetween(1.8, 2.2);
    }

    /**
     * Analytic: P control of K/(Ts+1) leaves e∞ = 1/(1 + Kc·K) of a setpoint step (final value
     * theorem; the sampled loop has the same static gain when it is stable).
     */
    @Test
    void proportionalControlLeavesTheClassicSteadyStateError() {
        double plantGain = 2.0;
        double controllerGain = 3.0;
        ControllerSettings p = pi(controllerGain, Double.POSITIVE_INFINITY, 0.1);
        Scenario s = Scenario.setpointStep(TransferFunction.firstOrder(plantGain, 5.0), p, 4.0, 60.0);
        Trajectory t = Simulation.run(s);
        double error = t.setpoint(t.length() - 1) - t.process(t.length() - 1);
        assertThat(error).isCloseTo(4.0 / (1.0 + controllerGain * plantGain), within(1e-9));
    }

    /**
     * Analytic: a load step d on K/(Ts+1) under P control settles at y = K·d/(1 + Kc·K); the load
     * step takes effect at its own time inside a period (here 0.35 s into a 1 s period), so the
     * first sample after it already shows exactly K·d·(1 − e^(−0.65/T)).
     */
    @Test
    void loadStepInsideAPeriodTakesEffectAtItsOwnTime() {
        double plantGain = 2.0;
        double plantTime = 5.0;
        ControllerSettings p = pi(1.0, Double.POSITIVE_INFINITY, 1.0);
        Scenario s = Scenario.builder().plant(TransferFunction.firstOrder(plantGain, plantTime)).controller(p)
                .disturbance(new LoadStep(3.35, 1.0)).durationSeconds(100.0).build();
        Trajectory t = Simulation.run(s);
        assertThat(t.process(3)).isZero();
        assertThat(t.process(4)).isCloseTo(plantGain * (1.0 - Math.exp(-0.65 / plantTime)), within(1e-12));
        assertThat(t.disturbance(3)).isZero();
        assertThat(t.disturbance(4)).isEqualTo(1.0);
        assertThat(t.process(t.length() - 1)).isCloseTo(plantGain / (1.0 + plantGain), within(1e-9));
    }
}
