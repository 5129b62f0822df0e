package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.scenario.ScenarioFile;

class AutotuneCommandTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    private static String resource(String name) throws URISyntaxException {
        return Path.of(AutotuneCommandTest.class.getResource(name).toURI()).toString();
    }

    @Test
    void findsTheUltimatePointOfAThirdOrderLagScenarioAndVerifiesTheSuggestions() throws Exception {
        CommandRun run = CommandRun.of("autotune", resource("/scenarios/third-order-lag.yaml"), "--json");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode node = JSON.readTree(run.out());
        JsonShape.keys(node, "ultimate_gain", "ultimate_period", "oscillation_amplitude", "cycles", "setpoint", "bias",
                "relay_amplitude", "hysteresis", "warnings", "suggestions");
        // 1/(s+1)³: Ku = 8 at ω = √3, Pu = 2π/√3 (analytic); the describing function's error for
        // this plant is a few per cent (Åström & Hägglund 1984), we allow 5 %
        assertThat(node.get("ultimate_gain").asDouble()).isCloseTo(8.0, within(0.4));
        assertThat(node.get("ultimate_period").asDouble()).isCloseTo(2.0 * Math.PI / Math.sqrt(3.0), within(0.18));
        // relay d = 10 % of the output range 10 → 1; a ≈ 4d/(π·Ku) ≈ 0.16 (describing function)
        assertThat(node.get("oscillation_amplitude").asDouble()).isCloseTo(4.0 / (Math.PI * 8.0), within(0.01));
        assertThat(node.get("cycles").asInt()).isGreaterThanOrEqualTo(5);
        assertThat(node.get("warnings")).isEmpty();
        List<String> suggested = new ArrayList<>();
        node.get("suggestions").forEach(s -> suggested.add(s.get("rule").asText() + "/" + s.get("type").asText()));
        assertThat(suggested).containsExactly("ziegler-nichols/pi", "tyreus-luyben/pi", "ziegler-nichols/pid",
                "tyreus-luyben/pid");
        // every suggestion is stable on the plant: a positive gain margin above 1
        node.get("suggestions").forEach(s -> assertThat(s.get("gain_margin").asDouble()).isGreaterThan(1.0));
        node.get("suggestions").forEach(s -> assertThat(s.get("load_step").get("iae").asDouble()).isPositive());
    }

    @Test
    void writesTheChosenSuggestionAsTheScenariosControllerWithNewGains(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("tuned.yaml");
        String scenario = resource("/scenarios/third-order-lag.yaml");

        CommandRun run = CommandRun.of("autotune", scenario, "--json", "--write-controller", file.toString(),
                "--rule", "ziegler-nichols", "--type", "pid");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode zn = JSON.readTree(run.out()).get("suggestions").get(2);
        ControllerSettings written = ControllerFile.read(file);
        ControllerSettings original = ScenarioFile.read(Path.of(scenario)).controller().orElseThrow();
        IdealGains gains = (IdealGains) written.gains();
        assertThat(gains.gain()).isEqualTo(zn.get("ideal").get("gain").asDouble());
        assertThat(gains.integralTime()).isEqualTo(zn.get("ideal").get("integral_time").asDouble());
        assertThat(gains.derivativeTime()).isEqualTo(zn.get("ideal").get("derivative_time").asDouble());
        assertThat(written.samplePeriodSeconds()).isEqualTo(original.samplePeriodSeconds());
        assertThat(written.outputMax()).isEqualTo(original.outputMax());
        assertThat(CommandRun.of("autotune", scenario, "--write-controller", file.toString(), "--rule", "simc")
                .err().strip()).isEqualTo("--rule must be one of ziegler-nichols, tyreus-luyben: --rule=simc");
    }

    @Test
    void firstOrderPlantGetsAWarningThatTheEstimateIsUnreliable() throws Exception {
        // the built-in water bath is a first-order thermal zone: no phase crossover, the relay swing is
        // set by the hysteresis and the sampling alone
        CommandRun run = CommandRun.of("autotune", resource("/org/loopwright/sim/scenario/water-bath.yaml"));

        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("WARNING: the oscillation amplitude").contains("has no true ultimate point");
    }

    /**
     * A lag with no dead time, 1/(45s + 1) sampled every second: the relay can only oscillate through the
     * hold's delay, so it swings at a few samples a cycle whatever the 45 s time constant (Åström &amp;
     * Wittenmark §7: the hold acts as a delay of h/2). Such a period is refused, not tuned from.
     */
    @Test
    void aRelayPeriodSetByTheSamplingIsRefused(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("tank.yaml");
        Files.writeString(file, """
                controller: {form: parallel, proportional-gain: 2.0, integral-gain: 0.05, sample-period: 1.0,
                             output-min: 0, output-max: 10}
                plant: {type: first-order, gain: 1.0, time-constant: 45.0}
                setpoint: [{at: 0, value: 2.0}]
                duration: 600
                """);
        CommandRun run = CommandRun.of("autotune", file.toString());
        assertThat(run.exitCode()).as(run.out()).isEqualTo(2);
        assertThat(run.err()).contains("sample periods (h = 1.0 s), fewer than 10: it is set by the sampling")
                .contains("no setting is suggested");
        assertThat(run.out()).doesNotContain("ziegler-nichols");
    }

    @Test
    void anAbortedExperimentIsReportedWithItsReason() throws Exception {
        CommandRun run = CommandRun.of("autotune", resource("/scenarios/third-order-lag.yaml"), "--excursion-limit", "0.05");

        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err()).startsWith("relay experiment aborted_excursion: aborted: the process variable left the"
                + " band setpoint +/- excursionLimit:");
    }
}
