package org.loopwright.sim.fuzz;

import static org.assertj.core.api.Assertions.fail;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import java.util.function.Consumer;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;
import net.jqwik.api.lifecycle.BeforeContainer;
import org.loopwright.pid.StateSnapshot;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.identify.StepTestFile;
import org.loopwright.sim.replay.TraceFile;
import org.loopwright.sim.scenario.ScenarioFile;

/**
 * Bounded fuzzing of the five readers (issue 11): seed files of each kind, mutated by jqwik (cut,
 * duplicate, insert hostile snippets: YAML tags, anchors, deep nesting, long digit runs, extreme and
 * non-finite numbers, control characters), must either read or fail with the reader's documented
 * input error ({@link InputFileException} for the files, {@link IllegalArgumentException} for the
 * snapshot text), and each input must be read within a second. Any other exception, or a hang, is a
 * defect. About 5,000 inputs per run of the suite.
 */
class ReaderFuzzProperties {

    private static final long LIMIT_MILLIS = 1_000;
    private static final Path SCENARIOS = Path.of("..", "scenarios");
    private static final ExecutorService READER = Executors.newSingleThreadExecutor(r -> {
        Thread t = new Thread(r, "fuzzed-reader");
        t.setDaemon(true);
        return t;
    });

    private static final List<String> SNIPPETS = List.of("*a", "&a ", "!!java.lang.Object ", "!!binary ", "{", "}",
            "[", "]", ":", ": ", "\n", "- ", "#", "'", "\"", ",", "1e308", "-1e308", "4.9e-324", "NaN", ".nan",
            "-.inf", "inf", "1".repeat(2_000), "\t", "\u0000", "\u00e9", "99999999999999999999", "-0", "0x10", "~",
            "null", "true", "---\n", "...\n", "key: value\n", "  nested:\n    deep: 1\n", "[".repeat(300),
            "{a: ".repeat(300), "<<: *a\n", "? complex\n", "%YAML 1.2\n", ",,,,,,,,,,", "\r\n", "\"\"\"",
            "2147483648", "-2147483649", "1.5e9", "0.0000001");

    /** One edit of a text: where (a share of its length), how much, and what is inserted. */
    record Edit(int kind, double at, int length, String snippet) {

        String applyTo(String text) {
            int from = (int) (at * text.length());
            int to = Math.min(text.length(), from + length);
            return switch (kind) {
                case 0 -> text.substring(0, from) + snippet + text.substring(from);
                case 1 -> text.substring(0, from) + text.substring(to);
                case 2 -> text.substring(0, to) + text.substring(from, to) + text.substring(to);
                case 3 -> text.substring(0, from) + snippet + text.substring(to);
                default -> text.substring(0, from);
            };
        }
    }

    @Provide
    Arbitrary<List<Edit>> edits() {
        Arbitrary<Edit> edit = Combinators.combine(Arbitraries.frequency(
                        net.jqwik.api.Tuple.of(4, 0), net.jqwik.api.Tuple.of(2, 1), net.jqwik.api.Tuple.of(1, 2),
                        net.jqwik.api.Tuple.of(3, 3), net.jqwik.api.Tuple.of(1, 4)),
                Arbitraries.doubles().between(0.0, 1.0).ofScale(4), Arbitraries.integers().between(0, 40),
                Arbitraries.oneOf(Arbitraries.of(SNIPPETS), Arbitraries.strings().ofMaxLength(6)))
                .as(Edit::new);
        return edit.list().ofMinSize(1).ofMaxSize(6);
    }

    private static String seed(String file) {
        try {
            return Files.readString(SCENARIOS.resolve(file), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static String mutated(String seed, List<Edit> edits) {
        String text = seed;
        for (Edit e : edits) {
            text = e.applyTo(text);
        }
        return text;
    }

    /** Reads the text within the limit; only the documented error may escape. */
    private static void readWithin(String text, Consumer<String> reader, Class<? extends RuntimeException> documented) {
        Future<?> read = READER.submit(() -> reader.accept(text));
        try {
            read.get(LIMIT_MILLIS, TimeUnit.MILLISECONDS);
        } catch (TimeoutException e) {
            read.cancel(true);
            fail("reading took more than %d ms: %s", LIMIT_MILLIS, abbreviated(text));
        } catch (ExecutionException e) {
            if (!documented.isInstance(e.getCause())) {
                throw new AssertionError("undocumented " + e.getCause() + " for: " + abbreviated(text), e.getCause());
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new AssertionError(e);
        }
    }

    private static String abbreviated(String text) {
        return text.length() <= 2_000 ? text : text.substring(0, 2_000) + "... (" + text.length() + " characters)";
    }

    @Property(tries = 1_000)
    void controllerFile(@ForAll("edits") List<Edit> edits) {
        String seed = seed("gimbal-controller.yaml");
        readWithin(mutated(seed, edits), t -> ControllerFile.read(YamlDocument.parse("c.yaml", t), ""),
                InputFileException.class);
    }

    @Property(tries = 1_000)
    void scenarioFile(@ForAll("edits") List<Edit> edits, @ForAll("scenarioSeeds") String seed) {
        readWithin(mutated(seed, edits), t -> ScenarioFile.read(YamlDocument.parse("s.yaml", t), SCENARIOS),
                InputFileException.class);
    }

    @Provide
    Arbitrary<String> scenarioSeeds() {
        return Arbitraries.of("booster-pump.yaml", "gimbal-axis.yaml", "on-off.yaml", "tank.yaml",
                "third-order-lag.yaml", "booster-pump-tank.yaml").map(ReaderFuzzProperties::seed);
    }

    @Property(tries = 1_000)
    void traceFile(@ForAll("edits") List<Edit> edits) {
        String seed = "time,setpoint,measurement,feedforward,mode,manual_output,track_value\n"
                + "0,1,0.5,0.1,auto,,\n0.1,1,0.6,0.1,auto,,\n0.2,1,nan,0.1,manual,40,\n0.3,1.5,0.7,,track,,35\n"
                + "0.4,1.5,inf,0.2,,,\n";
        readWithin(mutated(seed, edits), t -> TraceFile.parse("t.csv", t), InputFileException.class);
    }

    @Property(tries = 1_000)
    void stepTestFile(@ForAll("edits") List<Edit> edits) {
        String seed = seed("pump-step-test.csv");
        readWithin(mutated(seed.substring(0, Math.min(seed.length(), 4_000)), edits),
                t -> StepTestFile.parse("s.csv", t), InputFileException.class);
    }

    @Property(tries = 1_000)
    void snapshotText(@ForAll("edits") List<Edit> edits) {
        String seed = "loopwright-state=1\naction=reverse\noutput-kind=position\noutput-min=0.0\noutput-max=100.0\n"
                + "wrap-span=0.0\nmode=automatic\nstarted=true\nintegral=41.7\nderivative-state=0.5\n"
                + "previous-error=0.2\nprevious-setpoint=60.0\nprevious-measurement=59.8\nprevious-unlimited=43.0\n"
                + "previous-output=43.0\nprevious-feedforward=0.0\nfeedforward-applied=false\nmanual-value=43.0\n"
                + "fault-count=0\n";
        readWithin(mutated(seed, edits), StateSnapshot::parse, IllegalArgumentException.class);
    }

    /** Each reader once before the clock runs: loading and compiling the readers is not theirs to pay per input. */
    @BeforeContainer
    static void warmUp() {
        for (int i = 0; i < 20; i++) {
            for (String file : List.of("booster-pump.yaml", "gimbal-axis.yaml", "on-off.yaml", "tank.yaml")) {
                ScenarioFile.read(YamlDocument.parse("s.yaml", seed(file)), SCENARIOS);
            }
            ControllerFile.read(YamlDocument.parse("c.yaml", seed("gimbal-controller.yaml")), "");
            StepTestFile.parse("s.csv", seed("pump-step-test.csv"));
            TraceFile.parse("t.csv", "time,setpoint,measurement\n0,1,2\n0.1,1,2\n");
        }
    }

    @AfterContainer
    static void stopReader() {
        READER.shutdownNow();
    }
}
