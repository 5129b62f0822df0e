package org.loopwright.sim.report;

import java.util.List;

/**
 * A table for an {@link HtmlReport}: a caption, a header row and body rows of plain text (escaped
 * when written), and a note below it. Every row has as many cells as the header.
 *
 * @param caption the caption above the table: what it shows, in a few words
 * @param header  the column names
 * @param rows    the body rows
 * @param note    a paragraph below the table (definitions, how to read it), empty for none
 */
public record HtmlTable(String caption, List<String> header, List<List<String>> rows, String note) {

    /** A table without a note. */
    public HtmlTable(String caption, List<String> header, List<List<String>> rows) {
        this(caption, header, rows, "");
    }

    /** Copies the lists and checks the row widths. */
    public HtmlTable {
        header = List.copyOf(header);
        rows = rows.stream().map(List::copyOf).toList();
        for (List<String> row : rows) {
            if (row.size() != header.size()) {
                throw new IllegalArgumentException("every row must have " + header.size() + " cells: row=" + row);
            }
        }
    }
}
