package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.Reader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * replay reads simulate's own trajectory.csv: its logged {@code output} is kept as
 * {@code logged_output}, and replaying the loop's log through the settings that made it gives the
 * logged output back exactly (common practice: a deterministic controller fed the same inputs at the
 * same period repeats itself).
 */
class ReplayOfSimulationTest {

    private static final String SCENARIO = """
            controller: {form: ideal, gain: 2.0, integral-time: 8.0, sample-period: 0.5}
            plant: {type: fopdt, gain: 1.5, time-constant: 10.0, dead-time: 1.0}
            setpoint: [{at: 0, value: 1.0}]
            duration: 60
            """;
    private static final String CONTROLLER = "form: ideal\ngain: 2.0\nintegral-time: 8.0\nsample-period: 0.5\n";

    private static List<CSVRecord> rows(Path file) throws Exception {
        try (Reader reader = Files.newBufferedReader(file)) {
            return CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get().parse(reader).getRecords();
        }
    }

    @Test
    void simulatesOwnTrajectoryReplaysToTheLoggedOutput(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("loop.yaml"), SCENARIO);
        Files.writeString(dir.resolve("pi.yaml"), CONTROLLER);
        CommandRun sim = CommandRun.of("simulate", dir.resolve("loop.yaml").toString(), "--out", dir.toString());
        assertThat(sim.exitCode()).as(sim.err()).isZero();
        Path result = dir.resolve("replayed.csv");
        CommandRun replay = CommandRun.of("replay", "--controller", dir.resolve("pi.yaml").toString(), "--trace",
                dir.resolve("trajectory.csv").toString(), "--out", result.toString());
        assertThat(replay.exitCode()).as(replay.err()).isZero();
        List<CSVRecord> rows = rows(result);
        assertThat(rows.get(0).getParser().getHeaderNames()).containsSubsequence("logged_output", "output");
        assertThat(rows).hasSize(121);
        for (CSVRecord row : rows) {
            assertThat(Double.parseDouble(row.get("output"))).as("row at t=" + row.get("time"))
                    .isEqualTo(Double.parseDouble(row.get("logged_output")));
        }
    }

    @Test
    void startingFromTheLoggedOutputReplaysTheFirstRowAtThatOutput(@TempDir Path dir) throws Exception {
        Path trace = dir.resolve("log.csv");
        Files.writeString(trace, "time,setpoint,measurement,output\n0,50,49,12.5\n0.5,50,49,12.6\n1,50,49,12.7\n");
        Files.writeString(dir.resolve("pi.yaml"), CONTROLLER);
        Path result = dir.resolve("replayed.csv");
        CommandRun replay = CommandRun.of("replay", "--controller", dir.resolve("pi.yaml").toString(), "--trace",
                trace.toString(), "--out", result.toString(), "--start-from-logged-output");
        assertThat(replay.exitCode()).as(replay.err()).isZero();
        List<CSVRecord> rows = rows(result);
        // the first row tracks the logged 12.5; the switch to automatic is bumpless, so the next output is
        // 12.5 too, and then the integral moves it by Kc·h/Ti·e = 2·0.5/8·1 = 0.125 a row (A&H 2006, ch. 3)
        assertThat(Double.parseDouble(rows.get(0).get("output"))).isEqualTo(12.5);
        assertThat(Double.parseDouble(rows.get(1).get("output"))).isEqualTo(12.5);
        assertThat(Double.parseDouble(rows.get(2).get("output"))).isCloseTo(12.625, within(1e-9));
    }

    @Test
    void timeRunningBackwardsIsWarned(@TempDir Path dir) throws Exception {
        Path trace = dir.resolve("log.csv");
        Files.writeString(trace, "time,setpoint,measurement\n0,1,0\n1,1,0\n0.5,1,0\n2,1,0\n");
        Files.writeString(dir.resolve("pi.yaml"), CONTROLLER);
        CommandRun replay = CommandRun.of("replay", "--controller", dir.resolve("pi.yaml").toString(), "--trace",
                trace.toString(), "--out", dir.resolve("r.csv").toString());
        assertThat(replay.exitCode()).as(replay.err()).isZero();
        assertThat(replay.out()).contains("Rows: 4, spanning 2.000 s", "WARNING: time runs backwards at 1 row"
                + " (first at row 4): the fixed period was used for every row");
    }
}
