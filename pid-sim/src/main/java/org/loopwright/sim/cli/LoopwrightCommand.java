package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.util.List;

import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.IoWords;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.TypeConversionException;

/**
 * The command-line harness: {@code java -jar loopwright.jar <command> ...}. Exit codes: 0 success,
 * 1 an internal error, 2 bad input (a file, an option or a value).
 */
@Command(name = "loopwright", mixinStandardHelpOptions = true, versionProvider = BuildVersion.class,
        description = "Verify a PID controller before it drives hardware: replay, simulate, analyse, tune.")
public final class LoopwrightCommand implements Runnable {

    /** The commands after {@code help}, in the order the usage lists them. */
    private static final List<Class<?>> COMMANDS = List.of(SimulateCommand.class, ReplayCommand.class,
            MarginsCommand.class, CompareCommand.class, TuneCommand.class, DesignCommand.class, IdentifyCommand.class,
            AutotuneCommand.class, SweepCommand.class, TimingCommand.class, AssessCommand.class);

    /** Exit code for bad input. */
    public static final int BAD_INPUT = 2;

    /** Exit code for an internal error (a defect of ours, not of the input). */
    public static final int INTERNAL_ERROR = 1;

    @CommandLine.Spec
    private CommandLine.Model.CommandSpec spec;

    /** No command is a usage error: the usage goes to standard error and the exit code is 2. */
    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(), "a command is required");
    }

    /** A command line with every command, this project's exit codes and error handling. */
    public static CommandLine commandLine() {
        CommandLine cli = withHandlers(new CommandLine(new LoopwrightCommand()));
        cli.addSubcommand(new CommandLine.HelpCommand());
        COMMANDS.forEach(command -> cli.addSubcommand(new CommandLine(command)));
        return cli;
    }

    /**
     * The command line that runs {@code args}: when the first argument names a command, with that command
     * alone (picocli reads a command's annotations as it builds it: about 0.2 s at a JVM's start for all
     * twelve); otherwise, for {@code help}, usage or an unknown name, with every command.
     */
    public static CommandLine forArguments(String... args) {
        if (args.length > 0) {
            for (Class<?> command : COMMANDS) {
                if (command.getAnnotation(Command.class).name().equals(args[0])) {
                    CommandLine cli = withHandlers(new CommandLine(new LoopwrightCommand()));
                    cli.addSubcommand(new CommandLine(command));
                    return cli;
                }
            }
        }
        return commandLine();
    }

    private static CommandLine withHandlers(CommandLine cli) {
        // the one path from bad input to exit 2: commands throw, never catch, their input errors (an
        // InputException, or a file-system error on a file named on the command line); anything else
        // is a defect of ours: exit 1 with the stack trace
        cli.setExecutionExceptionHandler((ex, cmd, parsed) -> {
            if (ex instanceof InputException) {
                cmd.getErr().println(ex.getMessage());
                return BAD_INPUT;
            }
            Throwable io = ex instanceof UncheckedIOException unchecked ? unchecked.getCause() : ex;
            if (io instanceof IOException) {
                String file = IoWords.file(io);
                cmd.getErr().println((file == null ? "" : file + ": ") + "cannot be read or written ("
                        + IoWords.of(io) + ")");
                return BAD_INPUT;
            }
            cmd.getErr().println("internal error, please report it with the command and its input:");
            ex.printStackTrace(cmd.getErr());
            return INTERNAL_ERROR;
        });
        cli.setParameterExceptionHandler((ex, args) -> {
            PrintWriter err = ex.getCommandLine().getErr();
            if (ex.getCause() instanceof TypeConversionException bad && ex.getArgSpec() instanceof OptionSpec option) {
                // a value the option's converter refused: said as every other bad value is, without the usage
                err.println(InputException.option(option.longestName(), ex.getValue(), bad.getMessage()).getMessage());
                return BAD_INPUT;
            }
            err.println(ex.getMessage());
            ex.getCommandLine().usage(err);
            return BAD_INPUT;
        });
        return cli;
    }

    /** Entry point of the shaded jar. */
    public static void main(String[] args) {
        System.exit(forArguments(args).execute(args));
    }
}
