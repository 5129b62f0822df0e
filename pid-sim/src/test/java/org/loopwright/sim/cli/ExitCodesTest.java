package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.concurrent.Callable;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.sim.config.InputException;

import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * One error path (issue 12): a command throws, never catches, its input errors; the one handler in
 * {@link LoopwrightCommand} turns an {@link InputException} (or an unreadable file named on the command
 * line) into exit 2 with the message alone, and anything else into exit 1 with the stack trace. Exit
 * codes 2 for bad input and 1 for our own defects are common practice for command-line tools.
 */
class ExitCodesTest {

    static Stream<Arguments> badInput() {
        String scenario = FrequencyCommandsTest.scenario("third-order-p.yaml");
        return Stream.of(
                // a word a converter refuses: the option, the words allowed, the value; no usage dump
                Arguments.of(new String[] {"tune", "--ultimate-gain", "2", "--ultimate-period", "3", "--type", "p"},
                        "--type must be one of pi, pid: --type=p"),
                Arguments.of(new String[] {"design", "--process-gain", "2", "--time-constant", "5", "--dead-time", "1",
                        "--sample-period", "0.1", "--derivative-method", "central"},
                        "--derivative-method must be one of backward-euler, tustin, step-invariant, ramp-invariant,"
                                + " forward-euler: --derivative-method=central"),
                // a range checked by the command
                Arguments.of(new String[] {"timing", "--rate", "1000", "--margin-us", "-1"},
                        "--margin-us must be between 0 and 1000000: --margin-us=-1.0"),
                // a value a model refuses, said in option terms
                Arguments.of(new String[] {"tune", "--ultimate-gain", "-2", "--ultimate-period", "3"},
                        "--ultimate-gain must be finite and > 0: --ultimate-gain=-2.0"),
                // sweep's own ranges, through the same path (it caught them itself before)
                Arguments.of(new String[] {"sweep", scenario, "--runs", "0"}, "--runs must be from 1 to 10000: --runs=0"),
                // a file that does not exist
                Arguments.of(new String[] {"margins", scenario + ".missing"},
                        scenario + ".missing: cannot be read (no such file or directory)"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("badInput")
    void badInputExitsTwoWithTheMessageAlone(String[] args, String message) {
        CommandRun.assertBadInput(args, message);
    }

    @Test
    void anUnknownOptionIsBadInputWithTheUsage() {
        CommandRun run = CommandRun.of("margins", "a.yaml", "--no-such-option");

        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err()).contains("Unknown option: '--no-such-option'").contains("Usage: loopwright margins");
    }

    @Test
    void anInputExceptionIsExitTwoAndAnyOtherExceptionIsExitOne() {
        assertThat(runThrowing(new InputException("--x must be > 0: --x=-1")))
                .isEqualTo(new CommandRun(2, "", "--x must be > 0: --x=-1\n"));

        // an IllegalArgumentException is a refusal we did not turn into input terms: our defect, not the user's
        CommandRun refused = runThrowing(new IllegalArgumentException("factor must be > 0"));
        assertThat(refused.exitCode()).isEqualTo(LoopwrightCommand.INTERNAL_ERROR);
        assertThat(refused.err()).startsWith("internal error, please report it").contains("factor must be > 0", "\tat ");

        CommandRun defect = runThrowing(new IllegalStateException("a table always has a row"));
        assertThat(defect.exitCode()).isEqualTo(LoopwrightCommand.INTERNAL_ERROR);
        assertThat(defect.err()).contains("IllegalStateException: a table always has a row");
    }

    @Test
    void aSuccessfulCommandExitsZero() {
        CommandRun run = CommandRun.of("tune", "--ultimate-gain", "2", "--ultimate-period", "3", "--rule",
                "tyreus-luyben");

        assertThat(run.exitCode()).as(run.err()).isZero();
    }

    /** Runs a command that throws {@code failure} through the harness's own handlers. */
    private static CommandRun runThrowing(RuntimeException failure) {
        CommandLine cli = LoopwrightCommand.commandLine();
        cli.addSubcommand("fail", new CommandLine(new Failing(failure)));
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cli.setOut(new PrintWriter(out));
        cli.setErr(new PrintWriter(err));
        int code = cli.execute("fail");
        return new CommandRun(code, out.toString(), err.toString().replace(System.lineSeparator(), "\n"));
    }

    @Command(name = "fail")
    private static final class Failing implements Callable<Integer> {
        private final RuntimeException failure;

        Failing(RuntimeException failure) {
            this.failure = failure;
        }

        @Override
        public Integer call() {
            throw failure;
        }
    }
}
