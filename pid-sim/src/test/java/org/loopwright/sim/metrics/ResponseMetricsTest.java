package org.loopwright.sim.metrics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

class ResponseMetricsTest {

    private static ControllerSettings pi(double gain, double integralTime, double h) {
        return ControllerSettings.builder().gains(IdealGains.pi(gain, integralTime)).samplePeriodSeconds(h).build();
    }

    /**
     * Analytic: a first-order closed loop 1/(τs + 1) (PI with Ti = T on K/(Ts+1), τ = T/(Kc·K)) has
     * rise time τ·ln 9, 2 % settling time τ·ln 50, no overshoot, IAE = ISE·2 = τ and ITAE = τ² for a
     * unit step (∫e^(−t/τ)dt = τ, ∫e^(−2t/τ)dt = τ/2, ∫t·e^(−t/τ)dt = τ²). Small h, so the sampled
     * loop is close to the continuous one.
     */
    @Test
    void firstOrderClosedLoopHasTheTextbookFigures() {
        double tau = 10.0 / (2.0 * 1.0);
        double h = 0.002;
        Scenario s = Scenario.setpointStep(TransferFunction.firstOrder(1.0, 10.0), pi(2.0, 10.0, h), 1.0, 60.0);
        Trajectory t = Simulation.run(s);
        ResponseMetrics m = ResponseMetrics.of(s, t);
        assertThat(m.riseTimeSeconds()).isCloseTo(tau * Math.log(9.0), within(0.01));
        assertThat(m.settlingTimeSeconds()).isCloseTo(tau * Math.log(50.0), within(0.01));
        assertThat(m.overshootPercent()).isCloseTo(0.0, within(1e-3));
        assertThat(m.peakTimeSeconds()).isNaN();
        assertThat(m.iae()).isCloseTo(tau, within(0.01));
        assertThat(m.ise()).isCloseTo(tau / 2.0, within(0.01));
        assertThat(m.itae()).isCloseTo(tau * tau, within(0.05));
        assertThat(m.steadyStateError()).as("e^(-t/τ) at 60 s").isCloseTo(Math.exp(-60.0 / tau), within(1e-6));
        assertThat(m.saturatedFraction()).isZero();
    }

    /**
     * Analytic (Åström &amp; Murray 2021, §5.3 / the standard second-order step response): a loop
     * that is ωn²/(s² + 2ζωn·s + ωn²) overshoots by 100·e^(−πζ/√(1−ζ²)) % at t = π/(ωn√(1−ζ²)).
     * P control Kc = 1 of ωn²/(s(s + 2ζωn)) gives exactly that closed loop.
     */
    @Test
    void secondOrderOvershootAndPeakTimeMatchTheFormula() {
        double wn = 1.0;
        double zeta = 0.4;
        TransferFunction openLoop = new TransferFunction(new double[] {wn * wn}, new double[] {1.0, 2 * zeta * wn, 0.0}, 0.0);
        Scenario s = Scenario.setpointStep(openLoop, pi(1.0, Double.POSITIVE_INFINITY, 0.001), 1.0, 40.0);
        ResponseMetrics m = ResponseMetrics.of(s, Simulation.run(s));
        double damped = wn * Math.sqrt(1 - zeta * zeta);
        assertThat(m.overshootPercent()).isCloseTo(100 * Math.exp(-Math.PI * zeta / Math.sqrt(1 - zeta * zeta)),
                within(0.2));
        assertThat(m.peakTimeSeconds()).isCloseTo(Math.PI / damped, within(0.01));
    }

    @Test
    void stepFiguresDoNotApplyWhenNothingMoves() {
        Scenario s = Scenario.setpointStep(TransferFunction.firstOrder(1.0, 10.0), pi(2.0, 10.0, 0.1), 0.0, 10.0);
        ResponseMetrics m = ResponseMetrics.of(s, Simulation.run(s));
        assertThat(m.riseTimeSeconds()).isNaN();
        assertThat(m.settlingTimeSeconds()).isNaN();
        assertThat(m.overshootPercent()).isNaN();
        assertThat(m.iae()).isZero();
    }

    /** Analytic: P control of 1/(Ts+1) under a unit load step deviates by 1/(1 + Kc) at the end. */
    @Test
    void loadStepFiguresMeasureTheDeviation() {
        Scenario s = Scenario.loadStep(TransferFunction.firstOrder(1.0, 2.0), pi(3.0, Double.POSITIVE_INFINITY, 0.01),
                1.0, 30.0);
        Trajectory t = Simulation.run(s);
        assertThat(ResponseMetrics.peakDeviation(t, 0.0)).isCloseTo(0.25, within(1e-6));
        // ∫ of 0.25·(1 − e^(−2t)) over 30 s with closed-loop time constant 2/(1+3) = 0.5 s
        assertThat(ResponseMetrics.loadIae(t, 0.0)).isCloseTo(0.25 * (30.0 - 0.5), within(0.01));
    }
}
