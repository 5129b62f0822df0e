package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.PrintWriter;
import java.io.StringWriter;

import picocli.CommandLine;

/** One run of the command line in a test: exit code, standard output and standard error. */
record CommandRun(int exitCode, String out, String err) {

    static CommandRun of(String... args) {
        CommandLine cli = LoopwrightCommand.forArguments(args);
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cli.setOut(new PrintWriter(out));
        cli.setErr(new PrintWriter(err));
        int code = cli.execute(args);
        return new CommandRun(code, out.toString(), err.toString());
    }

    /** Runs the command line and checks the one shape of bad input: exit 2, the message alone, no output. */
    static void assertBadInput(String[] args, String message) {
        CommandRun run = of(args);
        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err().strip()).isEqualTo(message);
        assertThat(run.out()).isEmpty();
    }
}
