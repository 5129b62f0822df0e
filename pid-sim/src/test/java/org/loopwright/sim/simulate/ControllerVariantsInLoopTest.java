package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.OutputKind;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.nonideal.ActuatorModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

class ControllerVariantsInLoopTest {

    private static final ControllerSettings PID = ControllerSettings.builder().gains(new IdealGains(1.5, 8.0, 1.0))
            .samplePeriodSeconds(0.1).build();

    /**
     * Analytic: the velocity (incremental) form driving an integrating actuator is the position form
     * written as differences (Åström &amp; Hägglund 2006, §3.6), so without limits the loops coincide.
     */
    @Test
    void incrementalControllerOnAnIntegratingActuatorMatchesThePositionForm() {
        Scenario position = Scenario.builder().plant(TransferFunction.fopdt(2.0, 10.0, 1.3)).controller(PID)
                .setpoint(SetpointChange.step(0.0, 1.0)).disturbance(new LoadStep(30.05, -0.5))
                .durationSeconds(60.0).build();
        Scenario incremental = position.withController(PID.toBuilder().outputKind(OutputKind.INCREMENT).build());
        Trajectory a = Simulation.run(position);
        Trajectory b = Simulation.run(incremental);
        for (int k = 1; k < a.length(); k++) {
            assertThat(b.output(k)).as("sample %d", k).isCloseTo(a.output(k), within(1e-9));
            assertThat(b.process(k)).isCloseTo(a.process(k), within(1e-9));
        }
    }

    private static double overshootWithAnActuatorNarrowerThanTheController(WindupProtection windup) {
        ControllerSettings pi = ControllerSettings.builder().gains(IdealGains.pi(4.0, 5.0)).samplePeriodSeconds(0.1)
                .windupProtection(windup).build();
        Scenario s = Scenario.builder().plant(TransferFunction.firstOrder(1.0, 10.0)).controller(pi)
                .actuator(new ActuatorModel(0.0, 1.1, Double.POSITIVE_INFINITY, 0.0))
                .setpoint(SetpointChange.step(0.0, 1.0)).durationSeconds(200.0).build();
        return ResponseMetrics.of(s, Simulation.run(s)).overshootPercent();
    }

    /**
     * Common practice: when the actuator saturates and the controller does not know it, the integral
     * winds up and the response overshoots; tracking the actuator's real position removes most of it.
     */
    @Test
    void actuatorTrackingAntiWindupLowersOvershootAfterSaturation() {
        double woundUp = overshootWithAnActuatorNarrowerThanTheController(WindupProtection.NONE);
        double tracked = overshootWithAnActuatorNarrowerThanTheController(WindupProtection.ACTUATOR_TRACKING);
        assertThat(woundUp).isGreaterThan(5.0);
        assertThat(tracked).isLessThan(woundUp / 2.0);
    }
}
