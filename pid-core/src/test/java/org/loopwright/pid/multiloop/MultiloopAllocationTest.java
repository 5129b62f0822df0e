package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import java.util.List;
import java.util.function.IntToDoubleFunction;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.testing.AllocationWindows;

/**
 * The cascade, scheduled and split-range updates allocate nothing once warm: bytes charged to this
 * thread over three windows of 100,000 updates ({@link com.sun.management.ThreadMXBean}), judged by
 * {@link AllocationWindows}: an update that allocated one 16-byte object would charge 1.6 MB to every
 * window.
 */
class MultiloopAllocationTest {

    private static final int WINDOW = 100_000;
    private static final int WINDOWS = AllocationWindows.COUNT;

    private static void assertAllocatesNothing(IntToDoubleFunction update) {
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long thread = Thread.currentThread().getId();
        double sink = 0.0;
        for (int k = 0; k < 200_000; k++) {
            sink += update.applyAsDouble(k);
        }
        long[] allocated = new long[WINDOWS];
        for (int w = 0; w < WINDOWS; w++) {
            long before = threads.getThreadAllocatedBytes(thread);
            for (int k = 0; k < WINDOW; k++) {
                sink += update.applyAsDouble(k);
            }
            allocated[w] = threads.getThreadAllocatedBytes(thread) - before;
        }
        assertThat(sink).isFinite();
        AllocationWindows.assertNothingAllocated(allocated, "update");
    }

    @Test
    void cascadeUpdateAllocatesNothing() {
        PidController outer = new PidController(ControllerSettings.builder().gains(new IdealGains(1.0, 10.0, 1.0))
                .samplePeriodSeconds(0.04).outputRange(-3.0, 3.0).windupProtection(WindupProtection.ACTUATOR_TRACKING)
                .build());
        PidController inner = new PidController(ControllerSettings.builder().gains(IdealGains.pi(4.0, 1.0))
                .samplePeriodSeconds(0.01).outputRange(-1.0, 1.0).build());
        Cascade c = new Cascade(outer, inner);
        // every mode switch, saturation and a local setpoint move run inside the windows
        assertAllocatesNothing(k -> {
            int phase = k % 5000;
            if (phase == 1000) {
                c.switchToLocal();
                c.localSetpoint(0.5);
            } else if (phase == 2000) {
                c.switchToCascade();
            } else if (phase == 3000) {
                inner.switchToManual();
            } else if (phase == 3500) {
                inner.switchToAutomatic();
            }
            double r = (k / 2500) % 2 == 0 ? 2.0 : -2.0;
            return c.update(r, 0.5 * Math.sin(k * 1e-3), Math.sin(k * 3e-3));
        });
    }

    @Test
    void scheduledUpdateAllocatesNothingWhileCrossingTheTable() {
        ScheduledController c = new ScheduledController(ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0))
                .samplePeriodSeconds(0.1).outputRange(0.0, 100.0).build(),
                new GainSchedule(ScheduleVariable.MEASUREMENT, List.of(
                        new SchedulePoint(20.0, new IdealGains(2.0, 30.0, 2.0)),
                        new SchedulePoint(50.0, IdealGains.pi(1.2, 40.0)),
                        new SchedulePoint(80.0, IdealGains.pi(0.8, 45.0)))));
        assertAllocatesNothing(k -> c.update(50.0, 50.0 + 45.0 * Math.sin(k * 1e-3)));
    }

    @Test
    void splitRangeAllocatesNothing() {
        SplitRange s = new SplitRange(ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0))
                .samplePeriodSeconds(1.0).outputRange(0.0, 100.0).build(), 50.0, 4.0,
                new ActuatorRange(0.0, 100.0), new ActuatorRange(0.0, 2000.0));
        assertAllocatesNothing(k -> {
            double u = 50.0 + 60.0 * Math.sin(k * 1e-3);
            return s.first(u) + s.second(u) + s.outputFor(s.first(u), s.second(u));
        });
    }
}
