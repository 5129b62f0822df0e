package org.loopwright.sim.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.plant.TankModel;

class ScenarioTest {

    private static final ControllerSettings PI = ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0))
            .samplePeriodSeconds(0.1).build();

    @Test
    void programmaticScenariosForOtherTools() {
        TransferFunction plant = TransferFunction.fopdt(2.0, 30.0, 5.0);
        Scenario step = Scenario.setpointStep(plant, PI, 50.0, 400.0);
        assertThat(step.linearPlant()).contains(plant);
        assertThat(step.controller()).contains(PI);
        assertThat(step.setpoint()).containsExactly(SetpointChange.step(0.0, 50.0));
        assertThat(step.sampleCount()).isEqualTo(4001);

        ControllerSettings faster = PI.toBuilder().samplePeriodSeconds(0.5).build();
        Scenario retuned = step.withController(faster).withDuration(100.0);
        assertThat(retuned.controller()).contains(faster);
        assertThat(retuned.samplePeriodSeconds()).isEqualTo(0.5);
        assertThat(retuned.sampleCount()).isEqualTo(201);
        assertThat(retuned.setpoint()).isEqualTo(step.setpoint());

        Scenario load = Scenario.loadStep(plant, PI, -5.0, 400.0);
        assertThat(load.disturbances()).containsExactly(new LoadStep(0.0, -5.0));
        assertThat(load.setpoint()).isEmpty();
    }

    @Test
    void profilesAreSortedByTime() {
        Scenario s = Scenario.builder().plant(TransferFunction.firstOrder(1, 1)).controller(PI)
                .setpoint(SetpointChange.step(5, 2), SetpointChange.step(1, 1))
                .disturbance(new LoadStep(9, 1), new LoadStep(3, 2)).durationSeconds(10).build();
        assertThat(s.setpoint()).extracting(SetpointChange::atSeconds).containsExactly(1.0, 5.0);
        assertThat(s.disturbances()).extracting(LoadStep::atSeconds).containsExactly(3.0, 9.0);
    }

    @Test
    void aNonlinearPlantHasNoTransferFunction() {
        Scenario s = Scenario.setpointStep(new TankModel(1, 0.1, 0, 0.1), PI, 1.0, 10.0);
        assertThat(s.linearPlant()).isEmpty();
    }

    @Test
    void exactlyOneControllerIsRequired() {
        assertThatThrownBy(() -> Scenario.builder().plant(TransferFunction.firstOrder(1, 1)).durationSeconds(1).build())
                .hasMessage("a scenario needs exactly one controller, PID or on-off");
        Scenario onOff = Scenario.builder().plant(TransferFunction.firstOrder(1, 1)).controller(PI)
                .onOffController(new OnOffSettings(0, 1, 0, 0, 0, Action.REVERSE), 0.5).durationSeconds(1).build();
        assertThat(onOff.controller()).isEmpty();
        assertThat(onOff.withController(PI).onOffController()).isEmpty();
    }

    @Test
    void jitterMustStayBelowTheSamplePeriod() {
        assertThatThrownBy(() -> Scenario.setpointStep(TransferFunction.firstOrder(1, 1), PI, 1, 1).toBuilder()
                .sensor(new SensorModel(0, 0, 0, 0.1, 0)).build())
                .hasMessage("jitterSeconds must be < the sample period (0.1): jitterSeconds=0.1");
    }

    @Test
    void tooManySamplesAreRefused() {
        assertThatThrownBy(() -> Scenario.setpointStep(TransferFunction.firstOrder(1, 1), PI, 1, 1e6))
                .hasMessage("durationSeconds must give at most 5000000 samples at the sample period 0.1: durationSeconds=1000000.0");
    }
}
