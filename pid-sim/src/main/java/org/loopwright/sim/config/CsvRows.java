package org.loopwright.sim.config;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.Reader;
import java.util.List;

/**
 * Reads the harness's CSV dialect ({@link InputText}: RFC 4180 quoting, {@code #} comment lines,
 * spaces around cells and empty lines ignored) one record at a time, and writes cells so that it
 * reads them back as written: the one reader of every CSV file the harness takes (traces, step
 * tests, logged loops). Hand-written rather than Apache Commons CSV for logs of millions of rows,
 * where a general parser's per-record objects were most of a replay's time; it keeps to that
 * dialect and nothing more. A quoted cell may span lines (the line break is read as {@code \n}).
 *
 * <p>Errors name the file, the line and the character. Not thread-safe; close the reader when done.
 */
public final class CsvRows implements AutoCloseable {

    private static final int BUFFER_CHARS = 1 << 16;

    private final String fileName;
    private final BufferedReader reader;
    private final StringBuilder quoted = new StringBuilder();
    private long lineNumber;
    private long recordNumber;

    /**
     * @param fileName how messages name the source
     * @param reader   the text, read from its current position
     */
    public CsvRows(String fileName, Reader reader) {
        this.fileName = fileName;
        this.reader = reader instanceof BufferedReader buffered ? buffered : new BufferedReader(reader, BUFFER_CHARS);
    }

    /** The number of the record last read, counting from 1 (comments and empty lines do not count). */
    public long recordNumber() {
        return recordNumber;
    }

    /**
     * Reads the next record into {@code cells} (cleared first).
     *
     * @return false, leaving {@code cells} as it was, at the end of the text
     * @throws InputFileException when the text cannot be read, a quoted cell is broken, or the record
     *                            passes {@link InputText#MAX_CELLS_PER_ROW} or {@link InputText#MAX_CELL_CHARS}
     */
    public boolean next(List<String> cells) {
        if (!read(cells)) {
            return false;
        }
        if (cells.size() > InputText.MAX_CELLS_PER_ROW) {
            throw InputFileException.whole(fileName, "row " + recordNumber + " has " + cells.size()
                    + " cells; the limit is " + InputText.MAX_CELLS_PER_ROW);
        }
        return true;
    }

    private boolean read(List<String> cells) {
        String line = readLine();
        while (line != null && (line.isEmpty() || line.charAt(0) == '#')) {
            line = readLine();
        }
        if (line == null) {
            return false;
        }
        recordNumber++;
        cells.clear();
        int i = 0;
        while (true) {
            int start = i;
            while (i < line.length() && line.charAt(i) != ',' && Character.isWhitespace(line.charAt(i))) {
                i++;
            }
            if (i < line.length() && line.charAt(i) == '"') {
                long openedOnLine = lineNumber;
                int openedAt = i + 1;
                quoted.setLength(0);
                i++;
                while (true) {
                    if (i == line.length()) {
                        line = readLine();
                        if (line == null) {
                            throw broken(openedOnLine, openedAt, "a quoted cell is not closed before the end of the file");
                        }
                        quoted.append('\n');
                        i = 0;
                        continue;
                    }
                    if (quoted.length() > InputText.MAX_CELL_CHARS) {
                        throw InputFileException.whole(fileName, "row " + recordNumber + ", cell " + (cells.size() + 1)
                                + " has more than " + InputText.MAX_CELL_CHARS + " characters; the limit for a cell is "
                                + InputText.MAX_CELL_CHARS);
                    }
                    char c = line.charAt(i++);
                    if (c != '"') {
                        quoted.append(c);
                    } else if (i < line.length() && line.charAt(i) == '"') {
                        quoted.append('"');
                        i++;
                    } else {
                        break;
                    }
                }
                while (i < line.length() && line.charAt(i) != ',' && Character.isWhitespace(line.charAt(i))) {
                    i++;
                }
                add(cells, quoted.toString());
                if (i == line.length()) {
                    return true;
                }
                if (line.charAt(i) != ',') {
                    throw broken(lineNumber, i + 1, "only a comma may follow a quoted cell's closing quote");
                }
                i++;
            } else {
                int comma = line.indexOf(',', i);
                add(cells, line.substring(start, comma < 0 ? line.length() : comma).strip());
                if (comma < 0) {
                    return true;
                }
                i = comma + 1;
            }
        }
    }

    /**
     * Appends a cell as this dialect reads it back: quoted (quotes doubled) when it holds a comma, a
     * quote or a line break, starts with a character up to {@code #} (a space, or a comment marker
     * at the start of a line), ends with a space, or is empty at the start of a record.
     *
     * @param first whether the cell starts the record (no comma before it)
     */
    public static void appendCell(StringBuilder out, String cell, boolean first) {
        if (!first) {
            out.append(',');
        }
        if (!needsQuotes(cell, first)) {
            out.append(cell);
            return;
        }
        out.append('"');
        for (int i = 0; i < cell.length(); i++) {
            char c = cell.charAt(i);
            out.append(c);
            if (c == '"') {
                out.append('"');
            }
        }
        out.append('"');
    }

    private static boolean needsQuotes(String cell, boolean first) {
        if (cell.isEmpty()) {
            return first;
        }
        if (cell.charAt(0) <= '#' || cell.charAt(cell.length() - 1) <= ' ') {
            return true;
        }
        for (int i = 0; i < cell.length(); i++) {
            char c = cell.charAt(i);
            if (c == ',' || c == '"' || c == '\n' || c == '\r') {
                return true;
            }
        }
        return false;
    }

    private void add(List<String> cells, String cell) {
        if (cell.length() > InputText.MAX_CELL_CHARS) {
            throw InputFileException.whole(fileName, "row " + recordNumber + ", cell " + (cells.size() + 1) + " has "
                    + cell.length() + " characters; the limit for a cell is " + InputText.MAX_CELL_CHARS);
        }
        cells.add(cell);
    }

    private String readLine() {
        try {
            String line = reader.readLine();
            if (line != null) {
                lineNumber++;
            }
            return line;
        } catch (IOException | RuntimeException e) {
            throw InputFileException.whole(fileName, "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    private InputFileException broken(long line, int character, String detail) {
        return InputFileException.at(fileName, (int) Math.min(line, Integer.MAX_VALUE), character,
                "not valid CSV: " + detail);
    }

    @Override
    public void close() throws IOException {
        reader.close();
    }
}
