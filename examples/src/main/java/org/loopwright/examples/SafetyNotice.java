package org.loopwright.examples;

import java.io.PrintStream;

/** The caution that every example prints before it starts. */
final class SafetyNotice {

    /** Two lines: what the library is not, and what stays in place around it. */
    static final String TEXT = "CAUTION: Loopwright is not a safety-rated component. Keep independent hardware interlocks"
            + " (over-temperature cut-out, pressure relief, limit switches, emergency stop).\n"
            + "Try settings in simulation and at reduced power first; local codes and licensed practice take precedence.";

    private SafetyNotice() {
    }

    static void print(PrintStream out) {
        out.println(TEXT);
        out.println();
    }
}
