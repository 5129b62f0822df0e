package org.loopwright.sim.cli;

import picocli.CommandLine.Option;

/**
 * The {@code --json} option, declared once: alone for the commands that print their results but write
 * no files (tune, autotune, margins), and inside {@link OutputOptions} for those that also write files.
 */
final class JsonOption {

    @Option(names = "--json", description = "Print the results as JSON instead of text.")
    private boolean json;

    /** @return whether JSON was asked for */
    boolean json() {
        return json;
    }
}
