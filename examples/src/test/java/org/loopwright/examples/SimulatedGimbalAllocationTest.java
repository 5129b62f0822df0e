package org.loopwright.examples;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.PidController;
import org.loopwright.pid.testing.AllocationWindows;
import org.loopwright.pid.testing.VirtualClock;

/**
 * The gimbal's callbacks run inside the runner's tick, which must not allocate (the project's
 * hot-path rule): bytes allocated by this thread over windows of many ticks after a warm-up that lets
 * the JIT compile the tick, judged by pid-core's {@link AllocationWindows}.
 */
class SimulatedGimbalAllocationTest {

    private static final int WARM_UP_ROUNDS = 5;
    private static final int TICKS_PER_ROUND = 10_000;
    private static final int MEASURED_TICKS = 15_000;

    private final VirtualClock clock = new VirtualClock(0L);
    private final SimulatedGimbal gimbal = new SimulatedGimbal(GimbalAxis.MOTOR, clock, GimbalAxis.START_DEGREES,
            GimbalAxis.PERIOD_NANOS, 100.0, GimbalAxis.PROFILE_FROM_SECONDS, GimbalAxis.PROFILE_DEGREES);
    private final PidController controller = new PidController(GimbalAxis.settings());
    private final long start = clock.nanoTime();
    private int tick;

    @Test
    void tickCallbacksAllocateNothing() {
        for (int round = 0; round < WARM_UP_ROUNDS; round++) {
            ticks(TICKS_PER_ROUND);
        }
        AllocationWindows.assertNothingAllocated(AllocationWindows.measure(() -> ticks(MEASURED_TICKS)), "tick");
        int total = WARM_UP_ROUNDS * TICKS_PER_ROUND + AllocationWindows.COUNT * MEASURED_TICKS;
        assertThat(gimbal.samples()).isEqualTo(total);
        assertThat(gimbal.periodErrorNanos().getTotalCount()).isEqualTo(total - 1);
    }

    /** Ticks as the runner runs them: wait for the deadline, read the setpoint and measurement, update, write. */
    private void ticks(int count) {
        for (int i = 0; i < count; i++, tick++) {
            long deadline = start + tick * GimbalAxis.PERIOD_NANOS;
            clock.parkNanos(deadline - clock.nanoTime());
            double r = gimbal.setpoint();
            double y = gimbal.readMeasurement();
            gimbal.writeOutput(controller.update(r, y, GimbalAxis.PERIOD_NANOS * 1e-9));
            gimbal.onTick(deadline, deadline, clock.nanoTime(), false);
        }
    }
}
