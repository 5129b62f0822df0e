package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;


class FrequencyCommandsTest {

    private static final ObjectMapper MAPPER = new ObjectMapper();

    private static CommandRun run(String... args) {
        return CommandRun.of(args);
    }

    static String scenario(String name) {
        try {
            return Path.of(FrequencyCommandsTest.class.getResource("/scenarios/" + name).toURI()).toString();
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    @Test
    void marginsJsonOfProportionalThirdOrderLoopShowsGainMarginTwo() throws Exception {
        // Analytic: P gain 4 on 1/(s+1)³ has gain margin 2 at ω = √3 (DESIGN.md anchor, Ku = 8).
        CommandRun run = run("margins", scenario("third-order-p.yaml"), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode root = MAPPER.readTree(run.out());
        JsonNode continuous = root.get("continuous");
        assertThat(continuous.get("gain_margin").asDouble()).isCloseTo(2.0, within(1e-9));
        assertThat(continuous.get("gain_margin_db").asDouble()).isCloseTo(6.0206, within(1e-4));
        assertThat(continuous.get("phase_crossover").asDouble()).isCloseTo(Math.sqrt(3), within(1e-9));
        assertThat(continuous.get("gain_crossover").asDouble())
                .isCloseTo(Math.sqrt(Math.pow(4, 2.0 / 3) - 1), within(1e-9));
        JsonNode sampled = root.get("sampled");
        assertThat(sampled.get("stable").asBoolean()).isTrue();
        assertThat(sampled.get("sample_period").asDouble()).isEqualTo(0.01);
        for (String key : new String[] {"gain_margin", "gain_margin_db", "phase_crossover", "phase_margin_deg",
                "gain_crossover", "ms", "mt", "delay_margin"}) {
            assertThat(continuous.has(key)).as(key).isTrue();
            assertThat(sampled.has(key)).as(key).isTrue();
        }
        // Åström & Wittenmark, Computer-Controlled Systems, ch. 7–8: the hold acts about as a delay of h/2,
        // so the sampled loop crosses −180° where 3·atan(ω) + ω·h/2 = π (solved here by bisection) and its
        // gain margin is (1 + ω²)^{3/2}/4 there, to O(h²).
        double h = 0.01;
        double lo = 1.0;
        double hi = 2.0;
        for (int i = 0; i < 100; i++) {
            double mid = (lo + hi) / 2;
            if (3 * Math.atan(mid) + mid * h / 2 < Math.PI) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        assertThat(sampled.get("phase_crossover").asDouble()).isCloseTo(lo, within(1e-4));
        assertThat(sampled.get("gain_margin").asDouble()).isCloseTo(Math.pow(1 + lo * lo, 1.5) / 4, within(1e-3));
    }

    @Test
    void marginsJsonAgreesWithTheLibraryForThePumpScenario() throws Exception {
        CommandRun run = run("margins", scenario("booster-pump.yaml"), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        Scenario s = ScenarioFile.read(Path.of(scenario("booster-pump.yaml")));
        StabilityMargins c = LoopAnalysis.continuous(s.linearPlant().orElseThrow(), s.controller().orElseThrow());
        SampledMargins d = LoopAnalysis.sampled(s.sampledLoop().orElseThrow());
        JsonNode root = MAPPER.readTree(run.out());
        assertThat(root.get("continuous").get("phase_margin_deg").asDouble())
                .isEqualTo(c.gainCrossover().orElseThrow().phaseMarginDegrees());
        assertThat(root.get("sampled").get("gain_margin").asDouble())
                .isEqualTo(d.margins().phaseCrossover().orElseThrow().gainMargin());
        assertThat(root.get("sampled").get("delay_margin").asDouble())
                .isEqualTo(d.margins().delayMarginSeconds().orElseThrow());
        assertThat(root.get("sampled").get("stable").asBoolean()).isEqualTo(d.stable());
        assertThat(root.get("sampled").get("integral_method").asText()).isEqualTo("tustin");
    }

    @Test
    void marginsTableNamesEveryQuantity() {
        CommandRun run = run("margins", scenario("booster-pump.yaml"));
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("gain margin", "phase crossover", "phase margin", "gain crossover", "Ms", "Mt",
                "delay margin", "closed-loop poles", "stable");
    }

    @Test
    void compareJsonHasTheContinuousRowAndEveryMethodPair() throws Exception {
        CommandRun run = run("compare", scenario("booster-pump.yaml"), "--periods", "0.05,0.2", "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode rows = MAPPER.readTree(run.out());
        assertThat(rows.size()).isEqualTo(1 + 2 * 15);
        JsonNode first = rows.get(0);
        assertThat(first.get("sample_period").isNull()).isTrue();
        assertThat(first.get("kind").asText()).isEqualTo("continuous");
        for (JsonNode row : rows) {
            for (String key : new String[] {"integral_method", "derivative_method", "sample_period",
                    "phase_margin_deg", "gain_margin", "ms", "overshoot_percent", "iae", "load_iae",
                    "magnitude_error_db", "phase_error_deg"}) {
                assertThat(row.has(key)).as(key).isTrue();
            }
        }
        JsonNode tustin = rows.get(1 + 2 * 5 + 1); // h = 0.05, TUSTIN integral, TUSTIN derivative
        assertThat(tustin.get("integral_method").asText()).isEqualTo("tustin");
        assertThat(tustin.get("derivative_method").asText()).isEqualTo("tustin");
        assertThat(tustin.get("sample_period").asDouble()).isEqualTo(0.05);
        JsonNode notApplicable = rows.get(1 + 5 - 1); // h = 0.05, FORWARD_EULER integral, FORWARD_EULER derivative
        assertThat(notApplicable.get("kind").asText()).isEqualTo("not-applicable");
        assertThat(notApplicable.get("phase_margin_deg").isNull()).isTrue();
    }

    @Test
    void compareWritesItsPlotsIntoTheOutDirectory(@TempDir Path dir) throws Exception {
        Path plots = dir.resolve("plots");
        CommandRun run = run("compare", scenario("third-order-p.yaml"), "--periods", "0.1", "--out", plots.toString());
        assertThat(run.exitCode()).as(run.err()).isZero();
        try (Stream<Path> files = Files.list(plots)) {
            assertThat(files.count()).isEqualTo(2 * (3 + 3) + 1); // PNG and SVG of six plots, and report.html
        }
        assertThat(run.out()).contains("Wrote 12 plot files to " + plots);
    }

    @Test
    void compareTableUsesDefaultPeriodsFromTheCrossover() {
        CommandRun run = run("compare", scenario("third-order-p.yaml"));
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("(default: ωc·h = 0.02, 0.1, 0.3, 1 and the scenario's own)",
                "periods [0.01, 0.016, 0.081, 0.24, 0.81] s", "continuous", "finer than needed",
                "typical", "coarse");
    }

    static Stream<Arguments> badInputs() {
        return Stream.of(
                Arguments.of(new String[] {"margins", scenario("tank.yaml")}, scenario("tank.yaml")
                        + ": margins needs a linear plant (first-order, fopdt, sopdt, integrating or transfer-function):"
                        + " plant.type=tank"),
                Arguments.of(new String[] {"compare", scenario("tank.yaml"), "--json"}, scenario("tank.yaml")
                        + ": compare needs a linear plant (first-order, fopdt, sopdt, integrating or transfer-function):"
                        + " plant.type=tank"),
                Arguments.of(new String[] {"margins", scenario("on-off.yaml")}, scenario("on-off.yaml")
                        + ": margins needs a PID controller (the controller key): on-off=given"),
                Arguments.of(new String[] {"compare", scenario("booster-pump.yaml"), "--periods", "0.1,-1"},
                        "--periods must each be finite and > 0: --periods=0.1,-1.0"));
    }

    @ParameterizedTest
    @MethodSource("badInputs")
    void badInputExitsWithTwoAndAClearMessage(String[] args, String message) {
        CommandRun run = run(args);
        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err().strip()).isEqualTo(message);
    }

    @Test
    void noCommandIsAUsageError() {
        CommandRun run = run();
        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err()).startsWith("a command is required").contains("Usage: loopwright");
        assertThat(run.out()).isEmpty();
    }
}
