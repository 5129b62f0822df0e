package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.testing.AllocationWindows;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;

/**
 * A sweep run allocates nothing per step after the first run on its thread: one thread's runner runs
 * run 0 whole, then starts run 1 (a plant of other factors, adopted in place), lets it meet its interval
 * lengths (a dead time that is not a whole number of periods gives two per period, each discretised
 * once per run), and the steps after that are measured as the closed-loop allocation test measures
 * them: three windows, judged by pid-core's {@link AllocationWindows}. A step that allocated even one
 * 16-byte object would charge 320 kB to every window.
 */
class SweepRunAllocationTest {

    private static final int WARM_UP = 2_000;
    private static final int WINDOW = 20_000;

    @Test
    void aRunAfterTheFirstOnItsThreadAllocatesNothingPerStep() throws Exception {
        Scenario pump = ScenarioFile.read(Path.of(SweepRunAllocationTest.class.getResource(
                "/scenarios/booster-pump.yaml").toURI()));
        Scenario longPump = pump.toBuilder()
                .durationSeconds((WARM_UP + AllocationWindows.COUNT * WINDOW) * pump.samplePeriodSeconds()).build();
        SweepRunner runner = new Sweep(longPump, Spread.parse("gain=30%,time-constant=20%,dead-time=40%"), 42L)
                .runner();
        runner.run(0);
        runner.begin(1);
        for (int k = 0; k < WARM_UP; k++) {
            runner.step();
        }
        int[] taken = new int[1];
        long[] bytes = AllocationWindows.measure(() -> {
            for (int k = 0; k < WINDOW; k++) {
                taken[0] += runner.step() ? 1 : 0;
            }
        });
        assertThat(taken[0]).isEqualTo(AllocationWindows.COUNT * WINDOW);
        AllocationWindows.assertNothingAllocated(bytes, "sweep step");
        assertThat(runner.end().stability()).isEqualTo(LoopStability.STABLE);
    }
}
