package org.loopwright.sim.replay;

import java.io.Closeable;
import java.io.IOException;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.Iterator;
import java.util.List;
import java.util.Set;

import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.InputText;
import org.loopwright.sim.config.IoWords;

/**
 * Reads a trace in the format of {@link TraceFile} one row at a time, checking each row as it comes,
 * so a trace of any length is read in constant memory. Errors name the file, the row (the header is
 * row 1) and the column. Not thread-safe; close it when done.
 */
public final class TraceReader implements Closeable {

    private final String fileName;
    private final CSVParser parser;
    private final Iterator<CSVRecord> records;
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
        this.parser = InputText.csvParser(fileName, reader);
        this.records = parser.iterator();
        if (!hasNextRecord()) {
            throw InputFileException.whole(fileName, "has no header row; required columns: "
                    + String.join(", ", TraceFile.REQUIRED_COLUMNS));
        }
        this.header = List.copyOf(InputText.withinLimits(fileName, 1, records.next().toList()));
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
        if (!hasNextRecord()) {
            return false;
        }
        CSVRecord record = nextRecord();
        long number = record.getRecordNumber();
        InputText.withinLimits(fileName, number, record.toList());
        if (record.size() != header.size()) {
            String column = record.size() < header.size() ? header.get(record.size()) : "#" + (header.size() + 1);
            throw InputFileException.inRow(fileName, number, column, "the row has " + record.size()
                    + " cells; the header has " + header.size() + " columns");
        }
        row.number = number;
        row.cells.clear();
        for (int i = 0; i < record.size(); i++) {
            row.cells.add(record.get(i));
        }
        row.timeSeconds = number(record, time, TraceFile.CellRule.FINITE);
        row.setpoint = number(record, setpoint, TraceFile.CellRule.SAMPLE);
        row.measurement = number(record, measurement, TraceFile.CellRule.SAMPLE);
        row.feedforward = number(record, feedforward, TraceFile.CellRule.SAMPLE);
        row.manualOutput = number(record, manualOutput, TraceFile.CellRule.KEEP);
        row.trackValue = number(record, trackValue, TraceFile.CellRule.KEEP);
        row.loggedOutput = number(record, loggedOutput, TraceFile.CellRule.SAMPLE);
        row.mode = null;
        if (mode >= 0 && !record.get(mode).isEmpty()) {
            String cell = record.get(mode);
            row.mode = TraceFile.MODES.value(cell).orElseThrow(() -> InputFileException.inRow(fileName, number, "mode",
                    "must be " + TraceFile.MODES.describe() + ", or blank to keep the mode: mode=" + cell));
        }
        return true;
    }

    private double number(CSVRecord record, int index, TraceFile.CellRule rule) {
        if (index < 0) {
            return Double.NaN;
        }
        String cell = record.get(index);
        double value = TraceFile.parseNumber(cell);
        if (!rule.accepts(cell, value)) {
            String name = header.get(index);
            throw InputFileException.inRow(fileName, record.getRecordNumber(), name, rule.text() + ": " + name + "="
                    + cell);
        }
        return value;
    }

    private boolean hasNextRecord() {
        try {
            return records.hasNext();
        } catch (UncheckedIOException | IllegalStateException e) {
            throw unreadable(e);
        }
    }

    private CSVRecord nextRecord() {
        try {
            return records.next();
        } catch (UncheckedIOException | IllegalStateException e) {
            throw unreadable(e);
        }
    }

    private InputFileException unreadable(RuntimeException e) {
        Throwable cause = e.getCause() != null ? e.getCause() : e;
        return InputFileException.whole(fileName, "not valid CSV (" + IoWords.of(cause) + ")", e);
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
        parser.close();
    }
}
