package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.sim.metrics.LimitCycle;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.MotorOutput;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

/** Facts of the trade, each marked common practice: what every control engineer expects to see. */
class CommonPracticeTest {

    private static LimitCycle onOffCycle(double hysteresis, double deadTime) {
        OnOffSettings thermostat = new OnOffSettings(0.0, 1.0, hysteresis, 0.0, 0.0, Action.REVERSE);
        Scenario s = Scenario.builder().plant(TransferFunction.fopdt(100.0, 50.0, deadTime))
                .onOffController(thermostat, 0.05).setpoint(SetpointChange.step(0.0, 50.0))
                .durationSeconds(600.0).build();
        return LimitCycle.of(Simulation.run(s), 200.0).orElseThrow();
    }

    /** Common practice: on-off control hunts around the setpoint; the cycle grows with the hysteresis. */
    @Test
    void onOffLimitCycleGrowsWithHysteresis() {
        LimitCycle narrow = onOffCycle(0.5, 2.0);
        LimitCycle wide = onOffCycle(4.0, 2.0);
        assertThat(narrow.amplitude()).isPositive();
        assertThat(wide.amplitude()).isGreaterThan(narrow.amplitude() * 1.2);
        assertThat(wide.periodSeconds()).isGreaterThan(narrow.periodSeconds());
    }

    /** Common practice: the on-off cycle grows with the dead time. */
    @Test
    void onOffLimitCycleGrowsWithDeadTime() {
        LimitCycle short_ = onOffCycle(1.0, 1.0);
        LimitCycle long_ = onOffCycle(1.0, 4.0);
        assertThat(long_.amplitude()).isGreaterThan(short_.amplitude() * 1.5);
        assertThat(long_.periodSeconds()).isGreaterThan(short_.periodSeconds());
    }

    private static double finalPositionError(double integralTime) {
        DcMotorModel axis = new DcMotorModel(2.0, 0.01, 0.1, 0.1, 0.01, 0.01, 0.0, 0.05, 0.05, MotorOutput.POSITION,
                1e-3);
        ControllerSettings settings = ControllerSettings.builder().gains(IdealGains.pi(2.0, integralTime))
                .samplePeriodSeconds(0.01).outputRange(-12.0, 12.0).build();
        Scenario s = Scenario.setpointStep(axis, settings, 1.0, 60.0);
        Trajectory t = Simulation.run(s);
        return Math.abs(t.setpoint(t.length() - 1) - t.process(t.length() - 1));
    }

    /**
     * Common practice: with static friction, P control alone stops short of a position target (the
     * drive Kp·e·Kt/R falls below the breakaway torque before e reaches 0), and integral action
     * removes the error. (Here the breakaway torque equals the Coulomb torque; with breakaway above
     * Coulomb, integral action is known to hunt in a stick–slip cycle instead.)
     */
    @Test
    void withStaticFrictionProportionalStopsShortAndIntegralRemovesTheError() {
        double proportionalOnly = finalPositionError(Double.POSITIVE_INFINITY);
        double withIntegral = finalPositionError(5.0);
        // P alone: it sticks where Kp·e·Kt/R ≤ Ts, i.e. anywhere up to e = Ts·R/(Kt·Kp) = 0.5 rad
        assertThat(proportionalOnly).isGreaterThan(0.1).isLessThanOrEqualTo(0.5);
        assertThat(withIntegral).isLessThan(0.01);
    }

    private static double overshoot(IdealGains gains) {
        ControllerSettings settings = ControllerSettings.builder().gains(gains).samplePeriodSeconds(0.05).build();
        Scenario s = Scenario.setpointStep(TransferFunction.sopdt(1.0, 10.0, 3.0, 0.0), settings, 1.0, 150.0);
        return ResponseMetrics.of(s, Simulation.run(s)).overshootPercent();
    }

    /** Common practice: on a second-order plant, raising the proportional gain raises the overshoot. */
    @Test
    void higherProportionalGainRaisesOvershoot() {
        double low = overshoot(IdealGains.pi(2.0, 12.0));
        double high = overshoot(IdealGains.pi(6.0, 12.0));
        assertThat(high).isGreaterThan(low + 5.0);
    }

    /** Common practice: derivative action damps the loop and lowers the overshoot. */
    @Test
    void derivativeActionLowersOvershoot() {
        double withoutDerivative = overshoot(new IdealGains(6.0, 12.0, 0.0));
        double withDerivative = overshoot(new IdealGains(6.0, 12.0, 2.0));
        assertThat(withDerivative).isLessThan(withoutDerivative - 5.0);
    }
}
