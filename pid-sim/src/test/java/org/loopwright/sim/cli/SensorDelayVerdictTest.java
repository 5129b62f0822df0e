package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The sensor's whole samples of delay are part of the loop that margins and compare analyse, as they
 * are of the loop simulate and sweep run.
 */
class SensorDelayVerdictTest {

    private static final ObjectMapper MAPPER = new ObjectMapper();

    /**
     * P control on an integrator K/s sampled at h: with a = Kp·K·h the loop is a·z^(−N)/(z − 1). The
     * Jury test (Åström &amp; Wittenmark, Computer-Controlled Systems, 3rd ed., §3.2) gives: N = 0, the
     * pole 1 − a is inside the circle for 0 &lt; a &lt; 2; N = 1, z² − z + a is stable for 0 &lt; a &lt; 1;
     * N = 2, z³ − z² + a is stable for 0 &lt; a &lt; (√5 − 1)/2 ≈ 0.618. With a = 0.8 the loop is stable
     * without sensor delay and with one sample, unstable with two.
     */
    @ParameterizedTest
    @CsvSource({"0, true", "1, true", "2, false"})
    void marginsAndCompareJudgeTheLoopWithTheSensorDelay(int delaySamples, boolean stable, @TempDir Path dir)
            throws Exception {
        Path file = dir.resolve("delayed.yaml");
        Files.writeString(file, """
                controller: {form: parallel, proportional-gain: 8.0, sample-period: 0.1}
                plant: {type: integrating, gain: 1.0}
                sensor: {delay-samples: %d}
                setpoint: [{at: 0, value: 1.0}]
                duration: 20
                """.formatted(delaySamples));
        CommandRun margins = CommandRun.of("margins", file.toString(), "--json");
        assertThat(margins.exitCode()).as(margins.err()).isZero();
        assertThat(MAPPER.readTree(margins.out()).get("sampled").get("stable").asBoolean()).isEqualTo(stable);

        CommandRun compare = CommandRun.of("compare", file.toString(), "--periods", "0.1", "--json");
        assertThat(compare.exitCode()).as(compare.err()).isZero();
        JsonNode sampledRow = MAPPER.readTree(compare.out()).get(1);
        assertThat(sampledRow.get("sample_period").asDouble()).isEqualTo(0.1);
        assertThat(sampledRow.get("stable").asBoolean()).isEqualTo(stable);
    }
}
