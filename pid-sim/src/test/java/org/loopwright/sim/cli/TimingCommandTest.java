package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.List;
import java.util.stream.Stream;

import org.HdrHistogram.HistogramLogReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The {@code timing} command: a smoke run of the demo at 1 kHz for 2 s asserting the shape of its
 * JSON and its files only, never a time (times depend on the machine); bad input exits 2 naming the
 * option and the value.
 */
class TimingCommandTest {

    private static final List<String> FIGURES = List.of("rate_hz", "wait", "ticks", "overruns", "skipped",
            "cpu_share", "update_ns", "period_error_us");

    @Test
    void theDemoAtOneKilohertzGivesTheDocumentedJsonAndFiles(@TempDir Path out) throws Exception {
        CommandRun run = CommandRun.of("timing", "--rate", "1000", "--seconds", "2", "--json", "--out",
                out.toString());
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode json = new ObjectMapper().readTree(run.out());
        assertThat(fieldNames(json)).containsExactly("caution", "rate_hz", "wait", "ticks", "overruns", "skipped",
                "cpu_share", "update_ns", "period_error_us", "baseline", "budget_us", "verdict", "verdict_reason");
        assertThat(fieldNames(json.get("baseline"))).containsExactlyElementsOf(FIGURES);
        for (JsonNode figures : List.of(json, json.get("baseline"))) {
            assertThat(fieldNames(figures.get("period_error_us"))).containsExactly("p50", "p99", "p99_9", "max");
            assertThat(figures.get("rate_hz").asDouble()).isEqualTo(1000.0);
            assertThat(figures.get("ticks").asLong()).isPositive();
        }
        assertThat(json.get("wait").asText()).isEqualTo("park-then-spin");
        assertThat(json.get("baseline").get("wait").asText()).isEqualTo("busy-wait");
        assertThat(json.get("budget_us").asDouble()).isEqualTo(100.0);
        assertThat(json.get("verdict").asText()).isIn("within-budget", "over-budget");
        assertThat(Files.size(out.resolve("period-error.png"))).isPositive();
        try (HistogramLogReader log = new HistogramLogReader(out.resolve("period-error.hlog").toFile())) {
            assertThat(log.nextIntervalHistogram().getTag()).isEqualTo("runner");
            assertThat(log.nextIntervalHistogram().getTag()).isEqualTo("baseline");
        }
        try (Stream<Path> files = Files.list(out)) {
            assertThat(files.map(p -> p.getFileName().toString()))
                    .containsExactlyInAnyOrder("period-error.png", "period-error.hlog");
        }
    }

    private static List<String> fieldNames(JsonNode node) {
        Iterator<String> names = node.fieldNames();
        List<String> list = new java.util.ArrayList<>();
        names.forEachRemaining(list::add);
        return list;
    }

    static Stream<Arguments> badInput() {
        return Stream.of(
                Arguments.of(new String[] {"timing"},
                        "--rate is required without --controller (the demo controller runs at the rate given)"),
                Arguments.of(new String[] {"timing", "--rate", "0"},
                        "--rate must be > 0 and at most 100000 Hz: --rate=0.0"),
                Arguments.of(new String[] {"timing", "--rate", "1000", "--wait", "hybrid"},
                        "--wait must be one of park, spin, park-then-spin: --wait=hybrid"),
                Arguments.of(new String[] {"timing", "--rate", "1000", "--seconds", "0.1"},
                        "--seconds must be between 0.5 and 600.0: --seconds=0.1"),
                Arguments.of(new String[] {"timing", "--rate", "1", "--seconds", "50"},
                        "--seconds must cover at least 100 periods (100.0 s at this rate): --seconds=50.0"),
                Arguments.of(new String[] {"timing", "--rate", "1000", "--margin-us", "-1"},
                        "--margin-us must be between 0 and 1000000: --margin-us=-1.0"));
    }

    @ParameterizedTest
    @MethodSource("badInput")
    void badInputExitsTwoNamingTheOptionAndValue(String[] args, String message) {
        CommandRun run = CommandRun.of(args);
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).startsWith(message);
    }

    @Test
    void aRateThatDisagreesWithTheControllerFileIsRefused(@TempDir Path dir) throws Exception {
        Path controller = dir.resolve("c.yaml");
        Files.writeString(controller, "form: ideal\ngain: 1.0\nsample-period: 0.005\n");
        CommandRun run = CommandRun.of("timing", "--controller", controller.toString(), "--rate", "1000");
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).startsWith("--rate must match the controller file's sample period (the loop runs at"
                + " the controller's period; leave --rate out to use it): sample-period=0.005 s in " + controller
                + " is 200 Hz, --rate=1000.0");
    }
}
