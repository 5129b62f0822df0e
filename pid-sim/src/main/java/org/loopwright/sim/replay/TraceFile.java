package org.loopwright.sim.replay;

import static java.util.Map.entry;

import java.io.IOException;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import com.fasterxml.jackson.core.io.NumberInput;
import org.loopwright.pid.Mode;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.IoWords;
import org.loopwright.sim.config.Keywords;

/**
 * Reads a logged trace from CSV ({@link org.loopwright.sim.config.CsvRows}, RFC 4180 quoting). The first row is the header.
 * Lines starting with {@code #} are comments. Columns, in any order:
 * <ul>
 *   <li>{@code time} (required): seconds, a finite number in every row;</li>
 *   <li>{@code setpoint}, {@code measurement} (required): numbers; a blank cell, {@code nan} or
 *       {@code inf} is a bad sample that the controller sees as a fault, not a parse error;</li>
 *   <li>{@code feedforward} (optional): a number, blank or {@code nan} (a bad sample, seen as a fault);</li>
 *   <li>{@code mode} (optional): {@code auto}, {@code manual} or {@code track}; blank keeps the mode;</li>
 *   <li>{@code manual_output} (optional): the operator's output; blank or {@code nan} keeps it;</li>
 *   <li>{@code track_value} (optional): the external value for tracking mode and the actuator
 *       position for actuator-tracking windup protection; blank or {@code nan} when unknown;</li>
 *   <li>any other column is kept and passed through to the output.</li>
 * </ul>
 * An {@code output} column is the logged controller's output: it is kept, renamed {@code logged_output}
 * in the result beside the replayed {@code output}, and can start the replay where the logged controller
 * was. A name the result would then have twice ({@link #RESERVED_COLUMNS}) may not appear in the header,
 * so {@code simulate}'s own trajectory.csv replays as it is.
 * Errors name the file, the row (the header is row 1) and the column.
 *
 * <p>Thread-safe: stateless.
 */
public final class TraceFile {

    /** The columns every trace must have. */
    public static final List<String> REQUIRED_COLUMNS = List.of("time", "setpoint", "measurement");
    /** The columns the replay adds to its output. */
    public static final List<String> OUTPUT_COLUMNS = List.of("output", "proportional", "integral", "derivative",
            "status");
    /** The optional column of the output the logged controller gave; the replay's result renames it. */
    public static final String LOGGED_OUTPUT = "output";
    /** The name the logged output takes in the replay's result, beside the replayed {@code output}. */
    public static final String LOGGED_OUTPUT_RENAMED = "logged_output";
    /** Names a trace may not use: the result would have two columns of that name. */
    public static final List<String> RESERVED_COLUMNS = List.of(LOGGED_OUTPUT_RENAMED, "proportional", "integral",
            "derivative", "status");
    /** The words of the {@code mode} column. */
    public static final Keywords<Mode> MODES = Keywords.of(entry("auto", Mode.AUTOMATIC), entry("manual", Mode.MANUAL),
            entry("track", Mode.TRACKING));

    /** What a numeric column allows besides finite numbers. */
    enum CellRule {
        FINITE("must be a finite number"),
        SAMPLE("must be a number, or blank, nan or inf for a bad sample"),
        KEEP("must be a finite number, or blank or nan to keep the last one");

        private final String text;

        CellRule(String text) {
            this.text = text;
        }

        String text() {
            return text;
        }

        boolean accepts(String cell, double value) {
            return switch (this) {
                case FINITE -> Double.isFinite(value);
                case SAMPLE -> !Double.isNaN(value) || cell.isEmpty() || cell.equalsIgnoreCase("nan");
                case KEEP -> Double.isFinite(value) || cell.isEmpty() || cell.equalsIgnoreCase("nan");
            };
        }
    }

    private TraceFile() {
    }

    /**
     * Reads a whole trace file into memory; the file is named in messages as given. For a long trace
     * read it a row at a time with {@link TraceReader#open(Path)}.
     *
     * @throws InputFileException when the file cannot be read or a header or cell is not allowed
     */
    public static Trace read(Path file) {
        try (TraceReader reader = TraceReader.open(file)) {
            return drain(reader);
        } catch (IOException e) {
            throw InputFileException.whole(file.toString(), "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    /**
     * Parses trace text.
     *
     * @param fileName how messages name the source
     * @throws InputFileException when a header or cell is not allowed
     */
    public static Trace parse(String fileName, String text) {
        try (TraceReader reader = TraceReader.of(fileName, new StringReader(text))) {
            return drain(reader);
        } catch (IOException e) {
            throw InputFileException.whole(fileName, "cannot be read (" + IoWords.of(e) + ")", e);
        }
    }

    private static Trace drain(TraceReader reader) {
        List<TraceRow> rows = new ArrayList<>();
        TraceRow row = new TraceRow();
        while (reader.next(row)) {
            rows.add(row);
            row = new TraceRow();
        }
        if (rows.isEmpty()) {
            throw InputFileException.whole(reader.fileName(), "has a header but no data rows");
        }
        return new Trace(reader.fileName(), reader.header(), rows, reader.hasFeedforward(), reader.hasTrackValue(),
                reader.hasLoggedOutput());
    }

    /**
     * Whether a cell is a plain decimal number, {@code [+-]? (digits [. digits?] | . digits) ([eE] [+-]? digits)?}:
     * what {@link Double#parseDouble} reads, without its hexadecimal forms, type suffixes and words.
     * Scanned by hand, once per numeric cell of a trace of millions of rows.
     */
    static boolean isDecimal(String cell) {
        int n = cell.length();
        int i = n > 0 && (cell.charAt(0) == '+' || cell.charAt(0) == '-') ? 1 : 0;
        int whole = digits(cell, i);
        i += whole;
        int fraction = 0;
        if (i < n && cell.charAt(i) == '.') {
            i++;
            fraction = digits(cell, i);
            i += fraction;
        }
        if (whole == 0 && fraction == 0) {
            return false;
        }
        if (i < n && (cell.charAt(i) == 'e' || cell.charAt(i) == 'E')) {
            i++;
            if (i < n && (cell.charAt(i) == '+' || cell.charAt(i) == '-')) {
                i++;
            }
            int exponent = digits(cell, i);
            if (exponent == 0) {
                return false;
            }
            i += exponent;
        }
        return i == n;
    }

    private static int digits(String cell, int from) {
        int i = from;
        while (i < cell.length() && cell.charAt(i) >= '0' && cell.charAt(i) <= '9') {
            i++;
        }
        return i - from;
    }

    /**
     * The cell as a number: a decimal (with optional exponent), blank or {@code nan} as NaN, and
     * {@code inf}/{@code infinity} with an optional sign; NaN for anything else.
     */
    static double parseNumber(String cell) {
        if (isDecimal(cell)) {
            // Jackson's fast parser (FastDoubleParser) rounds correctly, as Double.parseDouble does
            return NumberInput.parseDouble(cell, true);
        }
        String word = cell.toLowerCase(Locale.ROOT);
        boolean negative = word.startsWith("-");
        String unsigned = negative || word.startsWith("+") ? word.substring(1) : word;
        if (unsigned.equals("inf") || unsigned.equals("infinity")) {
            return negative ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY;
        }
        return Double.NaN;
    }
}
