package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;

/**
 * A sweep's results are identical, bit for bit, on any number of threads and from one version to the
 * next: 24 runs of the shipped booster pump, seed 42, against {@code reference/sweep-booster-pump-seed42.csv},
 * which is the {@code sweep-runs.csv} that {@code sweep scenarios/booster-pump.yaml --runs 24
 * --spread gain=30%,time-constant=20%,dead-time=40% --seed 42 --threads 1} wrote (Java's shortest exact
 * decimal form, so equal text means equal doubles). A rework of the sweep must keep it; a change
 * that means to alter the figures regenerates it with that command and says why.
 */
class SweepReferenceTest {

    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3})
    void resultsEqualTheCommittedReferenceOnAnyNumberOfThreads(int threads) throws Exception {
        Scenario scenario = ScenarioFile.read(Path.of(SweepReferenceTest.class.getResource(
                "/scenarios/booster-pump.yaml").toURI()));
        SweepResult result = new Sweep(scenario, Spread.parse("gain=30%,time-constant=20%,dead-time=40%"), 42L)
                .run(24, threads, index -> { });
        Path written = Files.createTempFile("sweep", ".csv");
        try {
            SweepFiles.writeCsv(result, written);
            String reference = Files.readString(Path.of(SweepReferenceTest.class.getResource(
                    "/reference/sweep-booster-pump-seed42.csv").toURI()), StandardCharsets.UTF_8);
            assertThat(Files.readString(written, StandardCharsets.UTF_8)).isEqualTo(reference);
        } finally {
            Files.delete(written);
        }
    }
}
