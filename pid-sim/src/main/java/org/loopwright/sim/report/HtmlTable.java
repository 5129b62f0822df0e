package org.loopwright.sim.report;

import java.util.List;

/**
 * A table for an {@link HtmlReport}: a caption, a header row and body rows of plain text (escaped
 * when written). Every row has as many cells as the header.
 *
 * @param caption the caption above the table
 * @param header  the column names
 * @param rows    the body rows
 */
public record HtmlTable(String caption, List<String> header, List<List<String>> rows) {

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
