package org.loopwright.sim.scenario;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URISyntaxException;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

/** The example scenario files read and behave as a control engineer would expect (common practice). */
class ExampleScenariosTest {

    private static Path example(String name) throws URISyntaxException {
        return Path.of(ExampleScenariosTest.class.getResource("/scenarios/" + name).toURI());
    }

    @Test
    void gimbalAxisReachesItsAnglesDespiteStickSlipFriction() throws URISyntaxException {
        Scenario s = ScenarioFile.read(example("gimbal-axis.yaml"));
        Trajectory t = Simulation.run(s);
        int atFifteen = (int) Math.round(15.0 / s.samplePeriodSeconds());
        assertThat(t.process(atFifteen)).isBetween(0.49, 0.51);
        assertThat(t.process(t.length() - 1)).isBetween(-0.21, -0.19);
    }

    @Test
    void thermostatHuntsAroundItsSetpoint() throws URISyntaxException {
        Scenario s = ScenarioFile.read(example("bath-thermostat.yaml"));
        Trajectory t = Simulation.run(s);
        LimitCycle cycle = LimitCycle.of(t, 3600.0).orElseThrow();
        assertThat(cycle.amplitude()).isGreaterThan(0.2).isLessThan(3.0);
        double mean = 0.0;
        int from = t.length() / 2;
        for (int k = from; k < t.length(); k++) {
            mean += t.process(k);
        }
        assertThat(mean / (t.length() - from)).isBetween(59.0, 61.0);
    }

    @Test
    void boosterPumpRecoversTheLevelAfterTheDemandChanges() throws URISyntaxException {
        Scenario s = ScenarioFile.read(example("booster-pump-tank.yaml"));
        Trajectory t = Simulation.run(s);
        assertThat(t.process(t.length() - 1)).isBetween(0.98, 1.02);
        assertThat(ResponseMetrics.peakDeviation(t, 600.0)).isGreaterThan(0.01);
    }
}
