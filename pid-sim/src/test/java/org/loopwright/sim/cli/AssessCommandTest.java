package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.MotorOutput;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/** The {@code assess} command: files in, table, JSON with the documented keys, files out, exit 2 on bad input. */
class AssessCommandTest {

    @TempDir
    static Path shared;

    @TempDir
    Path dir;

    private static Path trace;

    /** The sticking DC motor of LoopAssessmentTest, logged once as a trace with an output column. */
    private static synchronized Path huntingMotorTrace() throws IOException {
        if (trace != null) {
            return trace;
        }
        ControllerSettings pi = ControllerSettings.builder().gains(IdealGains.pi(2.0, 1.0)).samplePeriodSeconds(0.005)
                .outputRange(-12.0, 12.0).build();
        Trajectory t = Simulation.run(Scenario.builder()
                .plant(new DcMotorModel(1.0, 0.001, 0.1, 0.1, 0.001, 1e-4, 0.0, 0.01, 0.02, MotorOutput.POSITION, 1e-4))
                .controller(pi).setpoint(SetpointChange.step(0.1, 1.0))
                .sensor(new SensorModel(0.0005, 0.0, 0, 0.0, 0.0)).durationSeconds(200.0).build());
        List<String> lines = new ArrayList<>();
        lines.add("time,setpoint,measurement,output,mode");
        for (int k = 0; k < t.length(); k++) {
            lines.add(String.format(Locale.ROOT, "%.3f,%.6g,%.8g,%.8g,auto", t.time(k), t.setpoint(k), t.measurement(k),
                    t.output(k)));
        }
        Files.writeString(shared.resolve("motor.yaml"), ControllerFile.toYaml(pi));
        trace = Files.write(shared.resolve("motor.csv"), lines);
        return trace;
    }

    @Test
    void aHuntingDriveIsReportedWithEveryFileAndTheDocumentedJsonKeys() throws IOException {
        Path logged = huntingMotorTrace();
        Path out = dir.resolve("out");
        CommandRun run = CommandRun.of("assess", logged.toString(), "--controller", shared.resolve("motor.yaml").toString(),
                "--span", "0.5", "--process-kind", "position-drive", "--dead-time", "0.01", "--out", out.toString(),
                "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode json = new ObjectMapper().readTree(run.out());
        assertThat(json.fieldNames()).toIterable().containsExactly("samples", "sample_period", "conditions",
                "oscillation_period", "oscillation_amplitude");
        assertThat(json.get("samples").asInt()).isEqualTo(40_001);
        List<String> names = new ArrayList<>();
        for (JsonNode c : json.get("conditions")) {
            assertThat(c.fieldNames()).toIterable().containsExactly("name", "status", "value", "threshold", "unit",
                    "method", "source", "note");
            assertThat(c.get("status").asText()).isIn("ok", "warn", "alarm", "not-assessed");
            names.add(c.get("name").asText());
        }
        assertThat(names).contains("oscillation", "stiction", "saturation", "sluggish", "frozen-measurement", "noise",
                "minimum-variance-index");
        assertThat(json.get("conditions").get(0).get("status").asText()).isEqualTo("alarm");
        assertThat(json.get("oscillation_period").asDouble()).isPositive();
        for (String file : List.of("report.html", "assess-trend.png", "assess-trend.svg",
                "assess-output-vs-measurement.png", "assess-output-vs-measurement.svg")) {
            assertThat(out.resolve(file)).isNotEmptyFile();
        }
        assertThat(Files.readString(out.resolve("report.html"))).contains("stiction", "Horch 1999");
    }

    @Test
    void theTableNamesTheConditionsAndWhatWasAssumed() throws IOException {
        CommandRun run = CommandRun.of("assess", huntingMotorTrace().toString(), "--time-scale", "1");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("OSCILLATION".toLowerCase(Locale.ROOT), "ALARM", "Verdict: oscillation alarm",
                "Assumed: a self-regulating process", "minimum-variance-index", "not-assessed");
        assertThat(dir.resolve("report.html")).doesNotExist();
    }

    @Test
    void badInputExitsTwoWithTheFileRowAndColumn() throws IOException {
        Path noOutput = Files.writeString(dir.resolve("a.csv"), "time,setpoint,measurement\n0,1,1\n1,1,1\n");
        CommandRun missing = CommandRun.of("assess", noOutput.toString(), "--time-scale", "1");
        assertThat(missing.exitCode()).isEqualTo(2);
        assertThat(missing.err()).contains(noOutput + ": row 1, column 'output': required column is missing");

        Path backwards = Files.writeString(dir.resolve("b.csv"), "time,setpoint,measurement,output\n0,1,1,0\n1,1,1,0\n"
                + "0.5,1,1,0\n");
        CommandRun time = CommandRun.of("assess", backwards.toString(), "--time-scale", "1");
        assertThat(time.exitCode()).isEqualTo(2);
        assertThat(time.err()).contains(backwards + ": row 4, column 'time': must increase from row to row"
                + " (previous row 1.0): time=0.5");

        Path fine = Files.writeString(dir.resolve("c.csv"), "time,setpoint,measurement,output\n0,1,1,0\n1,1,1,0\n");
        assertThat(CommandRun.of("assess", fine.toString()).err()).contains("assess needs the loop's time scale");
        CommandRun negative = CommandRun.of("assess", fine.toString(), "--time-scale", "1", "--dead-time", "-1");
        assertThat(negative.exitCode()).isEqualTo(2);
        assertThat(negative.err()).contains("--dead-time must be finite and >= 0: --dead-time=-1.0");
        CommandRun kind = CommandRun.of("assess", fine.toString(), "--time-scale", "1", "--process-kind", "tank");
        assertThat(kind.exitCode()).isEqualTo(2);
        assertThat(kind.err().strip()).isEqualTo("--process-kind must be one of self-regulating, integrating,"
                + " position-drive: --process-kind=tank");
        // too few samples for a method: not-assessed with the reason, not an error
        CommandRun tiny = CommandRun.of("assess", fine.toString(), "--time-scale", "10", "--dead-time", "1");
        assertThat(tiny.exitCode()).as(tiny.err()).isZero();
        assertThat(tiny.out()).contains("the fit needs");
    }
}
