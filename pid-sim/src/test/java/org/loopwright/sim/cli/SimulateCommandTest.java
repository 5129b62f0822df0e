package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopwright.sim.metrics.ResponseMetrics;

class SimulateCommandTest {

    private final StringWriter out = new StringWriter();
    private final StringWriter err = new StringWriter();

    private int run(String... args) {
        CommandRun run = CommandRun.of(args);
        out.append(run.out());
        err.append(run.err());
        return run.exitCode();
    }

    @Test
    void demoRunsSaysSoAndWritesTheReports(@TempDir Path dir) throws IOException {
        int code = run("simulate", "--out", dir.toString(), "--json");
        assertThat(code).isZero();
        assertThat(err.toString()).contains("built-in water-bath demo").contains("our own invention");
        JsonNode metrics = new ObjectMapper().readTree(out.toString());
        assertThat(metrics.fieldNames()).toIterable().contains("rise_time", "settling_time", "overshoot_percent",
                "peak_time", "steady_state_error", "iae", "ise", "itae", "total_variation", "saturated_fraction");
        assertThat(metrics.get("rise_time").isNumber()).isTrue();
        assertThat(metrics.get("iae").isNumber()).isTrue();
        assertThat(metrics.get("limit_cycle_amplitude").isNull()).as("a PID loop has no limit cycle").isTrue();
        List<String> csv = Files.readAllLines(dir.resolve("trajectory.csv"));
        assertThat(csv.get(0)).isEqualTo("time,setpoint,measurement,output,disturbance");
        assertThat(csv).hasSize(7201 + 1);
        assertThat(Files.size(dir.resolve("response.png"))).isPositive();
        assertThat(Files.readString(dir.resolve("response.svg"))).contains("<svg");
        // written into a staging folder, then moved: nothing of the stage is left
        try (Stream<Path> files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString())).noneMatch(name -> name.startsWith(".loopwright"));
        }
    }

    /**
     * P control (K = 19.9) of an integrator y(k+1) = y(k) + h·u(k) with h = 0.1 s: the error obeys
     * e(k+1) = (1 − K·h)·e(k) = −0.99·e(k) (analytic solution of the difference equation), so after
     * 10 s the output still swings by 0.99^100 ≈ 37 % of the step around the setpoint: not settled,
     * not diverged. The verdict says so and no settling time, overshoot or steady-state error is given,
     * in the table or in JSON.
     */
    @Test
    void aRingingResponseSaysNotSettledInsteadOfStepFigures(@TempDir Path dir) throws IOException {
        Path scenario = dir.resolve("ringing.yaml");
        Files.writeString(scenario, """
                controller: {form: parallel, proportional-gain: 19.9, sample-period: 0.1}
                plant: {type: integrating, gain: 1.0}
                setpoint: [{at: 0, value: 1.0}]
                duration: 10
                """);
        assertThat(run("simulate", scenario.toString(), "--out", dir.resolve("t").toString())).as(err.toString()).isZero();
        assertThat(out.toString()).containsPattern("response +not settled\\n")
                .containsPattern("settling time \\(2 %\\) +not settled\\n").containsPattern("overshoot +not settled\\n")
                .as("no unit beside a missing figure").containsPattern("steady-state error +not settled\\n");
        out.getBuffer().setLength(0);
        assertThat(run("simulate", scenario.toString(), "--out", dir.resolve("j").toString(), "--json")).isZero();
        JsonNode metrics = new ObjectMapper().readTree(out.toString());
        assertThat(metrics.get("response").asText()).isEqualTo("not settled");
        assertThat(metrics.get("settling_time").isNull()).isTrue();
        assertThat(metrics.get("overshoot_percent").isNull()).isTrue();
        assertThat(metrics.get("iae").isNumber()).isTrue();
    }

    @Test
    void helpOfSimulateAndCompareStatesTheOvershootDefinition() {
        for (String command : List.of("simulate", "compare")) {
            CommandRun help = CommandRun.of(command, "--help");
            assertThat(help.out().replaceAll("\\s+", " ")).as(command).contains(ResponseMetrics.OVERSHOOT_DEFINITION);
        }
    }

    @Test
    void tableShowsTheLimitCycleOfAnOnOffLoop(@TempDir Path dir) throws IOException {
        Path scenario = dir.resolve("thermostat.yaml");
        Files.writeString(scenario, """
                on-off: {off-output: 0, on-output: 1, hysteresis: 1, sample-period: 0.1}
                plant: {type: fopdt, gain: 100, time-constant: 50, dead-time: 2}
                setpoint: [{at: 0, value: 50}]
                duration: 600
                """);
        int code = run("simulate", scenario.toString(), "--out", dir.resolve("out").toString());
        assertThat(code).isZero();
        assertThat(out.toString()).contains("rise time (10-90 %)", "settling time (2 %)")
                .containsPattern("limit cycle amplitude +[0-9.]+  PV\\n").containsPattern("limit cycle period +[0-9.]+  s\\n");
        assertThat(dir.resolve("out/trajectory.csv")).exists();
    }

    @Test
    void showDemoPrintsAScenarioThatReadsBack(@TempDir Path dir) throws IOException {
        assertThat(run("simulate", "--show-demo")).isZero();
        Path copy = dir.resolve("bath.yaml");
        Files.writeString(copy, out.toString());
        assertThat(org.loopwright.sim.scenario.ScenarioFile.read(copy).durationSeconds()).isEqualTo(7200.0);
    }

    @Test
    void badScenarioExitsWithTwoAndALocatedMessage(@TempDir Path dir) throws IOException {
        Path scenario = dir.resolve("bad.yaml");
        Files.writeString(scenario, "controller: {form: ideal, gain: 1, sample-period: 1}\nplant: {type: fopdt}\n"
                + "duration: 10\n");
        int code = run("simulate", scenario.toString(), "--out", dir.toString());
        assertThat(code).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(err.toString().trim()).isEqualTo(scenario + ":2:1: missing key 'gain' in plant (a number (finite))");
    }
}
