package org.loopwright.sim.config;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Reading the text of an input file, and splitting a CSV text into rows, with every failure as an
 * {@link InputFileException} that names the file. One CSV dialect for every table the harness reads:
 * RFC 4180, {@code #} comment lines, spaces around cells and empty lines ignored, read by {@link CsvRows}.
 *
 * <p>Thread-safe: stateless.
 */
public final class InputText {

    /** The largest input file read whole, in bytes (64 MiB): a bound on the memory a small command line can ask for. */
    public static final long MAX_FILE_BYTES = 64L << 20;
    /** The most characters in one CSV cell: a number needs fewer than 30, a word fewer than 20. */
    public static final int MAX_CELL_CHARS = 1_000;
    /** The most cells in one CSV row. */
    public static final int MAX_CELLS_PER_ROW = 100;

    private InputText() {
    }

    /**
     * The whole file as UTF-8 text.
     *
     * @throws InputFileException naming the file when it cannot be read or is larger than {@link #MAX_FILE_BYTES}
     */
    public static String read(Path file) {
        try {
            long size = Files.size(file);
            if (size > MAX_FILE_BYTES) {
                throw InputFileException.whole(file.toString(), "is " + size + " bytes; the limit for an input file is "
                        + MAX_FILE_BYTES + " bytes");
            }
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException | RuntimeException e) {
            if (e instanceof InputFileException known) {
                throw known;
            }
            throw InputFileException.whole(file.toString(), "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    /**
     * A reader of the file's UTF-8 text, for reading a large file a row at a time.
     *
     * @throws InputFileException naming the file when it cannot be opened
     */
    public static Reader open(Path file) {
        try {
            return Files.newBufferedReader(file, StandardCharsets.UTF_8);
        } catch (IOException | RuntimeException e) {
            throw InputFileException.whole(file.toString(), "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    /**
     * The rows of a CSV text, the header first, read by {@link CsvRows}.
     *
     * @param fileName        how messages name the source
     * @param requiredColumns named in the message when there is no header row
     * @throws InputFileException when the text is not valid CSV (naming the line and character), has
     *                            no header row, or has a row of more than {@link #MAX_CELLS_PER_ROW}
     *                            cells or a cell of more than {@link #MAX_CELL_CHARS} characters
     */
    public static List<List<String>> csvRows(String fileName, String text, List<String> requiredColumns) {
        List<List<String>> rows = new ArrayList<>();
        CsvRows reader = new CsvRows(fileName, new StringReader(text));
        List<String> cells = new ArrayList<>();
        while (reader.next(cells)) {
            rows.add(List.copyOf(cells));
        }
        if (rows.isEmpty()) {
            throw InputFileException.whole(fileName, "has no header row; required columns: "
                    + String.join(", ", requiredColumns));
        }
        return rows;
    }
}
