package org.loopwright.pid.onoff;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;
import org.loopwright.pid.testing.AllocationWindows;

/** The on-off update allocates nothing, by the three-window rule of {@link AllocationWindows}. */
class OnOffAllocationTest {

    private static final OnOffSettings HEATER = new OnOffSettings(0.0, 2000.0, 1.0, 0.0, 0.0, Action.REVERSE);

    @Test
    void updateAllocatesNothing() {
        OnOffController c = new OnOffController(HEATER);
        double[] sum = {0.0};
        long[] now = {0};
        Runnable updates = () -> {
            for (int i = 0; i < 300_000; i++, now[0]++) {
                sum[0] += c.update(60.0, 60.0 + Math.sin(now[0] * 0.01), now[0]);
            }
        };
        updates.run();
        long[] bytes = AllocationWindows.measure(updates);
        assertThat(sum[0]).isPositive();
        AllocationWindows.assertNothingAllocated(bytes, "update");
    }
}
