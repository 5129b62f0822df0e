package org.loopwright.bench.suite;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.concurrent.Callable;
import java.util.function.Supplier;
import java.util.stream.Stream;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

import picocli.CommandLine;

/** Bad durations are refused before anything runs, naming the option, the rule and the value. */
class CommandInputTest {

    static Stream<Arguments> badDurations() {
        Supplier<Callable<Integer>> suite = BenchmarkSuite::new;
        Supplier<Callable<Integer>> timing = LoopTimingProgram::new;
        return Stream.of(
                Arguments.of(suite, new String[] {"--timing-seconds", "0"},
                        "--timing-seconds must be finite and > 0: --timing-seconds=0.0"),
                Arguments.of(suite, new String[] {"--timing-seconds", "NaN"},
                        "--timing-seconds must be finite and > 0: --timing-seconds=NaN"),
                Arguments.of(timing, new String[] {"--seconds", "-1"},
                        "--seconds must be finite and > 0: --seconds=-1.0"),
                Arguments.of(timing, new String[] {"--seconds", "Infinity"},
                        "--seconds must be finite and > 0: --seconds=Infinity"));
    }

    @ParameterizedTest
    @MethodSource("badDurations")
    void refusesABadDuration(Supplier<Callable<Integer>> command, String[] args, String message) {
        StringWriter err = new StringWriter();
        CommandLine line = new CommandLine(command.get());
        line.setErr(new PrintWriter(err));
        assertThat(line.execute(args)).isEqualTo(CommandLine.ExitCode.USAGE);
        assertThat(err.toString()).startsWith(message + System.lineSeparator());
    }
}
