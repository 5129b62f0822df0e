package org.loopwright.bench;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.PidController;

/**
 * The bare recurrence is a fair limit only if it does the controller's arithmetic: its outputs must
 * match the controller's on the benchmark workload, with limits, slew and back-calculation active.
 */
class BareRecurrenceTest {

    @Test
    void matchesTheFullFeaturedControllerOnTheBenchmarkWorkload() {
        PidController controller = new PidController(Workloads.fullFeatured());
        BareRecurrence bare = new BareRecurrence(Workloads.fullFeatured());
        double[] r = Workloads.setpoints();
        double[] y = Workloads.measurements(3);
        int atLimit = 0;
        int slewing = 0;
        double previous = 0.0;
        for (int k = 0; k < 4 * Workloads.LENGTH; k++) {
            int i = k & Workloads.MASK;
            double expected = controller.update(r[i], y[i]);
            assertThat(bare.update(r[i], y[i])).as("sample %d", k).isCloseTo(expected, within(1e-9));
            atLimit += expected == 0.0 || expected == 100.0 ? 1 : 0;
            slewing += k > 0 && Math.abs(Math.abs(expected - previous) - 10.0) < 1e-9 ? 1 : 0;
            previous = expected;
        }
        // the workload reaches the features the comparison is about
        assertThat(atLimit).isPositive();
        assertThat(slewing).isPositive();
    }
}
