package org.loopwright.sim.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;

import org.junit.jupiter.api.Test;
import org.loopwright.sim.report.ResultTable.Column;

class ResultTableTest {

    private static ResultTable table() {
        return ResultTable.of("Figures", Column.text("loop", "loop"), Column.number("settling_time", "settling time", "s", 3),
                Column.number("iae", "IAE", "°C·s", 4))
                .row("continuous", 12.345678, 19.990000000000002)
                .row("sampled", Double.NaN, -0.0);
    }

    @Test
    void textHasUnitsInTheHeaderAndOneMissingWord() {
        assertThat(table().text()).isEqualTo("""
                loop        settling time (s)  IAE (°C·s)
                continuous               12.3       19.99
                sampled                   n/a           0
                """);
    }

    @Test
    void htmlHasTheSameCells() {
        HtmlTable html = table().html();
        assertThat(html.header()).containsExactly("loop", "settling time (s)", "IAE (°C·s)");
        assertThat(html.rows().get(1)).containsExactly("sampled", "n/a", "0");
    }

    @Test
    void csvKeepsFullPrecisionAndLeavesMissingCellsEmpty() throws IOException {
        StringBuilder csv = new StringBuilder();
        table().csv(csv);
        assertThat(csv.toString()).isEqualTo("""
                loop,settling_time [s],iae [°C·s]
                continuous,12.345678,19.990000000000002
                sampled,,0
                """);
    }

    @Test
    void jsonHasSnakeCaseKeysAndNullForAMissingNumber() {
        assertThat(table().json().toString()).isEqualTo("[{\"loop\":\"continuous\",\"settling_time\":12.345678,"
                + "\"iae\":19.990000000000002},{\"loop\":\"sampled\",\"settling_time\":null,\"iae\":0.0}]");
    }
}
