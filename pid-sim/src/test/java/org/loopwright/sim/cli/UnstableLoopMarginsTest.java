package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * margins on an open-loop-unstable plant: P control Kp of 1/(s − 1) sampled at h. The zero-order-hold
 * equivalent is (e^h − 1)/(z − e^h), so the closed-loop pole is e^h − k·Kp·(e^h − 1), inside the unit
 * circle exactly for 1 &lt; k·Kp &lt; (e^h + 1)/(e^h − 1) (Åström &amp; Wittenmark, Computer-Controlled
 * Systems, 3rd ed., §2.3 for the hold equivalent, §3.2 for the stability test).
 */
class UnstableLoopMarginsTest {

    private static final ObjectMapper MAPPER = new ObjectMapper();
    private static final double H = 0.1;
    private static final double UPPER = (Math.exp(H) + 1) / (Math.exp(H) - 1);

    private static JsonNode sampled(Path dir, double kp) throws Exception {
        Path file = dir.resolve("unstable-plant.yaml");
        Files.writeString(file, """
                controller: {form: parallel, proportional-gain: %s, sample-period: %s}
                plant: {type: transfer-function, numerator: [1.0], denominator: [1.0, -1.0]}
                setpoint: [{at: 0, value: 1.0}]
                duration: 10
                """.formatted(kp, H));
        CommandRun run = CommandRun.of("margins", file.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        return MAPPER.readTree(run.out()).get("sampled");
    }

    @Test
    void aStableLoopOnAnUnstablePlantHasALowerGainMargin(@TempDir Path dir) throws Exception {
        JsonNode s = sampled(dir, 2.0);
        assertThat(s.get("stable").asBoolean()).isTrue();
        assertThat(s.get("stable_gain_range").get("low").asDouble()).isCloseTo(0.5, within(1e-7));
        assertThat(s.get("stable_gain_range").get("high").asDouble()).isCloseTo(UPPER / 2.0, within(1e-6));
        assertThat(s.get("lower_gain_margin").asDouble()).isCloseTo(0.5, within(1e-7));
    }

    @Test
    void anUnstableLoopHasNoRobustnessFiguresButTheGainRangeThatStabilisesIt(@TempDir Path dir) throws Exception {
        JsonNode s = sampled(dir, 0.8);
        assertThat(s.get("stable").asBoolean()).isFalse();
        assertThat(s.get("ms").isNull()).isTrue();
        assertThat(s.get("delay_margin").isNull()).isTrue();
        assertThat(s.get("note").asText()).isEqualTo("not meaningful: the closed loop is unstable");
        assertThat(s.get("stable_gain_range").get("low").asDouble()).isCloseTo(1 / 0.8, within(1e-7));
        assertThat(s.get("stable_gain_range").get("high").asDouble()).isCloseTo(UPPER / 0.8, within(1e-6));
        assertThat(s.get("lower_gain_margin").isNull()).isTrue();

        CommandRun text = CommandRun.of("margins", dir.resolve("unstable-plant.yaml").toString());
        assertThat(text.out()).contains("delay margin", "not meaningful: the closed loop is unstable", "UNSTABLE",
                "1.250 < k < 25.02 times the loop gain");
    }
}
