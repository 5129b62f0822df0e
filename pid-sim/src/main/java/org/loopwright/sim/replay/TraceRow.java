package org.loopwright.sim.replay;

import java.util.ArrayList;
import java.util.List;

import org.loopwright.pid.Mode;

/**
 * One data row of a trace, as {@link TraceReader} fills it: a holder reused from row to row, so a
 * long trace is read in constant memory. A missing sample is NaN, a blank mode null; an optional
 * column the trace does not have reads NaN (null for the mode). Not thread-safe.
 */
public final class TraceRow {

    long number;
    double timeSeconds;
    double setpoint;
    double measurement;
    double feedforward;
    Mode mode;
    double manualOutput;
    double trackValue;
    double loggedOutput;
    final List<String> cells = new ArrayList<>();

    /** The row's number in the file, counting the header as row 1. */
    public long number() {
        return number;
    }

    /** The {@code time}, seconds. */
    public double timeSeconds() {
        return timeSeconds;
    }

    /** The {@code setpoint}; NaN for a missing sample. */
    public double setpoint() {
        return setpoint;
    }

    /** The {@code measurement}; NaN for a missing sample. */
    public double measurement() {
        return measurement;
    }

    /** The {@code feedforward}; NaN for a missing sample or when the column is absent. */
    public double feedforward() {
        return feedforward;
    }

    /** The {@code mode}, or null when blank or absent (no switch). */
    public Mode mode() {
        return mode;
    }

    /** The {@code manual_output}; NaN when blank or absent. */
    public double manualOutput() {
        return manualOutput;
    }

    /** The {@code track_value}; NaN when blank or absent. */
    public double trackValue() {
        return trackValue;
    }

    /** The logged controller {@code output}; NaN when blank or absent. */
    public double loggedOutput() {
        return loggedOutput;
    }

    /** The cells as written in the file. */
    public List<String> cells() {
        return cells;
    }
}
