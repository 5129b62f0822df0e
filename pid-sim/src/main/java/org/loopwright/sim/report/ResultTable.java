package org.loopwright.sim.report;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;

import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;

/**
 * One typed table of results, rendered as aligned text, an HTML table, CSV and JSON from the same
 * rows, so that the four never disagree. Each column has a key (snake_case, for JSON and CSV), a
 * header and a unit for people, and for numbers the significant digits; a missing number is
 * {@link NumberText#MISSING} in text and HTML, empty in CSV and {@code null} in JSON.
 *
 * <p>Example: {@code ResultTable.of("Margins", Column.text("loop", "loop"), Column.number("ms", "Ms", "", 3))
 * .row("sampled", 1.52)}.
 *
 * <p>Not thread-safe while rows are added; a finished table may be read from any thread.
 */
public final class ResultTable {

    /**
     * A column.
     *
     * @param key    its key in JSON and CSV, snake_case
     * @param header its name for people
     * @param unit   its unit ("s", "°C·s"), empty for none
     * @param digits significant digits for a number column; 0 for a text column
     */
    public record Column(String key, String header, String unit, int digits) {

        /**
         * A text column.
         *
         * @param key    its key in JSON and CSV
         * @param header its name for people
         * @return the column
         */
        public static Column text(String key, String header) {
            return new Column(key, header, "", 0);
        }

        /**
         * A number column.
         *
         * @param key    its key in JSON and CSV
         * @param header its name for people
         * @param unit   its unit, empty for none
         * @param digits its significant digits
         * @return the column
         */
        public static Column number(String key, String header, String unit, int digits) {
            return new Column(key, header, unit, digits);
        }

        /** @return the header with its unit: "settling time (s)" */
        public String headerWithUnit() {
            return unit.isEmpty() ? header : header + " (" + unit + ")";
        }

        String text(Object cell) {
            if (cell == null) {
                return NumberText.MISSING;
            }
            if (cell instanceof Boolean b) {
                // a failed check is said loudly
                return b ? "yes" : "NO";
            }
            return cell instanceof Double d ? NumberText.of(d, digits) : cell.toString();
        }
    }

    private final String caption;
    private final List<Column> columns;
    private final List<List<Object>> rows = new ArrayList<>();
    private String note = "";

    private ResultTable(String caption, List<Column> columns) {
        this.caption = caption;
        this.columns = List.copyOf(columns);
    }

    /**
     * An empty table.
     *
     * @param caption what the table shows, as its caption
     * @param columns its columns, in order
     * @return the table
     */
    public static ResultTable of(String caption, Column... columns) {
        return new ResultTable(caption, Arrays.asList(columns));
    }

    /**
     * Sets the paragraph a report prints below the table: definitions too long for its caption.
     *
     * @param text the note
     * @return this table
     */
    public ResultTable note(String text) {
        note = text;
        return this;
    }

    /**
     * Adds a row: a {@code Double} (NaN or infinite for missing) for each number column, text (or any
     * object, printed by its {@code toString}; a {@code Boolean} is "yes" or "NO" for people and a
     * boolean in JSON) for each text column; null for a missing cell.
     *
     * @param cells one cell per column
     * @return this table
     * @throws IllegalArgumentException when the row's width is not the table's
     */
    public ResultTable row(Object... cells) {
        if (cells.length != columns.size()) {
            throw new IllegalArgumentException("a row must have " + columns.size() + " cells: cells=" + cells.length);
        }
        List<Object> row = new ArrayList<>(cells.length);
        for (int i = 0; i < cells.length; i++) {
            Object cell = cells[i];
            boolean missingNumber = cell instanceof Double d && !Double.isFinite(d);
            row.add(missingNumber ? null : cell);
        }
        rows.add(Collections.unmodifiableList(row));
        return this;
    }

    /** @return the columns */
    public List<Column> columns() {
        return columns;
    }

    /** @return the number of rows */
    public int size() {
        return rows.size();
    }

    /** @return the table as aligned text, a header line with units first, numbers right-aligned */
    public String text() {
        int[] width = new int[columns.size()];
        List<List<String>> cells = new ArrayList<>();
        List<String> header = columns.stream().map(Column::headerWithUnit).toList();
        cells.add(header);
        for (List<Object> row : rows) {
            List<String> line = new ArrayList<>();
            for (int i = 0; i < columns.size(); i++) {
                line.add(columns.get(i).text(row.get(i)));
            }
            cells.add(line);
        }
        for (List<String> line : cells) {
            for (int i = 0; i < width.length; i++) {
                width[i] = Math.max(width[i], line.get(i).length());
            }
        }
        StringBuilder out = new StringBuilder();
        for (List<String> line : cells) {
            StringBuilder text = new StringBuilder();
            for (int i = 0; i < width.length; i++) {
                String cell = line.get(i);
                String pad = " ".repeat(width[i] - cell.length());
                boolean right = columns.get(i).digits() > 0 && line != header;
                text.append(i == 0 ? "" : "  ").append(right ? pad + cell : cell + pad);
            }
            out.append(text.toString().stripTrailing()).append('\n');
        }
        return out.toString();
    }

    /** @return the table for an HTML report */
    public HtmlTable html() {
        List<List<String>> body = new ArrayList<>();
        for (List<Object> row : rows) {
            List<String> line = new ArrayList<>();
            for (int i = 0; i < columns.size(); i++) {
                line.add(columns.get(i).text(row.get(i)));
            }
            body.add(line);
        }
        return new HtmlTable(caption, columns.stream().map(Column::headerWithUnit).toList(), body, note);
    }

    /**
     * Writes the table as CSV: a header of keys with their units in brackets ({@code settling_time [s]}),
     * numbers at full precision (the shortest text that reads back to the same double), missing cells empty.
     *
     * @param out where to write
     * @throws IOException when writing fails
     */
    public void csv(Appendable out) throws IOException {
        List<String> header = columns.stream().map(c -> c.unit().isEmpty() ? c.key() : c.key() + " [" + c.unit() + "]")
                .toList();
        // not closed: the caller owns the stream
        CSVPrinter printer = new CSVPrinter(out, CSVFormat.DEFAULT.builder().setRecordSeparator('\n').get());
        printer.printRecord(header);
        for (List<Object> row : rows) {
            List<String> line = new ArrayList<>();
            for (Object cell : row) {
                line.add(cell == null ? "" : cell instanceof Double d ? (d == 0.0 ? "0" : Double.toString(d))
                        : cell.toString());
            }
            printer.printRecord(line);
        }
        printer.flush();
    }

    /** @return the rows as JSON objects keyed by the column keys; a missing number is null */
    public ArrayNode json() {
        ArrayNode array = JsonNodeFactory.instance.arrayNode();
        for (List<Object> row : rows) {
            ObjectNode object = array.addObject();
            for (int i = 0; i < columns.size(); i++) {
                Object cell = row.get(i);
                String key = columns.get(i).key();
                if (cell == null) {
                    object.putNull(key);
                } else if (cell instanceof Double d) {
                    object.put(key, d == 0.0 ? 0.0 : d);
                } else if (cell instanceof Boolean b) {
                    object.put(key, b);
                } else {
                    object.put(key, cell.toString());
                }
            }
        }
        return array;
    }
}
