package org.loopwright.sim.cli;

import picocli.CommandLine.Option;

/**
 * The {@code --no-progress} option of the long-running commands (sweep, design), declared once with the
 * one rule for when a progress bar is drawn.
 */
final class ProgressOption {

    @Option(names = "--no-progress",
            description = "No progress bar (it is drawn on standard error only at a console, and never with --json).")
    private boolean off;

    /**
     * A bar over {@code steps} on standard error, or none: with --no-progress, with --json (standard output is
     * then for a program) or without a console.
     */
    SweepProgress progress(boolean json, int steps) {
        return json || off || System.console() == null ? SweepProgress.off() : SweepProgress.on(System.err, steps);
    }
}
