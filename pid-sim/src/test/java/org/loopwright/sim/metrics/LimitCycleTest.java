package org.loopwright.sim.metrics;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

class LimitCycleTest {

    /**
     * Analytic (piecewise exponential response of K·e^(−Ls)/(Ts+1) to a relay with hysteresis ±ε,
     * output 0 or U, derived from y(t) = y∞ + (y₀ − y∞)e^(−t/T)): the heater switches off at r + ε but
     * the output keeps rising for L, to y_max = KU + (r + ε − KU)e^(−L/T); it switches on at r − ε and
     * keeps falling for L, to y_min = (r − ε)e^(−L/T). The period is
     * 2L + T·ln(y_max/(r − ε)) + T·ln((KU − y_min)/(KU − r − ε)). The sampled controller switches up
     * to one period h late, so the comparison allows a few h's worth.
     */
    @Test
    void onOffCycleOnAFirstOrderPlusDeadTimeMatchesTheExactPiecewiseSolution() {
        double k = 100.0;
        double tau = 50.0;
        double deadTime = 2.0;
        double on = 1.0;
        double r = 50.0;
        double band = 1.0;
        double h = 0.01;
        double eps = band / 2.0;
        double decay = Math.exp(-deadTime / tau);
        double yMax = k * on + (r + eps - k * on) * decay;
        double yMin = (r - eps) * decay;
        double period = 2.0 * deadTime + tau * Math.log(yMax / (r - eps))
                + tau * Math.log((k * on - yMin) / (k * on - r - eps));

        Scenario s = Scenario.builder().plant(TransferFunction.fopdt(k, tau, deadTime))
                .onOffController(new OnOffSettings(0.0, on, band, 0.0, 0.0, Action.REVERSE), h)
                .setpoint(SetpointChange.step(0.0, r)).durationSeconds(400.0).build();
        Trajectory t = Simulation.run(s);
        LimitCycle cycle = LimitCycle.of(t, 150.0).orElseThrow();

        assertThat(cycle.amplitude()).isCloseTo((yMax - yMin) / 2.0, within(3 * h));
        assertThat(cycle.periodSeconds()).isCloseTo(period, within(5 * h));
        assertThat(cycle.cycles()).isGreaterThanOrEqualTo(10);
    }

    @Test
    void noCycleInASettledResponse() {
        Scenario s = Scenario.builder().plant(TransferFunction.firstOrder(1.0, 1.0))
                .onOffController(new OnOffSettings(0.0, 0.5, 0.0, 0.0, 0.0, Action.REVERSE), 0.1)
                .setpoint(SetpointChange.step(0.0, 2.0)).durationSeconds(30.0).build();
        // the heater cannot reach the setpoint: it stays on and the output settles at 0.5
        assertThat(LimitCycle.of(Simulation.run(s), 10.0)).isEmpty();
    }
}
