package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.testing.AllocationWindows;

/** A relay experiment's step allocates nothing, by the three-window rule of {@link AllocationWindows}. */
class RelayAllocationTest {

    private static final double H = RelayExperimentTest.H;

    @Test
    void stepAllocatesNothing() {
        RelaySettings settings = RelayExperimentTest.thirdOrderLagSettings().build();
        int runs = 20 + 3 * 20;
        RelayExperiment[] relays = new RelayExperiment[runs];
        ThirdOrderLag[] plants = new ThirdOrderLag[runs];
        for (int i = 0; i < runs; i++) {
            relays[i] = new RelayExperiment(settings, 0.0);
            plants[i] = new ThirdOrderLag(1.0, H);
        }
        // warm up on the first 20 experiments, then three windows of 20 each
        int[] next = {0};
        long[] samples = {0};
        Runnable twenty = () -> {
            for (int end = next[0] + 20; next[0] < end; next[0]++) {
                samples[0] += drive(relays[next[0]], plants[next[0]]);
            }
        };
        twenty.run();
        samples[0] = 0;
        long[] bytes = AllocationWindows.measure(twenty);

        assertThat(samples[0]).isGreaterThan(3 * 20_000L);
        AllocationWindows.assertNothingAllocated(bytes, "relay step");
    }

    private static long drive(RelayExperiment relay, ThirdOrderLag plant) {
        long samples = 0;
        double output = relay.step(H, plant.output());
        while (!relay.status().finished()) {
            plant.step(output);
            output = relay.step(H, plant.output());
            samples++;
        }
        return samples;
    }
}
