package org.loopwright.sim.cli;

import java.nio.file.Path;
import java.util.Optional;

import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * The output options of the commands that write files: {@code --out DIR} and {@code --json}. A command
 * that always writes files uses, without {@code --out}, a folder named after itself
 * ({@code loopwright-simulate}), never the working directory itself ({@link #directory()}); one whose files
 * are extras (plots, a report) writes them only when {@code --out} is given ({@link #givenDirectory()}).
 */
final class OutputOptions {

    @Spec(Spec.Target.MIXEE)
    private CommandSpec command;

    @Mixin
    private JsonOption json;

    @Option(names = "--out", paramLabel = "DIR",
            description = "Directory for the files the command writes, created if need be (default:"
                    + " loopwright-<command>; compare, assess and timing write no files without it).")
    private Path directory;

    /** @return whether JSON was asked for */
    boolean json() {
        return json.json();
    }

    /** @return the directory given, or {@code loopwright-<command>} */
    Path directory() {
        return givenDirectory().orElse(Path.of("loopwright-" + command.name()));
    }

    /** @return the directory given, if any (for a command that writes files only when asked) */
    Optional<Path> givenDirectory() {
        return Optional.ofNullable(directory);
    }

    /**
     * A stage in the directory given, if any, or else in {@link #directory()}; a directory that cannot be
     * written is bad input naming {@code --out}.
     */
    OutputStage stage() {
        return OutputStage.in(directory(), "--out");
    }
}
