package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.sim.sweep.SweepFiles;

class SweepCommandTest {

    /** P control, loop gain 8 ± 50 % on 1/(s+1)³: unstable beyond 8 (Routh–Hurwitz; see SweepTest). */
    private static final String THIRD_ORDER_P = """
            controller: {form: parallel, proportional-gain: 1.0, sample-period: 0.002}
            plant: {type: transfer-function, numerator: [8.0], denominator: [1.0, 3.0, 3.0, 1.0]}
            setpoint: [{at: 0, value: 1.0}]
            duration: 20
            """;

    private static Path scenario(Path dir, String text) throws IOException {
        Path file = dir.resolve("third-order.yaml");
        Files.writeString(file, text);
        return file;
    }

    @Test
    void jsonSummaryAgreesWithTheCsvAndTheAnalyticBoundary(@TempDir Path dir) throws IOException {
        Path file = scenario(dir, THIRD_ORDER_P);
        Path out = dir.resolve("out");
        CommandRun run = CommandRun.of("sweep", file.toString(), "--runs", "40", "--spread", "gain=50%",
                "--seed", "5", "--threads", "2", "--out", out.toString(), "--json");

        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.err()).as("no progress bar with --json").isEmpty();
        JsonNode json = new ObjectMapper().readTree(run.out());
        assertThat(json.get("runs").asInt()).isEqualTo(40);
        assertThat(json.get("distribution").asText()).isEqualTo("uniform");
        assertThat(json.get("spread").get("gain").asDouble()).isEqualTo(0.5);

        List<CSVRecord> rows;
        try (var reader = Files.newBufferedReader(out.resolve(SweepFiles.CSV))) {
            rows = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get().parse(reader).getRecords();
        }
        assertThat(rows).hasSize(40);
        assertThat(rows.get(0).getParser().getHeaderNames()).isEqualTo(SweepFiles.HEADER);
        long beyondBoundary = 0;
        for (CSVRecord row : rows) {
            double loopGain = Double.parseDouble(row.get("numerator")); // Kc = 1, so the numerator is the loop gain
            assertThat(Math.abs(loopGain - 8.0)).as("no run on the boundary").isGreaterThan(0.05);
            beyondBoundary += loopGain > 8.0 ? 1 : 0;
            assertThat(row.get("stability")).isEqualTo(loopGain > 8.0 ? "unstable" : "stable");
        }
        assertThat(beyondBoundary).isBetween(5L, 35L);
        assertThat(json.get("unstable_share").asDouble()).isEqualTo(beyondBoundary / 40.0);
        assertThat(json.get("worst_run").get("stability").asText()).isEqualTo("unstable");
        assertThat(json.get("nominal_run").get("gain_factor").asDouble()).isEqualTo(1.0);
        // overshoot is a step figure: only the runs that settled have one (issue 10: no figure without settling)
        long settled = rows.stream().filter(r -> !r.get("settling_time").isEmpty()).count();
        assertThat(json.get("overshoot_percent").get("count").asLong()).isEqualTo(settled);
        assertThat(rows.stream().filter(r -> !r.get("overshoot_percent").isEmpty()).count()).isEqualTo(settled);
        assertThat(Files.size(out.resolve("sweep-measurements.png"))).isPositive();
        assertThat(Files.readString(out.resolve("sweep-measurements.svg"))).contains("<svg");
        assertThat(Files.readString(out.resolve("report.html"))).contains("data:image/png;base64,");
    }

    @Test
    void tableNamesTheShareOfUnstableRunsAndTheWorstRun(@TempDir Path dir) throws IOException {
        Path file = scenario(dir, THIRD_ORDER_P);
        CommandRun run = CommandRun.of("sweep", file.toString(), "--runs", "8", "--spread", "gain=50%", "--seed", "5",
                "--out", dir.resolve("out").toString(), "--no-progress");
        assertThat(run.exitCode()).as(run.err()).isZero();
        // the scenario names no units: IAE in the word PV, as simulate's table says it
        assertThat(run.out()).contains("8 runs, seed 5").contains("unstable: ").contains("overshoot (%)")
                .contains("settling time (2 %, s)").contains("IAE (PV·s)").contains("time saturated (%)")
                .containsPattern("worst run #\\d+: unstable; gain x").contains("gain ±50% of the nominal")
                .contains("nominal plant: unstable"); // K = 8 is on the continuous boundary, beyond the sampled one
        assertThat(run.err()).isEmpty();
    }

    /** The worst and nominal lines give IAE in the scenario's process unit, as the distribution table does. */
    @ParameterizedTest
    @MethodSource("unitsAndIaeUnits")
    void theSummaryLinesGiveIaeWithItsUnit(String units, String iaeUnit, @TempDir Path dir) throws IOException {
        // loop gain 2 on 1/(s+1)³: stable (Routh–Hurwitz: below 8), so every run has an IAE
        Path file = scenario(dir, THIRD_ORDER_P.replace("[8.0]", "[2.0]") + units);
        CommandRun run = CommandRun.of("sweep", file.toString(), "--runs", "2", "--spread", "gain=10%",
                "--out", dir.resolve("out").toString(), "--no-progress");

        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("IAE (" + iaeUnit + ")")
                .containsPattern("worst run #\\d+: .*, IAE [0-9.e+-]+ " + iaeUnit + "\n")
                .containsPattern("nominal plant: .*, IAE [0-9.e+-]+ " + iaeUnit + "\n");
    }

    static Stream<Arguments> unitsAndIaeUnits() {
        return Stream.of(Arguments.of("", "PV·s"), Arguments.of("units: {process: \"bar\", output: \"%\"}\n", "bar·s"));
    }

    /**
     * P control (K = 25) of an integrator with h = 0.1 s: e(k+1) = (1 − g·K·h)·e(k) with the plant gain
     * g within ±10 % of 1, so the factor is from −1.75 to −1.25 (analytic solution of the difference
     * equation): every run grows until it passes the divergence bound. The header's count of unstable
     * runs includes them, as the unstable share does.
     */
    @Test
    void theHeaderCountsDivergedRunsAsUnstable(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("diverging.yaml");
        Files.writeString(file, """
                controller: {form: parallel, proportional-gain: 25.0, sample-period: 0.1}
                plant: {type: integrating, gain: 1.0}
                setpoint: [{at: 0, value: 1.0}]
                duration: 100
                """);
        CommandRun run = CommandRun.of("sweep", file.toString(), "--runs", "4", "--spread", "gain=10%", "--seed", "1",
                "--out", dir.resolve("out").toString(), "--no-progress");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).containsPattern("unstable: [^(]*\\(4 of 4, ").contains("4 diverged and were stopped");
    }

    static Stream<Arguments> badInput() {
        return Stream.of(
                Arguments.of(List.of("--spread", "gain=20"),
                        "--spread gain must be a percentage from 0% to below 100%: gain=20"),
                Arguments.of(List.of("--spread", "lag=20%"),
                        "--spread key lag is not a parameter of plant type transfer-function: use gain,"
                                + " time-constant or dead-time"),
                Arguments.of(List.of("--runs", "0"), "--runs must be from 1 to 10000: --runs=0"),
                Arguments.of(List.of("--threads", "0"), "--threads must be from 1 to 256: --threads=0"));
    }

    @ParameterizedTest
    @MethodSource("badInput")
    void badOptionsExitWithTwoAndSayWhatIsAllowed(List<String> options, String message, @TempDir Path dir)
            throws IOException {
        Path file = scenario(dir, THIRD_ORDER_P);
        String[] args = Stream.concat(Stream.of("sweep", file.toString(), "--out", dir.toString()), options.stream())
                .toArray(String[]::new);
        CommandRun run = CommandRun.of(args);
        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err().trim()).isEqualTo(message);
        assertThat(run.out()).isEmpty();
    }

    static Stream<Arguments> badNonlinearSpreads() {
        return Stream.of(
                Arguments.of(List.of(), "--spread is needed for plant type tank (no default: name the parameters that"
                        + " are uncertain), keys area, outlet-coefficient, initial-level"),
                Arguments.of(List.of("--spread", "outflow-coefficient=20%"), "--spread key outflow-coefficient is not a"
                        + " parameter of plant type tank: use area, outlet-coefficient or initial-level"),
                Arguments.of(List.of("--spread", "gain=20%"), "--spread key gain is not a parameter of plant type"
                        + " tank: use area, outlet-coefficient or initial-level"));
    }

    @ParameterizedTest
    @MethodSource("badNonlinearSpreads")
    void aNonlinearPlantsSpreadNamesTheKeyThePlantTypeAndItsKeys(List<String> options, String message,
            @TempDir Path dir) throws Exception {
        String tank = Path.of(SweepCommandTest.class.getResource("/scenarios/tank.yaml").toURI()).toString();
        String[] args = Stream.concat(Stream.of("sweep", tank, "--out", dir.resolve("out").toString()),
                options.stream()).toArray(String[]::new);
        CommandRun run = CommandRun.of(args);
        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err().trim()).isEqualTo(message);
        assertThat(dir.resolve("out")).doesNotExist();
    }

    @Test
    void aNonlinearPlantIsSweptByItsFileKeysAndJudgedBySimulation(@TempDir Path dir) throws Exception {
        String tank = Path.of(SweepCommandTest.class.getResource("/scenarios/tank.yaml").toURI()).toString();
        Path out = dir.resolve("out");
        CommandRun run = CommandRun.of("sweep", tank, "--runs", "6", "--spread", "outlet-coefficient=20%,area=10%",
                "--seed", "2", "--threads", "2", "--out", out.toString(), "--no-progress");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("outlet-coefficient ±20%, area ±10% of the nominal")
                .contains("Stability judged by simulation (nonlinear plant, no poles)")
                .contains("nominal plant: stable; area x1.000 = 0.5000, outlet-coefficient x1.000 = 0.01000; decay ratio n/a");
        List<CSVRecord> rows;
        try (var reader = Files.newBufferedReader(out.resolve(SweepFiles.CSV))) {
            rows = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get().parse(reader).getRecords();
        }
        assertThat(rows.get(0).getParser().getHeaderNames()).containsSubsequence("run", "area_factor",
                "outlet_coefficient_factor", "initial_level_factor", "area", "outlet_coefficient", "initial_level",
                "stability", "decay_ratio", "rise_time");
        for (CSVRecord row : rows) {
            // the drawn value is the file's nominal value times the factor (tank.yaml: outlet-coefficient 0.01)
            assertThat(Double.parseDouble(row.get("outlet_coefficient")))
                    .isEqualTo(0.01 * Double.parseDouble(row.get("outlet_coefficient_factor")));
            assertThat(Double.parseDouble(row.get("outlet_coefficient_factor"))).isBetween(0.8, 1.2);
            assertThat(row.get("initial_level_factor")).isEqualTo("1.0");
        }
        CommandRun help = CommandRun.of("sweep", "--help");
        assertThat(help.out()).contains("tank: area, outlet-coefficient, initial-level")
                .contains("nonlinear plant: the simulation alone");
    }

    @Test
    void progressBarCountsEveryRun() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (SweepProgress progress = SweepProgress.on(new PrintStream(bytes, true, StandardCharsets.UTF_8), 25)) {
            for (int i = 0; i < 25; i++) {
                progress.accept(i);
            }
        }
        assertThat(bytes.toString(StandardCharsets.UTF_8)).contains("sweep").contains("100%").contains("25/25");
        ByteArrayOutputStream none = new ByteArrayOutputStream();
        try (SweepProgress off = SweepProgress.off()) {
            off.accept(0);
        }
        assertThat(none.size()).isZero();
    }
}
