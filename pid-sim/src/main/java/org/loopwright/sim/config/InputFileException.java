package org.loopwright.sim.config;

/**
 * A bad input file: a YAML file, a CSV trace or any other file the harness reads. The message
 * names the file, where in it the problem is, and what is wrong and what is allowed, in one of
 * three shapes:
 * <pre>
 *   bath.yaml:4:1: gain must be finite and &gt;= 0: gain=-2
 *   trace.csv: row 7, column 'measurement': must be a number, blank or nan: measurement=abc
 *   trace.csv: cannot be read (no such file or directory)
 * </pre>
 * Lines, columns and CSV rows count from 1, as an editor or a spreadsheet shows them (the header
 * of a CSV file is row 1). The command line turns this exception into exit code 2.
 */
public final class InputFileException extends InputException {

    private static final long serialVersionUID = 1L;

    private final String file;
    private final int line;
    private final int column;
    private final long row;
    private final String columnName;
    private final String detail;

    private InputFileException(String message, String file, int line, int column, long row, String columnName,
            String detail, Throwable cause) {
        super(message, cause);
        this.file = file;
        this.line = line;
        this.column = column;
        this.row = row;
        this.columnName = columnName;
        this.detail = detail;
    }

    /**
     * A problem at a line and column of a text file.
     *
     * @param file   the file as the user named it
     * @param line   line, from 1
     * @param column column, from 1
     * @param detail what is wrong and what is allowed
     */
    public static InputFileException at(String file, int line, int column, String detail) {
        return new InputFileException(file + ":" + line + ":" + column + ": " + detail, file, line, column, 0, null,
                detail, null);
    }

    /**
     * A problem in one cell of a CSV file.
     *
     * @param file       the file as the user named it
     * @param row        row, from 1 (the header is row 1)
     * @param columnName the column's name from the header
     * @param detail     what is wrong and what is allowed
     */
    public static InputFileException inRow(String file, long row, String columnName, String detail) {
        return new InputFileException(file + ": row " + row + ", column '" + columnName + "': " + detail, file, 0, 0,
                row, columnName, detail, null);
    }

    /**
     * A problem with the file as a whole (empty, no data).
     *
     * @param file   the file as the user named it
     * @param detail what is wrong
     */
    public static InputFileException whole(String file, String detail) {
        return whole(file, detail, null);
    }

    /**
     * A problem with the file as a whole (missing, unreadable), with its cause.
     *
     * @param file   the file as the user named it
     * @param detail what is wrong
     * @param cause  the underlying error, or null
     */
    public static InputFileException whole(String file, String detail, Throwable cause) {
        return new InputFileException(file + ": " + detail, file, 0, 0, 0, null, detail, cause);
    }

    /** The file as the user named it. */
    public String file() {
        return file;
    }

    /** The line, from 1, or 0 when the problem is not at a line of a text file. */
    public int line() {
        return line;
    }

    /** The column, from 1, or 0 when the problem is not at a line of a text file. */
    public int column() {
        return column;
    }

    /** The CSV row, from 1 with the header as row 1, or 0 when the problem is not in a CSV row. */
    public long row() {
        return row;
    }

    /** The CSV column's name, or null when the problem is not in a CSV cell. */
    public String columnName() {
        return columnName;
    }

    /** What is wrong and what is allowed, without the location. */
    public String detail() {
        return detail;
    }
}
