package org.loopwright.sim.identify;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import com.fasterxml.jackson.core.io.NumberInput;
import org.loopwright.sim.config.CsvRows;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.InputText;
import org.loopwright.sim.config.IoWords;

/**
 * Reads a step test from CSV (the harness's dialect, {@link CsvRows}): a header row naming the columns {@code time}
 * (seconds), {@code input} and {@code output}, in any order, then one row per sample with a finite
 * number in each of them; other columns are ignored and {@code #} starts a comment line. Times must
 * increase from row to row. Errors name the file, the row (the header is row 1) and the column.
 *
 * <p>Thread-safe: stateless.
 */
public final class StepTestFile {

    /** The columns a step test must have. */
    public static final List<String> COLUMNS = List.of("time", "input", "output");
    /**
     * A record is fitted on at most twice this many rows: a longer one is thinned as it is read (the
     * fit's work and memory stay bounded; the timing resolution becomes the stride times the period).
     */
    public static final int FIT_ROWS = 10_000;
    /** Fewest data rows that can show a step and a response. */
    public static final int MIN_ROWS = 10;

    private StepTestFile() {
    }

    /**
     * Reads a step-test file a row at a time; messages name it as given. A record longer than
     * {@link #FIT_ROWS} rows is thinned as it is read to every k-th row (k a power of two), so memory
     * stays bounded whatever the file's length.
     *
     * @throws InputFileException when the file cannot be read or a header or cell is not allowed
     */
    public static StepTest read(Path file) {
        try (Reader reader = InputText.open(file)) {
            return read(file.toString(), reader);
        } catch (IOException e) {
            throw InputFileException.whole(file.toString(), "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    /**
     * Parses step-test text.
     *
     * @param fileName how messages name the source
     * @throws InputFileException when a header or cell is not allowed
     */
    public static StepTest parse(String fileName, String text) {
        return read(fileName, new StringReader(text));
    }

    private static StepTest read(String fileName, Reader reader) {
        CsvRows rows = new CsvRows(fileName, reader);
        List<String> header = new ArrayList<>();
        if (!rows.next(header)) {
            throw InputFileException.whole(fileName, "has no header row; required columns: "
                    + String.join(", ", COLUMNS));
        }
        int[] index = new int[COLUMNS.size()];
        for (int c = 0; c < index.length; c++) {
            index[c] = header.indexOf(COLUMNS.get(c));
            if (index[c] < 0) {
                throw InputFileException.inRow(fileName, 1, COLUMNS.get(c), "required column is missing; the"
                        + " header has " + String.join(", ", header) + "; required columns: "
                        + String.join(", ", COLUMNS));
            }
        }
        Thinned kept = new Thinned();
        List<String> row = new ArrayList<>();
        double[] values = new double[index.length];
        double previousTime = Double.NEGATIVE_INFINITY;
        String previousCell = "";
        while (rows.next(row)) {
            long number = rows.recordNumber();
            for (int c = 0; c < index.length; c++) {
                String name = COLUMNS.get(c);
                if (index[c] >= row.size()) {
                    throw InputFileException.inRow(fileName, number, name, "the row has " + row.size()
                            + " cells; the header has " + header.size() + " columns");
                }
                String cell = row.get(index[c]);
                double value = parse(cell);
                if (!Double.isFinite(value)) {
                    throw InputFileException.inRow(fileName, number, name, "must be a finite number: " + name
                            + "=" + cell);
                }
                if (c == 0 && value <= previousTime) {
                    throw InputFileException.inRow(fileName, number, name, "must increase from row to row: time="
                            + cell + " after " + previousCell);
                }
                values[c] = value;
            }
            previousTime = values[0];
            previousCell = row.get(index[0]);
            kept.add(values[0], values[1], values[2]);
        }
        if (kept.rows < MIN_ROWS) {
            throw InputFileException.whole(fileName, "has " + kept.rows + " data rows; a step test needs at least "
                    + MIN_ROWS);
        }
        return kept.toStepTest(fileName);
    }

    /**
     * The rows kept of a record read a row at a time: all of them up to 2·{@link #FIT_ROWS}; beyond,
     * every other kept row is dropped and the stride doubles, so at most 2·FIT_ROWS are held. A row at
     * which the input changes, and the row before it, are pinned and never dropped (up to FIT_ROWS/2 of
     * them), so the step's time stays exact.
     */
    private static final class Thinned {
        double[] time = new double[1024];
        double[] input = new double[1024];
        double[] output = new double[1024];
        boolean[] pinned = new boolean[1024];
        int size;
        int pinnedCount;
        int stride = 1;
        long rows;
        double lastTime;
        double lastInput;
        double lastOutput;
        boolean lastKept;

        void add(double t, double u, double y) {
            long index = rows++;
            boolean change = index > 0 && u != lastInput && pinnedCount < FIT_ROWS / 2;
            if (change && !lastKept) {
                append(lastTime, lastInput, lastOutput, true);
            }
            boolean keep = change || index % stride == 0;
            if (keep) {
                append(t, u, y, change);
            }
            lastTime = t;
            lastInput = u;
            lastOutput = y;
            lastKept = keep;
        }

        private void append(double t, double u, double y, boolean pin) {
            if (size == 2 * FIT_ROWS) {
                compact();
            }
            if (size == time.length) {
                int capacity = Math.min(2 * size, 2 * FIT_ROWS);
                time = Arrays.copyOf(time, capacity);
                input = Arrays.copyOf(input, capacity);
                output = Arrays.copyOf(output, capacity);
                pinned = Arrays.copyOf(pinned, capacity);
            }
            time[size] = t;
            input[size] = u;
            output[size] = y;
            pinned[size] = pin;
            pinnedCount += pin ? 1 : 0;
            size++;
        }

        /** Drops every other row that is not pinned and doubles the stride. */
        private void compact() {
            int kept = 0;
            boolean drop = false;
            for (int i = 0; i < size; i++) {
                if (pinned[i] || !drop) {
                    time[kept] = time[i];
                    input[kept] = input[i];
                    output[kept] = output[i];
                    pinned[kept] = pinned[i];
                    kept++;
                }
                drop = !pinned[i] && !drop;
            }
            size = kept;
            stride *= 2;
        }

        StepTest toStepTest(String fileName) {
            return new StepTest(fileName, Arrays.copyOf(time, size), Arrays.copyOf(input, size),
                    Arrays.copyOf(output, size), rows, stride);
        }
    }

    /** What {@link Double#parseDouble} reads, by Jackson's fast parser (same grammar, correctly rounded); NaN otherwise. */
    private static double parse(String cell) {
        try {
            return NumberInput.parseDouble(cell, true);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }
}
