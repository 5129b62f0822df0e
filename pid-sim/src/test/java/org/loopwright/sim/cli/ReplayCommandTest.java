package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;


class ReplayCommandTest {

    /** Ideal PI, Kc = 2, Ti = 10 s, backward-Euler integral, h = 0.5 s. */
    private static final String PI_CONTROLLER = """
            form: ideal
            gain: 2.0
            integral-time: 10.0
            sample-period: 0.5
            integral-method: backward-euler
            """;

    @TempDir
    Path dir;

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int run(String... args) {
        CommandRun run = CommandRun.of(args);
        out.append(run.out());
        err.append(run.err());
        return run.exitCode();
    }

    private Path file(String name, String text) throws IOException {
        return Files.writeString(dir.resolve(name), text);
    }

    private static List<String[]> rows(Path csv) throws IOException {
        return Files.readAllLines(csv).stream().map(line -> line.split(",", -1)).toList();
    }

    @Test
    void constantErrorGivesTheBackwardEulerRamp() throws IOException {
        // e = 1 throughout. Backward Euler adds h·e(k) per sample from the second sample on
        // (Åström & Wittenmark 1997, §8.2; the starting rule), so u(k) = Kc·e + (Kc/Ti)·h·k·e = 2 + 0.1·k.
        Path controller = file("pi.yaml", PI_CONTROLLER);
        Path trace = file("trace.csv", "time,setpoint,measurement,site\n0,1,0,a\n0.5,1,0,b\n1.0,1,0,c\n1.5,1,0,d\n");
        Path result = dir.resolve("out.csv");

        int exit = run("replay", "--controller", controller.toString(), "--trace", trace.toString(),
                "--out", result.toString());

        assertThat(exit).isZero();
        assertThat(err.toString()).isEmpty();
        List<String[]> rows = rows(result);
        assertThat(rows.get(0)).containsExactly("time", "setpoint", "measurement", "site", "output", "proportional",
                "integral", "derivative", "status");
        assertThat(rows).hasSize(5);
        for (int k = 0; k < 4; k++) {
            String[] row = rows.get(k + 1);
            assertThat(row[3]).isEqualTo(String.valueOf((char) ('a' + k)));
            assertThat(Double.parseDouble(row[4])).isCloseTo(2.0 + 0.1 * k, within(1e-12));
            assertThat(Double.parseDouble(row[5])).isEqualTo(2.0);
            assertThat(Double.parseDouble(row[6])).isCloseTo(0.1 * k, within(1e-12));
            assertThat(row[8]).isEqualTo("normal");
        }
        assertThat(out.toString()).isEqualTo("Replayed " + trace + " through " + controller + " (fixed period 0.5 s)\n"
                + "Rows: 4, spanning 1.500 s (first to last time)\n"
                + "Faults: none\n"
                + "Output: min 2.000, max 2.300, mean 2.150\n"
                + "Time in saturation: none possible (no output limits)\n"
                + "Wrote 4 rows to " + result.toAbsolutePath() + "\n");
    }

    @Test
    void measuredPeriodIntegratesOverTheLoggedTimes() throws IOException {
        // With e = 1 the backward-Euler integral is exact: I(k) = (Kc/Ti)·(t(k) − t(0)) = 0.2·(t(k) − t(0))
        // (analytic: the integral of a constant). Without --measured-period every row counts 0.5 s.
        Path controller = file("pi.yaml", PI_CONTROLLER);
        Path trace = file("trace.csv", "time,setpoint,measurement\n10,1,0\n10.25,1,0\n11.5,1,0\n11.6,1,0\n");
        Path result = dir.resolve("out.csv");

        assertThat(run("replay", "--controller", controller.toString(), "--trace", trace.toString(),
                "--out", result.toString(), "--measured-period")).isZero();

        double[] expectedIntegral = {0.0, 0.05, 0.3, 0.32};
        List<String[]> rows = rows(result);
        for (int k = 0; k < 4; k++) {
            assertThat(Double.parseDouble(rows.get(k + 1)[5])).isCloseTo(expectedIntegral[k], within(1e-12));
        }
        assertThat(out.toString()).startsWith("Replayed " + trace + " through " + controller
                + " (measured periods from the time column)\n");
    }

    @Test
    void faultyRowsAreMarkedAndHeldAndTheSummaryCountsThem() throws IOException {
        Path controller = file("pi.yaml", PI_CONTROLLER + "output-min: 0\noutput-max: 2.1\n");
        Path trace = file("trace.csv", "time,setpoint,measurement\n0,1,0\n0.5,1,\n1.0,nan,0\n1.5,1,0\n2.0,1,0\n");
        Path result = dir.resolve("out.csv");

        assertThat(run("replay", "--controller", controller.toString(), "--trace", trace.toString(),
                "--out", result.toString())).isZero();

        List<String[]> rows = rows(result);
        assertThat(rows.stream().skip(1).map(r -> r[7]).toList()).containsExactly("normal", "measurement-not-finite",
                "setpoint-not-finite", "normal", "normal");
        assertThat(rows.get(2)[3]).isEqualTo(rows.get(1)[3]); // held
        assertThat(out.toString()).contains("Faults: 2 rows (setpoint-not-finite 1, measurement-not-finite 1)\n");
    }

    static Stream<Arguments> badInputs() {
        return Stream.of(
                Arguments.of(PI_CONTROLLER.replace("gain: 2.0", "gain: -2.0"), "time,setpoint,measurement\n0,1,0\n",
                        "{controller}:2:1: gain must be finite and >= 0: gain=-2.0"),
                Arguments.of(PI_CONTROLLER + "windup: sometimes\n", "time,setpoint,measurement\n0,1,0\n",
                        "{controller}:6:1: windup must be one of none, clamping, back-calculation, actuator-tracking:"
                                + " windup=sometimes"),
                Arguments.of(PI_CONTROLLER, "time,setpoint,measurement\n0,1,0\n0.5,one,0\n",
                        "{trace}: row 3, column 'setpoint': must be a number, or blank, nan or inf for a bad sample:"
                                + " setpoint=one"),
                Arguments.of(PI_CONTROLLER, "time,measurement\n0,0\n",
                        "{trace}: row 1, column 'setpoint': required column is missing; the header has time,"
                                + " measurement; required columns: time, setpoint, measurement"));
    }

    @ParameterizedTest
    @MethodSource("badInputs")
    void badInputExitsWithTwoAndTheLocatedMessage(String controllerText, String traceText, String message)
            throws IOException {
        Path controller = file("c.yaml", controllerText);
        Path trace = file("t.csv", traceText);
        Path result = dir.resolve("out.csv");

        int exit = run("replay", "--controller", controller.toString(), "--trace", trace.toString(),
                "--out", result.toString());

        assertThat(exit).isEqualTo(2);
        assertThat(err.toString()).isEqualTo(message.replace("{controller}", controller.toString())
                .replace("{trace}", trace.toString()) + "\n");
        assertThat(out.toString()).isEmpty();
        assertThat(result).doesNotExist();
    }

    /** The replay reads, updates and writes in batches on several threads: a bad row far on still leaves no file. */
    @Test
    void aBadRowAfterManyGoodOnesLeavesNoOutput() throws IOException {
        Path controller = file("c.yaml", PI_CONTROLLER);
        StringBuilder text = new StringBuilder("time,setpoint,measurement\n");
        for (int k = 0; k < 20_000; k++) {
            text.append(k * 0.5).append(",1,").append(k == 15_000 ? "x" : "0").append('\n');
        }
        Path trace = file("t.csv", text.toString());
        Path result = dir.resolve("out.csv");

        int exit = run("replay", "--controller", controller.toString(), "--trace", trace.toString(),
                "--out", result.toString());

        assertThat(exit).isEqualTo(2);
        assertThat(err.toString()).isEqualTo(trace + ": row 15002, column 'measurement': must be a number, or blank,"
                + " nan or inf for a bad sample: measurement=x\n");
        try (Stream<Path> files = Files.list(dir)) {
            assertThat(files.map(f -> f.getFileName().toString())).containsExactlyInAnyOrder("c.yaml", "t.csv");
        }
    }

    @Test
    void missingFileExitsWithTwo() throws IOException {
        Path trace = file("t.csv", "time,setpoint,measurement\n0,1,0\n");
        Path nowhere = dir.resolve("nowhere.yaml");
        assertThat(run("replay", "--controller", nowhere.toString(), "--trace", trace.toString())).isEqualTo(2);
        assertThat(err.toString().strip()).isEqualTo(nowhere + ": cannot be read (no such file or directory)");
    }

    @Test
    void unwritableOutputExitsWithTwo() throws IOException {
        Path controller = file("c.yaml", PI_CONTROLLER);
        Path trace = file("t.csv", "time,setpoint,measurement\n0,1,0\n");
        assertThat(run("replay", "--controller", controller.toString(), "--trace", trace.toString(),
                "--out", dir.toString())).isEqualTo(2);
        assertThat(err.toString()).startsWith("--out must name a file, not a directory: --out=" + dir.toAbsolutePath());
    }

    @Test
    void onlyOneOfControllerAndTraceExitsWithTwo() throws IOException {
        Path controller = file("c.yaml", PI_CONTROLLER);
        assertThat(run("replay", "--controller", controller.toString())).isEqualTo(2);
        assertThat(err.toString()).isEqualTo(
                "replay needs both --controller and --trace, or neither for the built-in demo\n");
    }

    @Test
    void unknownOptionExitsWithTwo() {
        assertThat(run("replay", "--trace-file", "x.csv")).isEqualTo(2);
        assertThat(err.toString()).startsWith("Unknown options: '--trace-file', 'x.csv'");
    }

    @Test
    void demoRunsOnTheBundledWaterBath() throws IOException {
        Path result = dir.resolve("demo.csv");

        assertThat(run("replay", "--out", result.toString())).isZero();

        String[] lines = out.toString().split("\n");
        assertThat(lines[0]).isEqualTo("No --controller or --trace given: replaying the built-in demo,"
                + " a water bath heater (invented demo data).");
        assertThat(lines[1]).isEqualTo("Replayed demo/water-bath-trace.csv through demo/water-bath-controller.yaml"
                + " (fixed period 2.0 s)");
        assertThat(lines).contains("Faults: 6 rows (measurement-not-finite 6)",
                "Wrote 901 rows to " + result.toAbsolutePath());
        List<String[]> rows = rows(result);
        assertThat(rows).hasSize(902);
        int modeColumn = 3;
        int outputColumn = 6;
        for (int k = 1; k < rows.size(); k++) {
            String[] row = rows.get(k);
            double output = Double.parseDouble(row[outputColumn]);
            assertThat(output).isBetween(0.0, 100.0);
            if (row[modeColumn].equals("manual")) {
                assertThat(output).isEqualTo(35.0); // the logged manual_output
            } else if (rows.get(k - 1)[modeColumn].equals("manual")) {
                assertThat(output).isEqualTo(35.0); // bumpless: the first auto output equals the last manual one
            }
        }
    }
}
