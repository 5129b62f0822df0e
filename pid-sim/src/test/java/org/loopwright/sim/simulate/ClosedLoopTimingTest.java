package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.LinearPlant;
import org.loopwright.sim.plant.Plant;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

/** The sampled-data order: when things are read, held and recorded. */
class ClosedLoopTimingTest {

    private static final ControllerSettings PI = ControllerSettings.builder().gains(IdealGains.pi(0.8, 5.0))
            .samplePeriodSeconds(0.5).build();

    private static Scenario.Builder base() {
        return Scenario.builder().plant(TransferFunction.fopdt(1.5, 5.0, 0.7)).controller(PI).durationSeconds(30.0);
    }

    @Test
    void setpointRampsLinearlyFromWhereItWas() {
        Trajectory t = Simulation.run(base().setpoint(SetpointChange.step(0.0, 2.0), new SetpointChange(5.0, 4.0, 4.0))
                .build());
        assertThat(t.setpoint(9)).as("t=4.5, before the ramp").isEqualTo(2.0);
        assertThat(t.setpoint(10)).as("t=5, ramp starts").isEqualTo(2.0);
        assertThat(t.setpoint(13)).as("t=6.5").isCloseTo(2.75, within(1e-12));
        assertThat(t.setpoint(18)).as("t=9, ramp ends").isEqualTo(4.0);
        assertThat(t.setpoint(40)).isEqualTo(4.0);
    }

    @Test
    void setpointBeforeItsFirstEntryIsThePlantsRestValue() {
        Trajectory t = Simulation.run(base().setpoint(SetpointChange.step(3.0, 1.0)).build());
        assertThat(t.setpoint(5)).isZero();
        assertThat(t.output(5)).isZero();
        assertThat(t.setpoint(6)).isEqualTo(1.0);
    }

    @Test
    void measurementDelayIsWholeSamplesOfTheProcess() {
        Trajectory t = Simulation.run(base().setpoint(SetpointChange.step(0.0, 1.0))
                .sensor(new SensorModel(0.0, 0.0, 3, 0.0, 0.0)).build());
        for (int k = 3; k < t.length(); k++) {
            assertThat(t.measurement(k)).isEqualTo(t.process(k - 3));
        }
    }

    /**
     * With jitter each sample is late by a grid value within the bound, and the plant is still exact
     * between the irregular instants: replaying the delivered inputs over the recorded intervals
     * through a fresh exact plant gives the recorded process values.
     */
    @Test
    void jitteredSamplesAreLateWithinTheBoundAndThePlantStaysExact() {
        double jitter = 0.2;
        Trajectory t = Simulation.run(base().setpoint(SetpointChange.step(0.0, 1.0))
                .sensor(new SensorModel(0.0, 0.0, 0, jitter, 0.0)).build());
        Plant replay = new LinearPlant(TransferFunction.fopdt(1.5, 5.0, 0.7));
        boolean sawLate = false;
        for (int k = 0; k < t.length(); k++) {
            double late = t.time(k) - k * 0.5;
            assertThat(late).isBetween(-1e-12, jitter + 1e-12);
            sawLate |= late > 0.0;
            if (k > 0) {
                replay.advance(t.delivered(k - 1), t.time(k) - t.time(k - 1));
                assertThat(t.process(k)).isCloseTo(replay.output(), within(1e-9));
            }
        }
        assertThat(sawLate).isTrue();
    }

    @Test
    void rewindRepeatsTheRunExactly() {
        ClosedLoop loop = new ClosedLoop(base().setpoint(SetpointChange.step(0.0, 1.0))
                .sensor(new SensorModel(0.05, 0.0, 1, 0.1, 0.05)).build());
        double[] first = loop.run().measurements();
        loop.rewind();
        assertThat(loop.run().measurements()).containsExactly(first);
        assertThat(loop.step()).as("no samples left").isFalse();
    }
}
