package org.loopwright.sim.identify;

import java.nio.file.Path;
import java.util.List;

import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.InputText;

/**
 * Reads a step test from CSV (Apache Commons CSV): a header row naming the columns {@code time}
 * (seconds), {@code input} and {@code output}, in any order, then one row per sample with a finite
 * number in each of them; other columns are ignored and {@code #} starts a comment line. Times must
 * increase from row to row. Errors name the file, the row (the header is row 1) and the column.
 *
 * <p>Thread-safe: stateless.
 */
public final class StepTestFile {

    /** The columns a step test must have. */
    public static final List<String> COLUMNS = List.of("time", "input", "output");
    /** Fewest data rows that can show a step and a response. */
    public static final int MIN_ROWS = 10;

    private StepTestFile() {
    }

    /**
     * Reads a step-test file; messages name it as given.
     *
     * @throws InputFileException when the file cannot be read or a header or cell is not allowed
     */
    public static StepTest read(Path file) {
        return parse(file.toString(), InputText.read(file));
    }

    /**
     * Parses step-test text.
     *
     * @param fileName how messages name the source
     * @throws InputFileException when a header or cell is not allowed
     */
    public static StepTest parse(String fileName, String text) {
        List<List<String>> rows = InputText.csvRows(fileName, text, COLUMNS);
        List<String> header = rows.get(0);
        int[] index = new int[COLUMNS.size()];
        for (int c = 0; c < index.length; c++) {
            index[c] = header.indexOf(COLUMNS.get(c));
            if (index[c] < 0) {
                throw InputFileException.inRow(fileName, 1, COLUMNS.get(c), "required column is missing; the header has "
                        + String.join(", ", header) + "; required columns: " + String.join(", ", COLUMNS));
            }
        }
        int n = rows.size() - 1;
        if (n < MIN_ROWS) {
            throw InputFileException.whole(fileName, "has " + n + " data rows; a step test needs at least " + MIN_ROWS);
        }
        double[][] columns = new double[index.length][n];
        for (int i = 0; i < n; i++) {
            List<String> row = rows.get(i + 1);
            for (int c = 0; c < index.length; c++) {
                String name = COLUMNS.get(c);
                if (index[c] >= row.size()) {
                    throw InputFileException.inRow(fileName, i + 2, name, "the row has " + row.size()
                            + " cells; the header has " + header.size() + " columns");
                }
                String cell = row.get(index[c]);
                double value = parse(cell);
                if (!Double.isFinite(value)) {
                    throw InputFileException.inRow(fileName, i + 2, name, "must be a finite number: " + name + "=" + cell);
                }
                if (c == 0 && i > 0 && value <= columns[0][i - 1]) {
                    throw InputFileException.inRow(fileName, i + 2, name, "must increase from row to row: time="
                            + cell + " after " + rows.get(i).get(index[0]));
                }
                columns[c][i] = value;
            }
        }
        return new StepTest(fileName, columns[0], columns[1], columns[2]);
    }

    private static double parse(String cell) {
        try {
            return Double.parseDouble(cell);
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }
}
