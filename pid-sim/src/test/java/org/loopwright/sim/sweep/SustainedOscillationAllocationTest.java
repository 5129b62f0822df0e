package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.testing.AllocationWindows;

/**
 * The oscillation check can ride along a run's step: one sample allocates nothing once warm, measured
 * with the JVM's per-thread allocation counter over three windows of 1,000,000 samples of an undamped
 * oscillation (a turn every 50 samples), judged by pid-core's {@link AllocationWindows}.
 */
class SustainedOscillationAllocationTest {

    private static final int WINDOW = 1_000_000;

    @Test
    void aSampleAllocatesNothing() {
        SustainedOscillation check = new SustainedOscillation(0.0, 0.1);
        double[] seconds = {0.0};
        Runnable window = () -> {
            for (int i = 0; i < WINDOW; i++) {
                double t = seconds[0];
                check.sample(t, Math.sin(t));
                seconds[0] = t + 2.0 * Math.PI / 100.0;
            }
        };
        window.run();
        long[] allocated = AllocationWindows.measure(window);
        assertThat(check.sustained()).isTrue();
        AllocationWindows.assertNothingAllocated(allocated, "oscillation sample");
    }
}
