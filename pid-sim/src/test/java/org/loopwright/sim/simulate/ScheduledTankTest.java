package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.multiloop.GainSchedule;
import org.loopwright.pid.multiloop.SchedulePoint;
import org.loopwright.pid.multiloop.ScheduleVariable;
import org.loopwright.sim.plant.TankModel;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

/**
 * Gain scheduling on a tank whose gain varies with its level: A·dh/dt = q − k·√h linearises at a
 * level h to K/(T·s + 1) with K = 2·√h/k and T = 2·A·√h/k (Torricelli's outlet, a textbook
 * linearisation done here by hand). A PI controller with Ti = T closes to a first-order loop with
 * time constant T/(Kc·K) = A/Kc and no overshoot (pole-zero cancellation; Åström &amp; Murray 2021,
 * ch. 11), at every level, if Ti follows T: that is the schedule. A fixed tuning with Ti set for the
 * lowest level has Ti well below T higher up, and overshoots there.
 */
class ScheduledTankTest {

    private static final double AREA = 0.5;
    private static final double OUTLET = 0.01;
    private static final double GAIN = AREA / 20.0; // A/Kc = 20 s at every level
    private static final double[] LEVELS = {0.3, 0.9, 1.5};
    private static final double STEP = 0.1;

    private static double timeConstant(double level) {
        return 2.0 * AREA * Math.sqrt(level) / OUTLET;
    }

    private static ControllerSettings pi(double integralTime) {
        return ControllerSettings.builder().gains(IdealGains.pi(GAIN, integralTime)).samplePeriodSeconds(1.0)
                .outputRange(0.0, 0.03).build();
    }

    /** Overshoot, as a fraction of the step, of a +0.1 m setpoint step from a settled level. */
    private static double overshoot(double level, GainSchedule schedule, double fixedIntegralTime) {
        Scenario s = Scenario.builder().plant(new TankModel(AREA, OUTLET, level, 0.1))
                .controller(pi(fixedIntegralTime)).schedule(schedule)
                .setpoint(SetpointChange.step(0.0, level), SetpointChange.step(1500.0, level + STEP))
                .durationSeconds(2500.0).build();
        Trajectory t = Simulation.run(s);
        double peak = Double.NEGATIVE_INFINITY;
        for (int k = 1500; k < t.length(); k++) {
            peak = Math.max(peak, t.process(k));
        }
        return Math.max(0.0, peak - (level + STEP)) / STEP;
    }

    @Test
    void scheduledLoopKeepsItsOvershootInABandWhereAFixedTuningDoesNot() {
        GainSchedule schedule = new GainSchedule(ScheduleVariable.MEASUREMENT, List.of(
                new SchedulePoint(0.2, IdealGains.pi(GAIN, timeConstant(0.2))),
                new SchedulePoint(1.0, IdealGains.pi(GAIN, timeConstant(1.0))),
                new SchedulePoint(1.8, IdealGains.pi(GAIN, timeConstant(1.8)))));
        double lowest = timeConstant(LEVELS[0]);
        // the band: at most 2 % of the step (the linearised loop has none; the level's nonlinearity
        // over a 0.1 m step and sampling add a little). Seen: scheduled 1.4 %, 0.3 %, 0.1 %;
        // fixed 0.5 %, 5.6 %, 7.8 % at 0.3, 0.9 and 1.5 m.
        double band = 0.02;
        for (double level : LEVELS) {
            assertThat(overshoot(level, schedule, lowest)).as("scheduled at %f m", level).isBetween(0.0, band);
        }
        assertThat(overshoot(LEVELS[0], null, lowest)).as("fixed at the level it was tuned for").isLessThan(band);
        assertThat(overshoot(LEVELS[2], null, lowest)).as("fixed at the top").isGreaterThan(2.5 * band);
    }
}
