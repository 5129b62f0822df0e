package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.config.ControllerFile;

class TuneCommandTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    @Test
    void oneRuleAsJsonGivesItsSettingsInEveryFormWithTheAnalyticMargins() throws Exception {
        // SIMC on K = 2, T = 5, L = 1 (τc = L): Kc = 5/(2·2) = 1.25, Ti = min(5, 8) = 5 (Skogestad 2003);
        // the loop is e^(−s)/(2s): gain margin π, phase margin 90° − 28.648° (analytic)
        CommandRun run = CommandRun.of("tune", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                "--rule", "simc", "--json");

        assertThat(run.exitCode()).isZero();
        JsonNode node = JSON.readTree(run.out());
        assertThat(node.get("rule").asText()).isEqualTo("simc");
        assertThat(node.get("type").asText()).isEqualTo("pi");
        assertThat(node.get("ideal").get("gain").asDouble()).isCloseTo(1.25, within(1e-12));
        assertThat(node.get("ideal").get("integral_time").asDouble()).isCloseTo(5.0, within(1e-12));
        assertThat(node.get("ideal").get("derivative_time").asDouble()).isZero();
        assertThat(node.get("parallel").get("proportional_gain").asDouble()).isCloseTo(1.25, within(1e-12));
        assertThat(node.get("parallel").get("integral_gain").asDouble()).isCloseTo(0.25, within(1e-12));
        assertThat(node.get("parallel").get("derivative_gain").asDouble()).isZero();
        assertThat(node.get("series").get("gain").asDouble()).isCloseTo(1.25, within(1e-12));
        assertThat(node.get("gain_margin").asDouble()).isCloseTo(Math.PI, within(1e-3));
        assertThat(node.get("phase_margin_deg").asDouble()).isCloseTo(90.0 - Math.toDegrees(0.5), within(1e-2));
        assertThat(node.get("ms").asDouble()).isCloseTo(1.59, within(0.01));
        // without --sample-period the margins are the continuous design's, but the verdict is the sampled
        // loop's at the rule-of-thumb period h = min(T, L)/20 = 0.05 s, from its closed-loop poles
        assertThat(node.get("margins_of").asText()).isEqualTo("continuous");
        assertThat(node.get("stable").asBoolean()).isTrue();
        assertThat(node.get("citation").asText()).contains("Skogestad").contains("2003");
        assertThat(node.get("setpoint_step").get("overshoot_percent").isNumber()).isTrue();
        assertThat(node.get("load_step").get("iae").asDouble()).isPositive();
    }

    @Test
    void withoutARuleEveryApplicableRuleIsCompared() throws Exception {
        CommandRun run = CommandRun.of("tune", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                "--type", "pid", "--json");

        assertThat(run.exitCode()).isZero();
        JsonNode array = JSON.readTree(run.out());
        List<String> rules = new ArrayList<>();
        array.forEach(n -> rules.add(n.get("rule").asText()));
        // SIMC has no PID rule for a first-order model, so it is left out of the comparison
        assertThat(rules).containsExactly("amigo", "lambda", "ziegler-nichols", "cohen-coon");
        array.forEach(n -> assertThat(n.get("type").asText()).isEqualTo("pid"));
        // Ziegler–Nichols PID: Ti = 2L = 4·(L/2) = 4·Td, so its series form just exists (s = 0)
        JsonNode zn = array.get(2);
        assertThat(zn.get("series").get("integral_time").asDouble()).isCloseTo(1.0, within(1e-12));

        CommandRun text = CommandRun.of("tune", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                "--type", "pid");
        assertThat(text.out()).contains("not applicable: simc (PID): SIMC gives derivative action only")
                .contains("source of amigo: K.J. Astrom, T. Hagglund");
    }

    @Test
    void seriesFormIsNullWhereItDoesNotExist() throws Exception {
        // AMIGO PID with L = T = 2: Ti = (0.8 + 1.6)/(2 + 0.2)·2 = 2.1818, Td = 0.5·4/(0.6 + 2) = 0.7692;
        // 4·Td = 3.08 > Ti, so no series form exists (Åström & Hägglund 2006, eq. 3.10)
        JsonNode node = JSON.readTree(CommandRun.of("tune", "--process-gain", "1", "--time-constant", "2",
                "--dead-time", "2", "--rule", "amigo", "--type", "pid", "--json").out());

        assertThat(node.get("ideal").get("integral_time").asDouble()).isCloseTo(2.1818182, within(1e-6));
        assertThat(node.get("ideal").get("derivative_time").asDouble()).isCloseTo(0.7692308, within(1e-6));
        assertThat(node.get("series").isNull()).isTrue();
        assertThat(CommandRun.of("tune", "--process-gain", "1", "--time-constant", "2", "--dead-time", "2", "--rule",
                "amigo", "--type", "pid").out()).contains("series:   none (Ti < 4*Td)");
    }

    @Test
    void closedLoopTimeSetsLambda() throws Exception {
        // lambda PI (Rivera et al. 1986), λ = 4 on K = 1, T = 5, L = 1: Kc = (10 + 1)/(2·4) = 1.375, Ti = 5.5
        JsonNode node = JSON.readTree(CommandRun.of("tune", "--process-gain", "1", "--time-constant", "5",
                "--dead-time", "1", "--rule", "lambda", "--closed-loop-time", "4", "--json").out());

        assertThat(node.get("ideal").get("gain").asDouble()).isCloseTo(1.375, within(1e-12));
        assertThat(node.get("ideal").get("integral_time").asDouble()).isCloseTo(5.5, within(1e-12));
        assertThat(node.get("note").asText()).isEqualTo("lambda = 4.000 s");
    }

    @Test
    void ultimatePointRulesHaveNoMarginsWithoutAModel() throws Exception {
        // Tyreus–Luyben PID on Ku = 8, Pu = 4: Kc = 8/2.2 = 3.6363636, Ti = 8.8, Td = 4/6.3 = 0.6349206
        CommandRun run = CommandRun.of("tune", "--ultimate-gain", "8", "--ultimate-period", "4", "--rule",
                "tyreus-luyben", "--type", "pid", "--json");

        assertThat(run.exitCode()).isZero();
        JsonNode node = JSON.readTree(run.out());
        assertThat(node.get("ideal").get("gain").asDouble()).isCloseTo(3.6363636, within(1e-6));
        assertThat(node.get("ideal").get("integral_time").asDouble()).isCloseTo(8.8, within(1e-9));
        assertThat(node.get("ideal").get("derivative_time").asDouble()).isCloseTo(0.6349206, within(1e-6));
        assertThat(node.get("phase_margin_deg").isNull()).isTrue();
        assertThat(node.get("gain_margin").isNull()).isTrue();
        assertThat(node.get("ms").isNull()).isTrue();
    }

    @Test
    void writesAControllerFileThatReadsBackToTheSameGains(@TempDir Path dir) {
        Path file = dir.resolve("bath.yaml");
        CommandRun run = CommandRun.of("tune", "--process-gain", "0.25", "--time-constant", "120", "--dead-time", "15",
                "--rule", "amigo", "--type", "pid", "--sample-period", "0.75", "--output-min", "0", "--output-max", "100",
                "--write-controller", file.toString());

        assertThat(run.exitCode()).isZero();
        assertThat(run.out()).contains("Wrote " + file);
        ControllerSettings settings = ControllerFile.read(file);
        IdealGains gains = (IdealGains) settings.gains();
        // AMIGO PID (Åström & Hägglund 2004): Kc = (0.2 + 0.45·120/15)/0.25 = 15.2,
        // Ti = (6 + 96)/(15 + 12)·15 = 56.6667, Td = 0.5·15·120/(4.5 + 120) = 7.2289157
        assertThat(gains.gain()).isCloseTo(15.2, within(1e-9));
        assertThat(gains.integralTime()).isCloseTo(56.6666667, within(1e-6));
        assertThat(gains.derivativeTime()).isCloseTo(7.2289157, within(1e-6));
        assertThat(settings.samplePeriodSeconds()).isEqualTo(0.75);
        assertThat(settings.outputMin()).isEqualTo(0.0);
        assertThat(settings.outputMax()).isEqualTo(100.0);
        assertThat(run.out()).contains("(loop sampled at h = 0.7500 s on the model)");
    }

    @Test
    void tunesASecondOrderModelBySimcWithTheDerivativeOnTheSecondLag() throws Exception {
        // SIMC (Skogestad 2003, from memory), K = 2, T1 = 10, T2 = 3, L = 1, tau_c = L: series Kc' = 2.5,
        // Ti' = 8, Td' = 3; ideal Kc = 2.5*(1 + 3/8) = 3.4375, Ti = 11, Td = 24/11
        CommandRun run = CommandRun.of("tune", "--process-gain", "2", "--time-constant", "10", "--second-time-constant",
                "3", "--dead-time", "1", "--rule", "simc", "--type", "pid", "--json");

        assertThat(run.exitCode()).isZero();
        JsonNode node = JSON.readTree(run.out());
        assertThat(node.get("ideal").get("gain").asDouble()).isCloseTo(3.4375, within(1e-9));
        assertThat(node.get("ideal").get("integral_time").asDouble()).isCloseTo(11.0, within(1e-9));
        assertThat(node.get("ideal").get("derivative_time").asDouble()).isCloseTo(24.0 / 11.0, within(1e-9));
        assertThat(node.get("margins_of").asText()).isEqualTo("continuous");
    }

    @Test
    void tunesAnIntegratingProcessAndSaysWhichRulesDoNotApply() {
        // SIMC integrating PI (Skogestad 2003, from memory), K = 0.1 1/s, L = 2, tau_c = L: Kc = 2.5, Ti = 16
        CommandRun run = CommandRun.of("tune", "--process-gain", "0.1", "--integrating", "--dead-time", "2");

        assertThat(run.exitCode()).isZero();
        assertThat(run.out()).containsPattern("simc +pi +2\\.500 +16\\.00")
                .contains("not applicable: amigo (PI): AMIGO's rule here is for a self-regulating first-order model");
    }

    @Test
    void readsTheModelThatIdentifyPrints(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("model.json");
        java.nio.file.Files.writeString(file, "{\n  \"model\" : \"fopdt\",\n  \"gain\" : 2.0,\n"
                + "  \"time_constant\" : 10.0,\n  \"dead_time\" : 1.0,\n  \"rmse\" : 0.01\n}\n");
        CommandRun run = CommandRun.of("tune", "--model-file", file.toString(), "--rule", "simc", "--json");

        assertThat(run.exitCode()).isZero();
        // SIMC PI on K = 2, T = 10, L = 1: Kc = 2.5, Ti = 8 (as TuningRuleTest, from memory)
        assertThat(JSON.readTree(run.out()).get("ideal").get("gain").asDouble()).isCloseTo(2.5, within(1e-12));
    }

    static Stream<Arguments> badInput() {
        return Stream.of(
                Arguments.of(new String[] {"tune"},
                        "give either a model (--process-gain, --time-constant, --dead-time; or --model-file) or"
                                + " --ultimate-gain and --ultimate-period"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--ultimate-gain", "2"},
                        "give either a model (--process-gain, --time-constant, --dead-time; or --model-file) or"
                                + " --ultimate-gain and --ultimate-period"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--dead-time", "2"},
                        "a self-regulating model needs --time-constant (or give --integrating)"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "2"},
                        "a model needs --process-gain and --dead-time, and --time-constant"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "2", "--second-time-constant",
                        "3", "--dead-time", "1"},
                        "--second-time-constant must be finite, > 0 and <= the first time constant (2.0):"
                                + " --second-time-constant=3.0"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "5", "--dead-time", "1",
                        "--rule", "simc", "--write-controller", "x.yaml"},
                        "--write-controller needs --sample-period: the controller's period is the device's choice,"
                                + " not one to invent"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "5", "--dead-time", "1",
                        "--output-min", "5", "--output-max", "5"},
                        "--output-min must be < --output-max: --output-min=5.0, --output-max=5.0"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "5", "--dead-time", "1",
                        "--sample-period", "0"},
                        "--sample-period must be finite and > 0: --sample-period=0.0"),
                Arguments.of(new String[] {"tune", "--ultimate-gain", "2"},
                        "an ultimate point needs both --ultimate-gain and --ultimate-period"),
                Arguments.of(new String[] {"tune", "--ultimate-gain", "2", "--ultimate-period", "3", "--type", "pd"},
                        "--type must be one of pi, pid: --type=pd"),
                Arguments.of(new String[] {"tune", "--ultimate-gain", "2", "--ultimate-period", "3", "--rule", "simc"},
                        "--rule must be one of ziegler-nichols, tyreus-luyben for an ultimate point: --rule=simc"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "1", "--dead-time", "3",
                        "--rule", "cohen-coon"},
                        "cohen-coon does not apply: the process is delay-dominant, outside cohen-coon's range"
                                + " L/T <= 1.000: L/T=3.000 (G.H. Cohen, G.A. Coon, \"Theoretical consideration of"
                                + " retarded control\", Transactions of the ASME 75 (1953) 827-834)"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "0", "--dead-time", "3"},
                        "--time-constant must be finite and > 0: --time-constant=0.0"),
                Arguments.of(new String[] {"tune", "--ultimate-gain", "2", "--ultimate-period", "-3"},
                        "--ultimate-period must be finite and > 0: --ultimate-period=-3.0"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "5", "--dead-time", "1",
                        "--write-controller", "x.yaml"},
                        "--write-controller needs --rule: which rule's settings to write"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "5", "--dead-time", "1",
                        "--rule", "amigo", "--closed-loop-time", "2"},
                        "--closed-loop-time applies to the simc and lambda rules only: --rule=amigo"),
                Arguments.of(new String[] {"tune", "--process-gain", "1", "--time-constant", "5", "--dead-time", "1",
                        "--rule", "lambda", "--closed-loop-time", "-2"},
                        "--closed-loop-time must be finite and > 0 (omit it for the rule's default):"
                                + " --closed-loop-time=-2.0"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("badInput")
    void badInputExitsWithTwoAndSaysWhy(String[] args, String message) {
        CommandRun.assertBadInput(args, message);
    }
}
