package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.BufferedWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * identify on a record longer than the fit takes: read a row at a time, thinned to every 4th row,
 * said so, and still the exact model. The record is the analytic step response of
 * 2·e^(−5s)/(50s + 1) to a unit step at t = 100 s: y = 2·(1 − e^(−(t − 105)/50)) after t = 105 s.
 */
class IdentifyLongRecordTest {

    @Test
    void aLongRecordIsThinnedWithANoteAndFitsTheAnalyticModel(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("long-step.csv");
        int rows = 42_000;
        try (BufferedWriter w = Files.newBufferedWriter(file)) {
            w.write("time,input,output\n");
            for (int i = 0; i < rows; i++) {
                double t = i * 0.1;
                double y = t > 105.0 ? 2.0 * (1.0 - Math.exp(-(t - 105.0) / 50.0)) : 0.0;
                w.write(String.format(Locale.ROOT, "%.1f,%d,%.12f%n", t, t >= 100.0 ? 1 : 0, y));
            }
        }
        CommandRun run = CommandRun.of("identify", file.toString(), "--json", "--out", dir.toString());
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode fit = new ObjectMapper().readTree(run.out());
        assertThat(fit.get("rows_in_file").asLong()).isEqualTo(rows);
        assertThat(fit.get("kept_every").asInt()).isEqualTo(4);
        assertThat(fit.get("gain").asDouble()).isCloseTo(2.0, within(1e-3));
        assertThat(fit.get("time_constant").asDouble()).isCloseTo(50.0, within(0.05));
        // the rows at the input's step are kept, so its time is exact; the response rows are 0.4 s apart
        assertThat(fit.get("dead_time").asDouble()).isCloseTo(5.0, within(0.05));

        CommandRun text = CommandRun.of("identify", file.toString(), "--out", dir.toString());
        assertThat(text.out()).startsWith("Note: 42000 rows are more than the fit takes (20000): fitted on every"
                + " 4th row (");
    }
}
