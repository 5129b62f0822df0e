package org.loopwright.sim.config;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/** The hand-written reader and writer of the harness's CSV dialect (RFC 4180, IETF 2005, §2). */
class CsvRowsTest {

    private static List<List<String>> readAll(String text) {
        List<List<String>> records = new ArrayList<>();
        CsvRows rows = new CsvRows("t.csv", new StringReader(text));
        List<String> cells = new ArrayList<>();
        while (rows.next(cells)) {
            records.add(List.copyOf(cells));
        }
        return records;
    }

    /** RFC 4180 §2, rules 5 to 7: quoted fields, line breaks and commas inside them, doubled quotes. */
    @Test
    void readsTheQuotingOfRfc4180() {
        assertThat(readAll("\"aaa\",\"b\"\"bb\",\"ccc\"\nzzz,\"x\ny\",\"a,b\"\n")).containsExactly(
                List.of("aaa", "b\"bb", "ccc"), List.of("zzz", "x\ny", "a,b"));
    }

    /** The dialect's additions (InputText): # comment lines, empty lines skipped, spaces around cells dropped. */
    @Test
    void skipsCommentsAndEmptyLinesAndTrimsCells() {
        CsvRows rows = new CsvRows("t.csv", new StringReader("# note\n\n a , b ,\"  c \" \n\r\n1,,3\n"));
        List<String> cells = new ArrayList<>();
        assertThat(rows.next(cells)).isTrue();
        assertThat(cells).containsExactly("a", "b", "  c ");
        assertThat(rows.recordNumber()).isEqualTo(1);
        assertThat(rows.next(cells)).isTrue();
        assertThat(cells).containsExactly("1", "", "3");
        assertThat(rows.recordNumber()).isEqualTo(2);
        assertThat(rows.next(cells)).isFalse();
        assertThat(cells).containsExactly("1", "", "3");
    }

    @Test
    void brokenQuotingNamesLineAndCharacter() {
        assertThatThrownBy(() -> readAll("a,b\n1,\"2\"x\n"))
                .hasMessage("t.csv:2:6: not valid CSV: only a comma may follow a quoted cell's closing quote");
        assertThatThrownBy(() -> readAll("a,b\n\n1,\"2\n3\n"))
                .hasMessage("t.csv:3:3: not valid CSV: a quoted cell is not closed before the end of the file");
    }

    @Test
    void anUnclosedQuoteStopsAtTheCellLimitNotAtTheEndOfMemory() {
        String text = "a\n\"" + "x\n".repeat(InputText.MAX_CELL_CHARS);
        assertThatThrownBy(() -> readAll(text)).hasMessageContaining("the limit for a cell is "
                + InputText.MAX_CELL_CHARS);
    }

    /** Whatever cells are written, the reader gives them back: quoting, comments, spaces and empty cells. */
    @Property(tries = 1000)
    void writtenCellsReadBackAsWritten(@ForAll("records") List<List<String>> records) {
        StringBuilder text = new StringBuilder();
        for (List<String> record : records) {
            for (int i = 0; i < record.size(); i++) {
                CsvRows.appendCell(text, record.get(i), i == 0);
            }
            text.append('\n');
        }
        assertThat(readAll(text.toString())).isEqualTo(records);
    }

    @Provide
    Arbitrary<List<List<String>>> records() {
        // printable ASCII, the characters the dialect treats specially, and a line break (a carriage
        // return is read as a line break, so it is left out)
        Arbitrary<String> cell = Arbitraries.strings().withCharRange(' ', '~').withChars('\n', '\t', '"', ',', '#')
                .ofMaxLength(12);
        return cell.list().ofMinSize(1).ofMaxSize(6).list().ofMaxSize(5);
    }
}
