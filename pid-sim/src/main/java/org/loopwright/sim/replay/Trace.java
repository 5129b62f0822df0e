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
    private final List<List<String>> cells;
    private final double[] timeSeconds;
    private final double[] setpoint;
    private final double[] measurement;
    private final double[] feedforward;
    private final Mode[] mode;
    private final double[] manualOutput;
    private final double[] trackValue;

    Trace(String fileName, List<String> header, List<List<String>> cells, double[] timeSeconds, double[] setpoint,
            double[] measurement, double[] feedforward, Mode[] mode, double[] manualOutput, double[] trackValue) {
        this.fileName = fileName;
        this.header = List.copyOf(header);
        this.cells = List.copyOf(cells);
        this.timeSeconds = timeSeconds;
        this.setpoint = setpoint;
        this.measurement = measurement;
        this.feedforward = feedforward;
        this.mode = mode;
        this.manualOutput = manualOutput;
        this.trackValue = trackValue;
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
        return timeSeconds.length;
    }

    /** The cells of a data row (from 0) as written in the file. */
    public List<String> cells(int row) {
        return cells.get(row);
    }

    /** The {@code time} of a row in seconds. */
    public double timeSeconds(int row) {
        return timeSeconds[row];
    }

    /** The {@code setpoint} of a row; NaN for a missing sample. */
    public double setpoint(int row) {
        return setpoint[row];
    }

    /** The {@code measurement} of a row; NaN for a missing sample. */
    public double measurement(int row) {
        return measurement[row];
    }

    /** Whether the trace has a {@code feedforward} column (the replay switches feedforward on when it has). */
    public boolean hasFeedforward() {
        return feedforward != null;
    }

    /** The {@code feedforward} of a row; NaN for a missing sample or when the column is absent. */
    public double feedforward(int row) {
        return feedforward == null ? Double.NaN : feedforward[row];
    }

    /** The {@code mode} of a row, or null when the cell is blank or the column absent (no switch). */
    public Mode mode(int row) {
        return mode == null ? null : mode[row];
    }

    /** The {@code manual_output} of a row; NaN when blank or absent (the operator's output stays). */
    public double manualOutput(int row) {
        return manualOutput == null ? Double.NaN : manualOutput[row];
    }

    /** Whether the trace has a {@code track_value} column. */
    public boolean hasTrackValue() {
        return trackValue != null;
    }

    /** The {@code track_value} of a row; NaN when blank or absent. */
    public double trackValue(int row) {
        return trackValue == null ? Double.NaN : trackValue[row];
    }
}
