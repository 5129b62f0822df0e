package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.sim.design.Candidate;
import org.loopwright.sim.design.Design;
import org.loopwright.sim.design.DesignModel;
import org.loopwright.sim.design.DesignResult;
import org.loopwright.sim.design.DesignSpec;
import org.loopwright.sim.sweep.Spread;
import org.loopwright.sim.config.ControllerFile;

/**
 * The design command end to end: one source of truth with margins, simulate and sweep on the written
 * scenario, the honest verdict when nothing meets the constraints, and bad input.
 */
class DesignCommandTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    private static String resource(String name) throws URISyntaxException {
        return Path.of(DesignCommandTest.class.getResource(name).toURI()).toString();
    }

    @Test
    void designFiguresEqualThoseOfMarginsSimulateAndSweepOnTheWrittenScenario(@TempDir Path dir) throws Exception {
        // one source of truth: design's figures for the recommended candidate must be exactly what the
        // other commands compute from the files it wrote
        CommandRun run = CommandRun.of("design", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                "--sample-period", "0.25", "--output-min", "-20", "--output-max", "20", "--sensor-delay-samples", "1", "--runs", "12", "--seed", "3", "--out", dir.toString(), "--json");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode design = JSON.readTree(run.out());
        assertThat(JSON.readTree(Files.readString(dir.resolve("design.json")))).isEqualTo(design);
        JsonShape.keys(design, "model", "sample_period", "max_sensitivity", "sensor_delay_samples", "output_min",
                "output_max", "output_slew", "integral_method", "derivative_method", "experiment", "candidates",
                "not_applicable", "recommended", "verdict", "discretisation_check", "files");
        JsonShape.keys(design.get("model"), "type", "gain", "time_constant", "second_time_constant", "dead_time", "rmse",
                "r_squared", "source", "choice");
        JsonShape.keys(design.get("experiment"), "operating_output", "setpoint_step", "load_step", "load_at",
                "duration", "spread", "runs", "seed");
        JsonShape.keys(design.get("candidates").get(0), "name", "rule", "type", "gain", "integral_time",
                "derivative_time", "gain_margin", "phase_margin_deg", "ms", "mt", "delay_margin", "stable",
                "overshoot_pct", "settling_time", "load_iae", "total_variation", "sweep_unstable_share",
                "sweep_p90_overshoot_pct", "meets_constraints", "note", "source");
        assertThat(design.get("candidates").get(0).get("stable").isBoolean()).isTrue();
        JsonShape.keys(design.get("discretisation_check").get(0), "integral_method", "derivative_method", "chosen",
                "phase_margin_deg", "ms", "stable", "note");
        String name = design.get("recommended").asText();
        JsonNode chosen = null;
        for (JsonNode c : design.get("candidates")) {
            if (c.get("name").asText().equals(name)) {
                chosen = c;
            }
        }
        assertThat(chosen).isNotNull();
        assertThat(design.get("verdict").asText()).isEqualTo("recommended");
        String scenario = dir.resolve("scenario.yaml").toString();

        JsonNode margins = JSON.readTree(CommandRun.of("margins", scenario, "--json").out()).get("sampled");
        JsonNode simulated = JSON.readTree(CommandRun.of("simulate", scenario, "--out", dir.resolve("sim").toString(),
                "--json").out());
        JsonNode sweep = JSON.readTree(CommandRun.of("sweep", scenario, "--runs", "12", "--seed", "3", "--spread",
                "gain=20%,time-constant=20%,dead-time=20%", "--out", dir.resolve("sweep").toString(), "--json",
                "--no-progress").out());

        assertThat(chosen.get("ms").asDouble()).isEqualTo(margins.get("ms").asDouble());
        assertThat(chosen.get("mt").asDouble()).isEqualTo(margins.get("mt").asDouble());
        assertThat(chosen.get("gain_margin").asDouble()).isEqualTo(margins.get("gain_margin").asDouble());
        assertThat(chosen.get("phase_margin_deg").asDouble()).isEqualTo(margins.get("phase_margin_deg").asDouble());
        assertThat(chosen.get("stable").asBoolean()).isEqualTo(margins.get("stable").asBoolean());
        assertThat(chosen.get("overshoot_pct").asDouble()).isEqualTo(simulated.get("overshoot_percent").asDouble());
        assertThat(chosen.get("settling_time").asDouble()).isEqualTo(simulated.get("settling_time").asDouble());
        assertThat(chosen.get("total_variation").asDouble()).isEqualTo(simulated.get("total_variation").asDouble());
        assertThat(chosen.get("sweep_unstable_share").asDouble()).isEqualTo(sweep.get("unstable_share").asDouble());
        assertThat(chosen.get("sweep_p90_overshoot_pct").asDouble())
                .isEqualTo(sweep.get("overshoot_percent").get("p90").asDouble());
        // the controller file holds the same gains with the device's own (absolute) limits
        ControllerSettings device = ControllerFile.read(dir.resolve("controller.yaml"));
        assertThat(device.outputMin()).isEqualTo(-20.0);
        assertThat(device.outputMax()).isEqualTo(20.0);
        assertThat(device.samplePeriodSeconds()).isEqualTo(0.25);
        assertThat(design.get("files")).extracting(JsonNode::asText).containsExactly("controller.yaml",
                "scenario.yaml", "candidates.csv", "design.json", "report.html");
        assertThat(dir.resolve("report.html")).exists();
        assertThat(Files.readAllLines(dir.resolve("candidates.csv"))).hasSize(design.get("candidates").size() + 1);
    }

    @Test
    void designsFromTheBundledStepTestAndExplainsTheModelChoice(@TempDir Path dir) throws Exception {
        CommandRun run = CommandRun.of("design", "--step-test", resource("/scenarios/drying-oven-step-test.csv"),
                "--sample-period", "1", "--output-min", "0", "--output-max", "100", "--runs", "10", "--out",
                dir.toString());

        assertThat(run.exitCode()).as(run.err()).isZero();
        // the data was made with two lags (12 s and 60 s): the second-order fit must be kept
        assertThat(run.out()).contains("Model: sopdt").contains("sopdt kept").contains("Recommended: ")
                .contains("max-integral-gain-pi").contains("simc-pid");
        // written into a staging folder, then moved: every file in place, nothing of the stage left
        try (Stream<Path> files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString())).contains("controller.yaml", "scenario.yaml",
                    "candidates.csv", "design.json", "report.html").noneMatch(name -> name.startsWith(".loopwright"));
        }
    }

    @Test
    void readsASecondOrderPlantFileBackToItsTimeConstants(@TempDir Path dir) throws Exception {
        Path plant = dir.resolve("plant.yaml");
        Files.writeString(plant, "plant: {type: sopdt, gain: 1.5, time-constants: [4.0, 20.0], dead-time: 2.0}\n");

        CommandRun run = CommandRun.of("design", "--plant", plant.toString(), "--sample-period", "0.5", "--type", "pi",
                "--runs", "2", "--out", dir.resolve("out").toString(), "--json");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode model = JSON.readTree(run.out()).get("model");
        // (20s + 1)(4s + 1) = 80s² + 24s + 1: the roots of x² − 24x + 80 are 20 and 4 (exact in doubles)
        assertThat(model.get("type").asText()).isEqualTo("sopdt");
        assertThat(model.get("time_constant").asDouble()).isEqualTo(20.0);
        assertThat(model.get("second_time_constant").asDouble()).isEqualTo(4.0);
        assertThat(model.get("source").asText()).isEqualTo("plant-file");
        assertThat(model.get("rmse").isNull()).isTrue();
    }

    @Test
    void whenNoCandidateMeetsTheConstraintsItSaysSoAndRecommendsTheStableOneWithTheSmallestMs() {
        // a real design, then every candidate judged against a limit none can meet (Ms <= 1.0001)
        DesignModel model = DesignModel.given(new FopdtModel(2.0, 5.0, 1.0), "options");
        DesignSpec spec = new DesignSpec(0.25, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY,
                Double.POSITIVE_INFINITY, 1, 1.4, List.of(ControllerType.PI, ControllerType.PID), IntegralMethod.TUSTIN,
                DerivativeMethod.BACKWARD_EULER, Spread.parse("gain=20%"), 4, 1L);
        DesignResult designed = Design.run(model, spec, 2, i -> { });
        assertThat(designed.candidates()).anyMatch(c -> !c.stable()); // ZN and Cohen-Coon PID, one sample of sensor delay
        List<Candidate> strict = designed.candidates().stream().map(c -> c.judgedAgainst(1.0001)).toList();

        Candidate chosen = Design.recommend(strict).orElseThrow();
        DesignResult result = new DesignResult(model, spec, designed.experiment(), strict, List.of(),
                Optional.of(chosen), chosen.meetsConstraints(), List.of());

        assertThat(chosen.stable()).isTrue();
        assertThat(chosen.ms()).isEqualTo(strict.stream().filter(Candidate::stable).mapToDouble(Candidate::ms).min()
                .orElseThrow());
        assertThat(result.verdict()).isEqualTo("no-candidate-meets-constraints");
        assertThat(DesignFiles.recommendation(result)).startsWith("NO CANDIDATE MEETS THE CONSTRAINTS");
        assertThat(Design.recommend(strict.stream().filter(c -> !c.stable()).toList())).isEmpty();
    }

    static Stream<Arguments> badInput() throws Exception {
        Path dir = Files.createTempDirectory("design-bad");
        Path flat = dir.resolve("flat.csv");
        StringBuilder csv = new StringBuilder("time,input,output\n");
        for (int i = 0; i < 20; i++) {
            csv.append(i).append(",5,").append(1.0 + 0.01 * i).append('\n');
        }
        Files.writeString(flat, csv);
        Path tank = dir.resolve("tank.yaml");
        Files.writeString(tank, "plant: {type: tank, area: 0.5, outlet-coefficient: 0.01}\n");
        String out = dir.resolve("out").toString();
        return Stream.of(
                Arguments.of(new String[] {"design", "--step-test", flat.toString(), "--sample-period", "1", "--out",
                        out}, flat + ": holds no step: column 'input' starts and ends at 5.00000 (a step test needs"
                                + " one step in the input)"),
                Arguments.of(new String[] {"design", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                        "--sample-period", "0", "--out", out}, "--sample-period must be finite and > 0:"
                                + " --sample-period=0.0"),
                Arguments.of(new String[] {"design", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                        "--sample-period", "0.1", "--output-min", "5", "--output-max", "5", "--out", out},
                        "--output-min must be < --output-max: --output-min=5.0, --output-max=5.0"),
                Arguments.of(new String[] {"design", "--plant", tank.toString(), "--sample-period", "0.1", "--out",
                        out}, tank + ": design needs a linear plant (fopdt, sopdt, integrating): plant.type=tank"),
                Arguments.of(new String[] {"design", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                        "--sample-period", "0.1", "--type", "pd", "--out", out}, "--type must be one of auto, pi, pid:"
                                + " --type=pd"),
                Arguments.of(new String[] {"design", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                        "--sample-period", "0.1", "--integral-method", "simpson", "--out", out},
                        "--integral-method must be one of forward-euler, backward-euler, tustin:"
                                + " --integral-method=simpson"),
                Arguments.of(new String[] {"design", "--sample-period", "0.1", "--out", out},
                        "give one model: --step-test STEP.csv, --plant PLANT.yaml, or --process-gain with"
                                + " --time-constant and --dead-time (or --integrating and --dead-time)"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("badInput")
    void badInputExitsWithTwoAndSaysWhy(String[] args, String message) {
        CommandRun.assertBadInput(args, message);
    }
}
