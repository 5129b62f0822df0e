package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.InnerLoop;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

/**
 * A sweep of a cascade judges the outer loop with the inner loop closed (the spread acts on the
 * outer plant): a sound cascade stays stable across the spread, and one whose inner loop is
 * unstable on its own is unstable in every run (common practice: an outer loop cannot save an
 * unstable inner loop).
 */
class CascadeSweepTest {

    private static Scenario cascade(double innerGain) {
        ControllerSettings outer = ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0))
                .samplePeriodSeconds(0.1).windupProtection(WindupProtection.ACTUATOR_TRACKING).build();
        ControllerSettings inner = ControllerSettings.builder().gains(IdealGains.pi(innerGain, Double.POSITIVE_INFINITY))
                .samplePeriodSeconds(0.02).build();
        return Scenario.builder().controller(outer)
                .inner(new InnerLoop(inner, new TransferFunction(new double[] {1}, new double[] {1, 3, 3, 1}, 0.0)))
                .plant(TransferFunction.fopdt(1.0, 10.0, 0.5)).setpoint(SetpointChange.step(0.0, 1.0))
                .durationSeconds(60.0).build();
    }

    @Test
    void soundCascadeIsStableAcrossTheSpreadAndAnUnstableInnerLoopIsNot() {
        Spread spread = Spread.parse("gain=20%,time-constant=20%,dead-time=20%");
        SweepResult sound = new Sweep(cascade(2.0), spread, 1L).run(8, 1, i -> { });
        assertThat(sound.unstableShare()).isZero();
        // 1/(s+1)³ has ultimate gain 8 (the classic anchor of the design notes): P control of gain 10
        // makes the inner loop unstable, and with it every run of the cascade
        SweepResult unstable = new Sweep(cascade(10.0), spread, 1L).run(8, 1, i -> { });
        assertThat(unstable.unstableShare()).isEqualTo(1.0);
        assertThat(unstable.nominal().stability()).isEqualTo(LoopStability.UNSTABLE);
    }
}
