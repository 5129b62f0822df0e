package org.loopwright.sim.replay;

import static java.util.Map.entry;

import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.regex.Pattern;

import org.loopwright.pid.Mode;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.InputText;
import org.loopwright.sim.config.Keywords;

/**
 * Reads a logged trace from CSV (Apache Commons CSV, RFC 4180 quoting). The first row is the header.
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
 * A name the replay writes itself ({@link #OUTPUT_COLUMNS}) may not appear in the header.
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
    /** The words of the {@code mode} column. */
    public static final Keywords<Mode> MODES = Keywords.of(entry("auto", Mode.AUTOMATIC), entry("manual", Mode.MANUAL),
            entry("track", Mode.TRACKING));

    // possessive quantifiers: a long run of digits followed by a letter fails in linear time, with no backtracking
    private static final Pattern DECIMAL = Pattern.compile("[+-]?+(\\d++\\.?+\\d*+|\\.\\d++)([eE][+-]?+\\d++)?+");

    /** What a numeric column allows besides finite numbers. */
    private enum CellRule {
        FINITE("must be a finite number"),
        SAMPLE("must be a number, or blank, nan or inf for a bad sample"),
        KEEP("must be a finite number, or blank or nan to keep the last one");

        private final String text;

        CellRule(String text) {
            this.text = text;
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
     * Reads a trace file; the file is named in messages as given.
     *
     * @throws InputFileException when the file cannot be read or a header or cell is not allowed
     */
    public static Trace read(Path file) {
        return parse(file.toString(), InputText.read(file));
    }

    /**
     * Parses trace text.
     *
     * @param fileName how messages name the source
     * @throws InputFileException when a header or cell is not allowed
     */
    public static Trace parse(String fileName, String text) {
        List<List<String>> rows = InputText.csvRows(fileName, text, REQUIRED_COLUMNS);
        List<String> header = rows.get(0);
        checkHeader(fileName, header);
        List<List<String>> data = rows.subList(1, rows.size());
        if (data.isEmpty()) {
            throw InputFileException.whole(fileName, "has a header but no data rows");
        }
        for (int i = 0; i < data.size(); i++) {
            checkWidth(fileName, header, data.get(i), i + 2);
        }
        Columns columns = new Columns(fileName, header, data);
        double[] time = columns.numbers("time", CellRule.FINITE);
        double[] setpoint = columns.numbers("setpoint", CellRule.SAMPLE);
        double[] measurement = columns.numbers("measurement", CellRule.SAMPLE);
        double[] feedforward = columns.has("feedforward") ? columns.numbers("feedforward", CellRule.SAMPLE) : null;
        Mode[] mode = columns.has("mode") ? columns.modes() : null;
        double[] manual = columns.has("manual_output") ? columns.numbers("manual_output", CellRule.KEEP) : null;
        double[] track = columns.has("track_value") ? columns.numbers("track_value", CellRule.KEEP) : null;
        return new Trace(fileName, header, data, time, setpoint, measurement, feedforward, mode, manual, track);
    }

    private static void checkHeader(String fileName, List<String> header) {
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
            if (OUTPUT_COLUMNS.contains(name)) {
                throw InputFileException.inRow(fileName, 1, name, "is a column the replay writes ("
                        + String.join(", ", OUTPUT_COLUMNS) + "); rename it in the trace");
            }
        }
        for (String required : REQUIRED_COLUMNS) {
            if (!seen.contains(required)) {
                throw InputFileException.inRow(fileName, 1, required, "required column is missing; the header has "
                        + String.join(", ", header) + "; required columns: " + String.join(", ", REQUIRED_COLUMNS));
            }
        }
    }

    private static void checkWidth(String fileName, List<String> header, List<String> cells, int row) {
        if (cells.size() != header.size()) {
            String column = cells.size() < header.size() ? header.get(cells.size()) : "#" + (header.size() + 1);
            throw InputFileException.inRow(fileName, row, column, "the row has " + cells.size()
                    + " cells; the header has " + header.size() + " columns");
        }
    }

    /** Reads whole columns of the data rows. */
    private static final class Columns {
        private final String fileName;
        private final List<String> header;
        private final List<List<String>> data;

        Columns(String fileName, List<String> header, List<List<String>> data) {
            this.fileName = fileName;
            this.header = header;
            this.data = data;
        }

        boolean has(String name) {
            return header.contains(name);
        }

        double[] numbers(String name, CellRule rule) {
            int index = header.indexOf(name);
            double[] values = new double[data.size()];
            for (int i = 0; i < values.length; i++) {
                String cell = data.get(i).get(index);
                double value = parseNumber(cell);
                if (!rule.accepts(cell, value)) {
                    throw InputFileException.inRow(fileName, i + 2, name, rule.text + ": " + name + "=" + cell);
                }
                values[i] = value;
            }
            return values;
        }

        Mode[] modes() {
            int index = header.indexOf("mode");
            Mode[] modes = new Mode[data.size()];
            for (int i = 0; i < modes.length; i++) {
                String cell = data.get(i).get(index);
                if (!cell.isEmpty()) {
                    final int row = i + 2;
                    modes[i] = MODES.value(cell).orElseThrow(() -> InputFileException.inRow(fileName, row, "mode",
                            "must be " + MODES.describe() + ", or blank to keep the mode: mode=" + cell));
                }
            }
            return modes;
        }
    }

    /**
     * The cell as a number: a decimal (with optional exponent), blank or {@code nan} as NaN, and
     * {@code inf}/{@code infinity} with an optional sign; NaN for anything else.
     */
    static double parseNumber(String cell) {
        if (DECIMAL.matcher(cell).matches()) {
            return Double.parseDouble(cell);
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
