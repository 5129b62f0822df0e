package org.loopwright.sim.cli;

import java.nio.file.Path;
import java.util.Optional;

import picocli.CommandLine.Option;

/**
 * The output options every command shares: {@code --out DIR} and {@code --json}. Without
 * {@code --out} a command that writes files uses a folder named after itself ({@code loopwright-simulate}),
 * never the working directory itself.
 */
final class OutputOptions {

    @Option(names = "--out", paramLabel = "DIR",
            description = "Directory for the files the command writes, created if need be (default: loopwright-<command>;"
                    + " compare writes plots and a report only when given one).")
    private Path directory;

    @Option(names = "--json", description = "Print the results as JSON instead of text.")
    private boolean json;

    /** @return whether JSON was asked for */
    boolean json() {
        return json;
    }

    /**
     * The directory to write into.
     *
     * @param command the command's name, for the default folder
     * @return the directory given, or {@code loopwright-<command>}
     */
    Path directory(String command) {
        return directory != null ? directory : Path.of("loopwright-" + command);
    }

    /** @return the directory given, if any (for a command that writes files only when asked) */
    Optional<Path> givenDirectory() {
        return Optional.ofNullable(directory);
    }
}
