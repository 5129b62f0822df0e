package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * Simulate, compare, sweep and assess fail half way, after computing and writing every output, when one of
 * their files cannot be put in place (a directory of that name stands in the output folder). The
 * folder must then hold exactly what it held before: the older files unchanged, no new file, nothing
 * half written and no staging folder (common practice: write to a temporary name, then rename). The
 * message is the same in every command: the file, and why it could not be written.
 */
class OutputFailureTest {

    private static final String SCENARIO = """
            controller: {form: ideal, gain: 2.0, integral-time: 10.0, sample-period: 0.1}
            plant: {type: first-order, gain: 1.0, time-constant: 10.0}
            setpoint: [{at: 0, value: 1.0}]
            duration: 30
            """;

    @ParameterizedTest
    @ValueSource(strings = {"simulate", "compare", "sweep", "assess"})
    void aCommandThatCannotPlaceItsReportLeavesTheOutputFolderAsItWas(String command, @TempDir Path dir)
            throws IOException {
        Path scenario = dir.resolve("loop.yaml");
        Files.writeString(scenario, SCENARIO);
        Path out = dir.resolve("out");
        Path blocker = out.resolve("report.html");
        Files.createDirectories(blocker);
        Files.writeString(blocker.resolve("keep.txt"), "kept");
        // an older output of the same name as one the command writes: it must stay whole and unchanged
        String older = switch (command) {
            case "simulate" -> "trajectory.csv";
            case "compare" -> "nyquist.png";
            case "assess" -> "assess-trend.png";
            default -> "sweep-runs.csv";
        };
        Files.writeString(out.resolve(older), "older output");
        List<String> before = listing(out);

        List<String> args = new ArrayList<>(List.of(command, scenario.toString(), "--out", out.toString()));
        if (command.equals("sweep")) {
            args.addAll(List.of("--runs", "3", "--spread", "gain=10%", "--no-progress"));
        } else if (command.equals("compare")) {
            args.addAll(List.of("--periods", "0.1"));
        } else if (command.equals("assess")) {
            args.set(1, trace(dir).toString());
            args.addAll(List.of("--time-scale", "2"));
        }
        CommandRun run = CommandRun.of(args.toArray(String[]::new));

        assertThat(run.exitCode()).as(run.out() + run.err()).isEqualTo(2);
        assertThat(run.err().strip()).isEqualTo(blocker + ": cannot be read or written (a directory is in the way)");
        assertThat(listing(out)).as("nothing added, nothing staged").isEqualTo(before);
        assertThat(Files.readString(out.resolve(older))).isEqualTo("older output");
        assertThat(Files.readString(blocker.resolve("keep.txt"))).isEqualTo("kept");
    }

    /** A short logged loop, settled at its setpoint. */
    static Path trace(Path dir) throws IOException {
        StringBuilder rows = new StringBuilder("time,setpoint,measurement,output\n");
        for (int k = 0; k < 50; k++) {
            rows.append(k).append(",1,1,0\n");
        }
        return Files.writeString(dir.resolve("trace.csv"), rows);
    }

    private static List<String> listing(Path dir) throws IOException {
        try (Stream<Path> files = Files.walk(dir)) {
            return files.map(p -> dir.relativize(p).toString()).sorted().toList();
        }
    }
}
