package org.loopwright.bench.suite;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import picocli.CommandLine;

/**
 * The CI smoke run: every JMH benchmark once, in-process, for a very short iteration, and the loop
 * timing for 0.1 s per loop, through the same command as the real suite. It proves the benchmarks
 * and the summary still work, not how fast anything is.
 */
class BenchmarkSuiteSmokeTest {

    /**
     * 3 forms, 3 × 5 discretisations, 3 update variants, the bank, 2 simulation steps, 3 monitor figures,
     * 2 replay figures, 2 × 2 sweeps, the sweep's step and its bare runs on 1 and 2 threads, the sweep's files.
     */
    private static final int BENCHMARK_RUNS = 3 + 15 + 3 + 1 + 2 + 3 + 2 + 4 + 1 + 2 + 1;

    @Test
    void everyBenchmarkAndLoopProducesAFiniteFigure(@TempDir Path out) throws Exception {
        int exit = new CommandLine(new BenchmarkSuite()).execute("--smoke", "--output-dir", out.toString());
        assertThat(exit).isZero();

        JsonNode summary = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertThat(summary.get("mode").asText()).isEqualTo("smoke");
        List<String> names = new ArrayList<>();
        for (JsonNode c : summary.get("benchmarks")) {
            JsonNode figure = c.get("figure");
            names.add(figure.get("name").asText());
            assertThat(figure.get("nsPerOp").isNumber()).as(figure.toString()).isTrue();
            assertThat(figure.get("nsPerOp").asDouble()).as(figure.toString()).isPositive().isFinite();
            assertThat(c.get("ratio").asDouble()).as(c.toString()).isPositive().isFinite();
        }
        assertThat(names).hasSize(BENCHMARK_RUNS).doesNotHaveDuplicates()
                .contains(SuiteSummary.BARE, SuiteSummary.FULL, SuiteSummary.BANK, SuiteSummary.SIMULATION_STEP,
                        "UpdateBenchmark.variablePeriod", "FormBenchmark.update[form=SERIES]",
                        "DiscretisationBenchmark.update[derivativeMethod=RAMP_INVARIANT,integralMethod=TUSTIN]",
                        SuiteSummary.bareRuns(2), "SweepFilesBenchmark.write[runs=10]");

        JsonNode timing = summary.get("timing");
        assertThat(timing).hasSize(8);
        for (JsonNode t : timing) {
            JsonNode result = t.get("result");
            // at least two ticks, so at least one period was measured (a loaded machine may skip many)
            assertThat(result.get("ticks").asLong()).as(result.toString()).isGreaterThanOrEqualTo(2);
            assertThat(result.get("maxNanos").asLong()).as(result.toString())
                    .isGreaterThanOrEqualTo(result.get("p50Nanos").asLong());
            assertThat(result.get("cpuFraction").asDouble()).as(result.toString()).isPositive();
        }
        // four design targets, the loop monitor's, the sweep's marginal step and speed-up, the timed sweep command
        assertThat(summary.get("targets")).hasSize(8);
        assertThat(summary.get("commands")).hasSize(1);
        assertThat(summary.get("commands").get(0).get("exitCode").asInt()).isZero();
        assertThat(Files.readString(out.resolve("summary.md"))).contains("Smoke run", "## Targets", "busy-wait baseline", "runner, park-then-spin",
                "## Command-line runs");
    }
}
