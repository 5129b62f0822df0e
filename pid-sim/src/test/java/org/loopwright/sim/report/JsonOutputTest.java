package org.loopwright.sim.report;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

class JsonOutputTest {

    record Figures(double settlingTimeSeconds, double overshootPercent, Double iae, String loop) {
    }

    @Test
    void recordsHaveSnakeCaseKeysNullForMissingNumbersAndNoNegativeZero() {
        String json = JsonOutput.text(new Figures(Double.NaN, -0.0, Double.POSITIVE_INFINITY, "sampled"))
                .replaceAll("\\s+", "");
        assertThat(json).isEqualTo("{\"settling_time_seconds\":null,\"overshoot_percent\":0.0,\"iae\":null,"
                + "\"loop\":\"sampled\"}");
    }
}
