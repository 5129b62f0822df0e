package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.multiloop.ActuatorRange;
import org.loopwright.pid.multiloop.GainSchedule;
import org.loopwright.pid.multiloop.SchedulePoint;
import org.loopwright.pid.multiloop.ScheduleVariable;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.pid.testing.AllocationWindows;
import org.loopwright.sim.nonideal.ActuatorModel;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.MotorOutput;
import org.loopwright.sim.plant.TankModel;
import org.loopwright.sim.plant.ThermalZoneModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.InnerLoop;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.scenario.SplitRangeSpec;

/**
 * The simulation step allocates nothing once warm: measured with the JVM's per-thread allocation
 * counter over three windows of 100,000 steps, judged by pid-core's {@link AllocationWindows}: a step
 * that allocated even one 16-byte object would charge 1.6 MB to every window.
 */
class ClosedLoopAllocationTest {

    private static final int WARM_UP = 100_000;
    private static final int WINDOW = 100_000;
    private static final int WINDOWS = AllocationWindows.COUNT;
    private static final int MEASURED = WINDOW * WINDOWS;

    private static final ControllerSettings PID = ControllerSettings.builder()
            .gains(new IdealGains(1.2, 20.0, 2.0)).samplePeriodSeconds(0.1).outputRange(-50.0, 50.0).build();
    private static final ControllerSettings OUTER = PID.toBuilder().gains(IdealGains.pi(0.5, 40.0))
            .windupProtection(WindupProtection.ACTUATOR_TRACKING).build();

    /** A scenario with every non-ideal part but jitter, setpoint steps and ramps, a load step inside a period. */
    private static Scenario.Builder everything() {
        double duration = (WARM_UP + MEASURED) * 0.1 + 1.0;
        return Scenario.builder().plant(TransferFunction.fopdt(2.0, 30.0, 5.55)).controller(PID)
                .setpoint(SetpointChange.step(0.0, 10.0), new SetpointChange(50.0, 20.0, 30.0))
                .disturbance(new LoadStep(100.03, -3.0))
                .actuator(new ActuatorModel(-40.0, 40.0, 100.0, 0.2))
                .sensor(new SensorModel(0.05, 0.01, 3, 0.0, 0.01))
                .durationSeconds(duration);
    }

    static Stream<Arguments> loops() {
        OnOffSettings thermostat = new OnOffSettings(0.0, 2000.0, 0.5, 20.0, 20.0, Action.REVERSE);
        return Stream.of(
                Arguments.of("fopdt with every non-ideal part", everything().build()),
                Arguments.of("sopdt", everything().plant(TransferFunction.sopdt(1.0, 10.0, 3.0, 1.0)).build()),
                Arguments.of("sopdt without dead time, jittered samples", everything()
                        .plant(TransferFunction.sopdt(1.0, 10.0, 3.0, 0.0))
                        .sensor(new SensorModel(0.05, 0.01, 3, 0.03, 0.01)).build()),
                Arguments.of("thermal zone, on-off", Scenario.builder()
                        .plant(new ThermalZoneModel(21_000.0, 5.0, 20.0, 2_000.0, 1.0))
                        .onOffController(thermostat, 1.0).setpoint(SetpointChange.step(0.0, 60.0))
                        .durationSeconds((WARM_UP + MEASURED) * 1.0 + 1.0).build()),
                Arguments.of("dc motor with friction", everything().plant(new DcMotorModel(2.0, 0.1, 0.1, 0.1, 0.01,
                        0.01, 0.0, 0.04, 0.05, MotorOutput.POSITION, 5e-3)).build()),
                Arguments.of("tank", everything().plant(new TankModel(0.5, 0.01, 0.2, 0.05)).build()),
                Arguments.of("cascade, plants in series", everything().controller(OUTER)
                        .inner(new InnerLoop(PID.toBuilder().samplePeriodSeconds(0.02).build(),
                                TransferFunction.fopdt(1.0, 2.0, 0.1))).build()),
                Arguments.of("tank, gain-scheduled", everything().plant(new TankModel(0.5, 0.01, 0.2, 0.05))
                        .schedule(new GainSchedule(ScheduleVariable.MEASUREMENT, List.of(
                                new SchedulePoint(0.2, IdealGains.pi(0.05, 40.0)),
                                new SchedulePoint(1.0, IdealGains.pi(0.02, 100.0))))).build()),
                Arguments.of("split range", everything().splitRange(new SplitRangeSpec(0.0, 4.0,
                        new ActuatorRange(0.0, 30.0), new ActuatorRange(0.0, 40.0))).build()));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("loops")
    void stepAllocatesNothing(String name, Scenario scenario) {
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long thread = Thread.currentThread().getId();
        ClosedLoop loop = new ClosedLoop(scenario);
        for (int i = 0; i < WARM_UP; i++) {
            loop.step();
        }
        long[] allocated = new long[WINDOWS];
        int taken = 0;
        for (int w = 0; w < WINDOWS; w++) {
            long before = threads.getThreadAllocatedBytes(thread);
            for (int i = 0; i < WINDOW; i++) {
                taken += loop.step() ? 1 : 0;
            }
            allocated[w] = threads.getThreadAllocatedBytes(thread) - before;
        }
        assertThat(taken).isEqualTo(MEASURED);
        AllocationWindows.assertNothingAllocated(allocated, "step");
    }

    /** A benchmark runs the loop for ever by rewinding it: with a deterministic sensor that allocates nothing either. */
    @Test
    void rewindingADeterministicLoopAllocatesNothing() {
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        ClosedLoop loop = new ClosedLoop(everything().sensor(new SensorModel(0.0, 0.01, 2, 0.0, 0.0))
                .durationSeconds(100.0).build());
        for (int i = 0; i < WARM_UP; i++) {
            if (!loop.step()) {
                loop.rewind();
            }
        }
        long before = threads.getThreadAllocatedBytes(Thread.currentThread().getId());
        for (int i = 0; i < MEASURED; i++) {
            if (!loop.step()) {
                loop.rewind();
            }
        }
        assertThat(threads.getThreadAllocatedBytes(Thread.currentThread().getId()) - before).isZero();
    }
}
