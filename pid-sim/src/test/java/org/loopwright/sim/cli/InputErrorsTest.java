package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Bad input takes one path to exit code 2, in the words of the options and files (never a Java
 * exception's or field's name), with bounded work and no half-written output (issue 10, items 9–12).
 * What counts as a clear message is common practice: the option or file, the value, what is allowed.
 */
class InputErrorsTest {

    private static final String THIRD_ORDER_P = FrequencyCommandsTest.scenario("third-order-p.yaml");

    @ParameterizedTest
    @ValueSource(strings = {"simulate", "compare"})
    void anOutputDirectoryThatCannotBeCreatedIsBadInputNamingTheOption(String command) {
        CommandRun run = CommandRun.of(command, THIRD_ORDER_P, "--out", "/proc/nope");
        assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
        assertThat(run.err()).contains("/proc/nope").doesNotContain("please report", "\tat ");
    }

    @Test
    void aMissingOrDirectoryScenarioIsNamedInWords(@TempDir Path dir) {
        CommandRun missing = CommandRun.of("margins", dir.resolve("none.yaml").toString());
        assertThat(missing.exitCode()).isEqualTo(2);
        assertThat(missing.err()).contains("none.yaml: cannot be read (no such file or directory)")
                .doesNotContain("Exception");
        CommandRun directory = CommandRun.of("simulate", dir.toString(), "--out", dir.resolve("o").toString());
        assertThat(directory.exitCode()).isEqualTo(2);
        assertThat(directory.err()).contains("cannot be read (is a directory)").doesNotContain("Exception");
    }

    @Test
    void relayOptionsAreNamedAsTyped() {
        CommandRun run = CommandRun.of("autotune", THIRD_ORDER_P, "--relay-amplitude", "-1");
        assertThat(run.exitCode()).as(run.out()).isEqualTo(2);
        assertThat(run.err()).startsWith("--relay-amplitude ").contains("--relay-amplitude=-1")
                .doesNotContain("relayAmplitude");
    }

    @Test
    void comparePeriodsThatWouldExceedTheWorkLimitAreRefusedAtOnce() {
        // 20 s at h = 1e-7 s would be 2e8 samples a run, beyond the study's limit of 1e6
        CommandRun run = CommandRun.of("compare", THIRD_ORDER_P, "--periods", "1e-7");
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).startsWith("--periods must each give at most 1000000 samples").contains("--periods=1.0E-7");
    }

    @Test
    void aStageClosedWithoutCommitLeavesNothingBehind(@TempDir Path dir) throws IOException {
        Path out = dir.resolve("out");
        try (OutputStage stage = OutputStage.in(out, "--out")) {
            Files.writeString(stage.directory().resolve("half.csv"), "time,output\n0,");
        }
        try (Stream<Path> left = Files.list(out)) {
            assertThat(left).isEmpty();
        }
        try (OutputStage stage = OutputStage.in(out, "--out")) {
            Files.writeString(stage.directory().resolve("whole.csv"), "time\n0\n");
            stage.commit();
        }
        try (Stream<Path> left = Files.list(out)) {
            assertThat(left.map(p -> p.getFileName().toString())).containsExactly("whole.csv");
        }
    }

    /** The growing loop of ResponseMetricsTest (e(k) = (−1.5)^k): it diverges and says so; its files stay finite. */
    @Test
    void aDivergingSimulationIsNamedAndItsFilesHoldOnlyFiniteNumbers(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("diverging.yaml");
        Files.writeString(file, """
                controller: {form: parallel, proportional-gain: 25.0, sample-period: 0.1}
                plant: {type: integrating, gain: 1.0}
                setpoint: [{at: 0, value: 1.0}]
                duration: 100
                """);
        CommandRun run = CommandRun.of("simulate", file.toString(), "--out", dir.resolve("out").toString());
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.err()).contains("DIVERGED");
        // the verdict row, and no figure that assumes a settled loop
        assertThat(run.out()).containsPattern("response +DIVERGED\\n").containsPattern("settling time \\(2 %\\) +DIVERGED")
                .containsPattern("IAE +DIVERGED\\n");
        String csv = Files.readString(dir.resolve("out/trajectory.csv"));
        assertThat(csv).doesNotContain("Infinity", "NaN", "E307");
    }

    @Test
    void aModelWhoseCheckWouldNotFitTheWorkLimitIsRefusedAtOnce() {
        // T = 1e-300 s beside L = 1 s: the check at h = T/20 over 20·(T + L) would be 4e302 samples a run
        CommandRun run = CommandRun.of("tune", "--process-gain", "1e300", "--time-constant", "1e-300",
                "--dead-time", "1");
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).startsWith("the model's time constants, --dead-time and --sample-period must keep the"
                + " check by simulation within 1000000 samples a run").doesNotContain("Exception");
    }
}
