package org.loopwright.sim.replay;

import java.io.Closeable;
import java.io.IOException;
import java.io.Reader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import org.loopwright.sim.config.CsvRows;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.InputText;

/**
 * Reads a trace in the format of {@link TraceFile} one row at a time, checking each row as it comes,
 * so a trace of any length is read in constant memory. Errors name the file, the row (the header is
 * row 1) and the column. Not thread-safe; close it when done.
 */
public final class TraceReader implements Closeable {

    private final String fileName;
    private final CsvRows rows;
    private final List<String> header;
    private final int time;
    private final int setpoint;
    private final int measurement;
    private final int feedforward;
    private final int mode;
    private final int manualOutput;
    private final int trackValue;
    private final int loggedOutput;

    private TraceReader(String fileName, Reader reader) {
        this.fileName = fileName;
        this.rows = new CsvRows(fileName, reader);
        List<String> names = new ArrayList<>();
        if (!rows.next(names)) {
            throw InputFileException.whole(fileName, "has no header row; required columns: "
                    + String.join(", ", TraceFile.REQUIRED_COLUMNS));
        }
        this.header = List.copyOf(names);
        checkHeader();
        time = header.indexOf("time");
        setpoint = header.indexOf("setpoint");
        measurement = header.indexOf("measurement");
        feedforward = header.indexOf("feedforward");
        mode = header.indexOf("mode");
        manualOutput = header.indexOf("manual_output");
        trackValue = header.indexOf("track_value");
        loggedOutput = header.indexOf(TraceFile.LOGGED_OUTPUT);
    }

    /**
     * Opens a trace file; the file is named in messages as given.
     *
     * @throws InputFileException when it cannot be read or its header is not allowed
     */
    public static TraceReader open(Path file) {
        return new TraceReader(file.toString(), InputText.open(file));
    }

    /**
     * Reads trace text from a reader.
     *
     * @param fileName how messages name the source
     * @throws InputFileException when the header is not allowed
     */
    public static TraceReader of(String fileName, Reader reader) {
        return new TraceReader(fileName, reader);
    }

    /** The file as messages name it. */
    public String fileName() {
        return fileName;
    }

    /** The column names, as in the header. */
    public List<String> header() {
        return header;
    }

    /** Whether the trace has a {@code feedforward} column. */
    public boolean hasFeedforward() {
        return feedforward >= 0;
    }

    /** Whether the trace has a {@code track_value} column. */
    public boolean hasTrackValue() {
        return trackValue >= 0;
    }

    /** Whether the trace has a logged controller {@code output} column. */
    public boolean hasLoggedOutput() {
        return loggedOutput >= 0;
    }

    /**
     * Reads the next data row into {@code row}.
     *
     * @return false, leaving {@code row} as it was, when there are no more rows
     * @throws InputFileException when the row's width or a cell is not allowed
     */
    public boolean next(TraceRow row) {
        List<String> cells = row.cells;
        if (!rows.next(cells)) {
            return false;
        }
        long number = rows.recordNumber();
        row.number = number;
        if (cells.size() != header.size()) {
            String column = cells.size() < header.size() ? header.get(cells.size()) : "#" + (header.size() + 1);
            throw InputFileException.inRow(fileName, number, column, "the row has " + cells.size()
                    + " cells; the header has " + header.size() + " columns");
        }
        row.timeSeconds = number(row, time, TraceFile.CellRule.FINITE);
        row.setpoint = number(row, setpoint, TraceFile.CellRule.SAMPLE);
        row.measurement = number(row, measurement, TraceFile.CellRule.SAMPLE);
        row.feedforward = number(row, feedforward, TraceFile.CellRule.SAMPLE);
        row.manualOutput = number(row, manualOutput, TraceFile.CellRule.KEEP);
        row.trackValue = number(row, trackValue, TraceFile.CellRule.KEEP);
        row.loggedOutput = number(row, loggedOutput, TraceFile.CellRule.SAMPLE);
        row.mode = null;
        if (mode >= 0 && !cells.get(mode).isEmpty()) {
            String cell = cells.get(mode);
            row.mode = TraceFile.MODES.value(cell).orElseThrow(() -> InputFileException.inRow(fileName, number, "mode",
                    "must be " + TraceFile.MODES.describe() + ", or blank to keep the mode: mode=" + cell));
        }
        return true;
    }

    private double number(TraceRow row, int index, TraceFile.CellRule rule) {
        if (index < 0) {
            return Double.NaN;
        }
        String cell = row.cells.get(index);
        double value = TraceFile.parseNumber(cell);
        if (!rule.accepts(cell, value)) {
            String name = header.get(index);
            throw InputFileException.inRow(fileName, row.number, name, rule.text() + ": " + name + "=" + cell);
        }
        return value;
    }

    private void checkHeader() {
        Set<String> seen = new HashSet<>();
        for (int i = 0; i < header.size(); i++) {
            String name = header.get(i);
            if (name.isEmpty()) {
                throw InputFileException.inRow(fileName, 1, "#" + (i + 1),
                        "the header gives this column no name; every column needs one");
            }
            if (!seen.add(name)) {
                throw InputFileException.inRow(fileName, 1, name, "appears twice in the header; each name may appear once");
            }
            if (TraceFile.RESERVED_COLUMNS.contains(name)) {
                throw InputFileException.inRow(fileName, 1, name, "is a column the replay writes ("
                        + String.join(", ", TraceFile.RESERVED_COLUMNS) + "); rename it in the trace");
            }
        }
        for (String required : TraceFile.REQUIRED_COLUMNS) {
            if (!seen.contains(required)) {
                throw InputFileException.inRow(fileName, 1, required, "required column is missing; the header has "
                        + String.join(", ", header) + "; required columns: "
                        + String.join(", ", TraceFile.REQUIRED_COLUMNS));
            }
        }
    }

    @Override
    public void close() throws IOException {
        rows.close();
    }
}
