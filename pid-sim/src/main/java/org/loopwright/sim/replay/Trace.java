package org.loopwright.sim.replay;

import java.util.List;

import org.loopwright.pid.Mode;

/**
 * A logged trace as read by {@link TraceFile}: the cells of every row as written (so they can be
 * passed through to the output) and the signals the replay feeds to the controller. A missing
 * sample (a blank or {@code nan} cell) is {@link Double#NaN}; a blank mode cell is {@code null}
 * (the mode stays as it was).
 *
 * <p>Thread-safe: immutable.
 */
public final class Trace {

    private final String fileName;
    private final List<String> header;
    private final List<TraceRow> rows;
    private final boolean hasFeedforward;
    private final boolean hasTrackValue;
    private final boolean hasLoggedOutput;

    Trace(String fileName, List<String> header, List<TraceRow> rows, boolean hasFeedforward, boolean hasTrackValue,
            boolean hasLoggedOutput) {
        this.fileName = fileName;
        this.header = List.copyOf(header);
        this.rows = List.copyOf(rows);
        this.hasFeedforward = hasFeedforward;
        this.hasTrackValue = hasTrackValue;
        this.hasLoggedOutput = hasLoggedOutput;
    }

    /** The file as messages name it. */
    public String fileName() {
        return fileName;
    }

    /** The column names, as in the file's header. */
    public List<String> header() {
        return header;
    }

    /** The number of data rows. */
    public int rowCount() {
        return rows.size();
    }

    /** A data row (from 0), as read. */
    TraceRow row(int row) {
        return rows.get(row);
    }

    /** The cells of a data row (from 0) as written in the file. */
    public List<String> cells(int row) {
        return List.copyOf(rows.get(row).cells());
    }

    /** The {@code time} of a row in seconds. */
    public double timeSeconds(int row) {
        return rows.get(row).timeSeconds();
    }

    /** The {@code setpoint} of a row; NaN for a missing sample. */
    public double setpoint(int row) {
        return rows.get(row).setpoint();
    }

    /** The {@code measurement} of a row; NaN for a missing sample. */
    public double measurement(int row) {
        return rows.get(row).measurement();
    }

    /** Whether the trace has a {@code feedforward} column (the replay switches feedforward on when it has). */
    public boolean hasFeedforward() {
        return hasFeedforward;
    }

    /** The {@code feedforward} of a row; NaN for a missing sample or when the column is absent. */
    public double feedforward(int row) {
        return rows.get(row).feedforward();
    }

    /** The {@code mode} of a row, or null when the cell is blank or the column absent (no switch). */
    public Mode mode(int row) {
        return rows.get(row).mode();
    }

    /** The {@code manual_output} of a row; NaN when blank or absent (the operator's output stays). */
    public double manualOutput(int row) {
        return rows.get(row).manualOutput();
    }

    /** Whether the trace has a {@code track_value} column. */
    public boolean hasTrackValue() {
        return hasTrackValue;
    }

    /** The {@code track_value} of a row; NaN when blank or absent. */
    public double trackValue(int row) {
        return rows.get(row).trackValue();
    }

    /** Whether the trace has a logged controller {@code output} column. */
    public boolean hasLoggedOutput() {
        return hasLoggedOutput;
    }

    /** The logged {@code output} of a row; NaN when blank or absent. */
    public double loggedOutput(int row) {
        return rows.get(row).loggedOutput();
    }
}
