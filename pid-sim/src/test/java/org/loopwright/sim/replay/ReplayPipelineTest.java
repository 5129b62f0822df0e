package org.loopwright.sim.replay;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.StringReader;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.Random;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.config.InputFileException;

/**
 * The streamed replay (reader, controller and formatters on threads of their own, rows in batches)
 * against the replay held in memory on one thread, whose rows {@link ReplayTest} checks against a
 * controller driven directly: the same text, row for row, and the same summary.
 */
class ReplayPipelineTest {

    private static final int BATCH = ReplayPipeline.ROWS_PER_BATCH;
    private static final ControllerSettings SETTINGS = ControllerSettings.builder()
            .gains(new IdealGains(1.8, 12.0, 2.0))
            .samplePeriodSeconds(0.1)
            .outputRange(-5.0, 40.0)
            .windupProtection(WindupProtection.CLAMPING)
            .faultPolicy(FaultPolicy.HOLD, 0.0)
            .build();

    /** Batches that end with the trace, one row short, one row over, and a trace shorter than a batch. */
    @ParameterizedTest
    @ValueSource(ints = {3 * BATCH, 3 * BATCH - 1, 3 * BATCH + 1, 17})
    void streamWritesWhatTheReplayInMemoryWrites(int rows) throws IOException {
        String trace = trace(rows, -1);
        StringBuilder expected = new StringBuilder();
        ReplayResult inMemory = Replay.run(SETTINGS, TraceFile.parse("log.csv", trace), false);
        inMemory.writeCsv(expected);

        ByteArrayOutputStream streamed = new ByteArrayOutputStream();
        ReplaySummary summary;
        try (TraceReader reader = TraceReader.of("log.csv", new StringReader(trace))) {
            summary = Replay.stream(SETTINGS, reader, false, false, streamed);
        }

        assertThat(streamed.toString(StandardCharsets.UTF_8)).isEqualTo(expected.toString());
        assertThat(summary.lines()).isEqualTo(ReplaySummary.of(inMemory).lines());
        assertThat(summary.rows()).isEqualTo(rows);
    }

    /** A bad row batches away from the start: the message a reader on one thread gives, nothing swallowed. */
    @ParameterizedTest
    @ValueSource(ints = {0, BATCH - 1, BATCH, 2 * BATCH + 5})
    void aBadRowGivesTheMessageOfAReaderOnOneThread(int badRow) throws IOException {
        String trace = trace(3 * BATCH, badRow);
        String expected = catchMessage(() -> TraceFile.parse("log.csv", trace));
        assertThat(expected).isEqualTo("log.csv: row " + (badRow + 2) + ", column 'measurement': must be a number,"
                + " or blank, nan or inf for a bad sample: measurement=oops");

        try (TraceReader reader = TraceReader.of("log.csv", new StringReader(trace))) {
            assertThatThrownBy(() -> Replay.stream(SETTINGS, reader, false, false, OutputStream.nullOutputStream()))
                    .isInstanceOf(InputFileException.class)
                    .hasMessage(expected);
        }
    }

    private static String catchMessage(Runnable action) {
        try {
            action.run();
        } catch (InputFileException e) {
            return e.getMessage();
        }
        throw new AssertionError("no error");
    }

    /**
     * A trace with stretches at an output limit (repeated result values), changing values, missing
     * samples, mode switches and a quoted note; {@code badRow} (counting data rows from 0) has a
     * measurement that is not a number, none when negative.
     */
    private static String trace(int rows, int badRow) {
        Random random = new Random(7);
        StringBuilder csv = new StringBuilder("time,setpoint,measurement,mode,note\n");
        for (int k = 0; k < rows; k++) {
            double measurement = (k / 500) % 2 == 0 ? 10.0 + random.nextDouble() : -50.0;
            String measurementCell = k == badRow ? "oops" : random.nextInt(50) == 0 ? "" : Double.toString(measurement);
            String mode = random.nextInt(200) == 0 ? "manual" : random.nextInt(200) == 0 ? "auto" : "";
            String note = random.nextInt(100) == 0 ? "\"a, note\"" : "n" + k;
            csv.append(k * 0.1).append(",12.5,").append(measurementCell).append(',').append(mode).append(',')
                    .append(note).append('\n');
        }
        return csv.toString();
    }
}
