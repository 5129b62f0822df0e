package org.loopwright.sim.replay;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import java.time.Duration;
import java.util.List;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.Mode;
import org.loopwright.sim.config.InputFileException;

class TraceFileTest {

    @Test
    void readsSignalsAndKeepsEveryCellAsWritten() {
        Trace trace = TraceFile.parse("log.csv", """
                # a comment line
                valve_note,time,measurement,setpoint,feedforward,mode,manual_output,track_value
                "open, stuck",0.0,20.5,40,1.5,manual,30,
                ok,0.5,,40,nan,,NaN,12.5
                ok,1.0,nan,inf,2,auto,,13
                ok,1.5, 1e1 ,-Infinity,,track,,
                """);
        assertThat(trace.header()).containsExactly("valve_note", "time", "measurement", "setpoint", "feedforward",
                "mode", "manual_output", "track_value");
        assertThat(trace.rowCount()).isEqualTo(4);
        assertThat(trace.cells(0)).containsExactly("open, stuck", "0.0", "20.5", "40", "1.5", "manual", "30", "");
        assertThat(trace.timeSeconds(3)).isEqualTo(1.5);
        assertThat(trace.measurement(0)).isEqualTo(20.5);
        assertThat(trace.measurement(1)).isNaN();
        assertThat(trace.measurement(2)).isNaN();
        assertThat(trace.measurement(3)).isEqualTo(10.0);
        assertThat(trace.setpoint(2)).isEqualTo(Double.POSITIVE_INFINITY);
        assertThat(trace.setpoint(3)).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(trace.hasFeedforward()).isTrue();
        assertThat(trace.feedforward(1)).isNaN();
        assertThat(trace.feedforward(3)).isNaN();
        assertThat(trace.mode(0)).isEqualTo(Mode.MANUAL);
        assertThat(trace.mode(1)).isNull();
        assertThat(trace.mode(2)).isEqualTo(Mode.AUTOMATIC);
        assertThat(trace.mode(3)).isEqualTo(Mode.TRACKING);
        assertThat(trace.manualOutput(0)).isEqualTo(30.0);
        assertThat(trace.manualOutput(1)).isNaN();
        assertThat(trace.trackValue(1)).isEqualTo(12.5);
        assertThat(trace.trackValue(2)).isEqualTo(13.0);
        assertThat(trace.trackValue(3)).isNaN();
    }

    @Test
    void optionalColumnsAreAbsentWhenNotInTheHeader() {
        Trace trace = TraceFile.parse("log.csv", "time,setpoint,measurement\n0,1,2\n");
        assertThat(trace.hasFeedforward()).isFalse();
        assertThat(trace.hasTrackValue()).isFalse();
        assertThat(trace.mode(0)).isNull();
        assertThat(trace.manualOutput(0)).isNaN();
    }

    static Stream<Arguments> badTraces() {
        String header = "time,setpoint,measurement\n";
        return Stream.of(
                Arguments.of("", "log.csv: has no header row; required columns: time, setpoint, measurement"),
                Arguments.of(header, "log.csv: has a header but no data rows"),
                Arguments.of("time,setpoint\n0,1\n", "log.csv: row 1, column 'measurement': required column is missing;"
                        + " the header has time, setpoint; required columns: time, setpoint, measurement"),
                Arguments.of("time,setpoint,measurement,time\n0,1,2,3\n",
                        "log.csv: row 1, column 'time': appears twice in the header; each name may appear once"),
                Arguments.of("time,,setpoint,measurement\n0,1,2,3\n",
                        "log.csv: row 1, column '#2': the header gives this column no name; every column needs one"),
                Arguments.of("time,setpoint,measurement,logged_output\n0,1,2,3\n",
                        "log.csv: row 1, column 'logged_output': is a column the replay writes (logged_output,"
                                + " proportional, integral, derivative, status); rename it in the trace"),
                Arguments.of(header + "0,1,2\n0.5,1\n",
                        "log.csv: row 3, column 'measurement': the row has 2 cells; the header has 3 columns"),
                Arguments.of(header + "0,1,2,9\n",
                        "log.csv: row 2, column '#4': the row has 4 cells; the header has 3 columns"),
                Arguments.of(header + "0,1,2\n,1,2\n",
                        "log.csv: row 3, column 'time': must be a finite number: time="),
                Arguments.of(header + "nan,1,2\n",
                        "log.csv: row 2, column 'time': must be a finite number: time=nan"),
                Arguments.of(header + "0.0s,1,2\n",
                        "log.csv: row 2, column 'time': must be a finite number: time=0.0s"),
                Arguments.of(header + "0,1,2\n1,1,2.5.1\n",
                        "log.csv: row 3, column 'measurement': must be a number, or blank, nan or inf for a bad sample:"
                                + " measurement=2.5.1"),
                Arguments.of(header + "0,0x10,2\n",
                        "log.csv: row 2, column 'setpoint': must be a number, or blank, nan or inf for a bad sample:"
                                + " setpoint=0x10"),
                Arguments.of("time,setpoint,measurement,feedforward\n0,1,2,1.5d\n",
                        "log.csv: row 2, column 'feedforward': must be a number, or blank, nan or inf for a bad"
                                + " sample: feedforward=1.5d"),
                Arguments.of("time,setpoint,measurement,mode\n0,1,2,automatic\n",
                        "log.csv: row 2, column 'mode': must be one of auto, manual, track, or blank to keep the"
                                + " mode: mode=automatic"),
                Arguments.of("time,setpoint,measurement,manual_output\n0,1,2,inf\n",
                        "log.csv: row 2, column 'manual_output': must be a finite number, or blank or nan to keep the"
                                + " last one: manual_output=inf"),
                Arguments.of(header + "0,1," + "2".repeat(1001) + "\n",
                        "log.csv: row 2, cell 3 has 1001 characters; the limit for a cell is 1000"),
                Arguments.of(header + "0,1,2" + ",".repeat(100) + "\n", "log.csv: row 2 has 103 cells; the limit is 100"),
                Arguments.of("time,setpoint,measurement,track_value\n0,1,2,high\n",
                        "log.csv: row 2, column 'track_value': must be a finite number, or blank or nan to keep the"
                                + " last one: track_value=high"));
    }

    @ParameterizedTest
    @MethodSource("badTraces")
    void badTraceIsRejectedNamingRowColumnValueAndWhatIsAllowed(String csv, String message) {
        assertThatThrownBy(() -> TraceFile.parse("log.csv", csv))
                .isInstanceOf(InputFileException.class)
                .hasMessage(message);
    }

    @Test
    void aLongRunOfDigitsIsReadInLinearTime() {
        // the number pattern once backtracked quadratically: 10^5 digits then a letter took 45 s (issue 11);
        // with possessive quantifiers 10^6 digits take milliseconds, far inside this generous bound
        String digits = "1".repeat(1_000_000);
        assertTimeoutPreemptively(Duration.ofSeconds(5), () -> {
            assertThat(TraceFile.parseNumber(digits + "x")).isNaN();
            assertThat(TraceFile.parseNumber(digits + ".5e")).isNaN();
            assertThat(TraceFile.parseNumber("12.5e-1")).isEqualTo(1.25);
            assertThat(TraceFile.parseNumber(".5")).isEqualTo(0.5);
            assertThat(TraceFile.parseNumber("-7.")).isEqualTo(-7.0);
        });
    }

    @Test
    void errorCarriesRowAndColumnAsAccessors() {
        InputFileException e = (InputFileException) org.assertj.core.api.Assertions.catchThrowable(
                () -> TraceFile.parse("log.csv", "time,setpoint,measurement\n0,1,2\n1,x,2\n"));
        assertThat(e.file()).isEqualTo("log.csv");
        assertThat(e.row()).isEqualTo(3);
        assertThat(e.columnName()).isEqualTo("setpoint");
        assertThat(e.line()).isZero();
    }

    @Test
    void brokenQuotingIsABadFile() {
        assertThatThrownBy(() -> TraceFile.parse("log.csv", "time,setpoint,measurement\n0,\"1,2\n"))
                .isInstanceOf(InputFileException.class)
                .hasMessage("log.csv:2:3: not valid CSV: a quoted cell is not closed before the end of the file");
    }

    @Test
    void numberCellsFollowTheDocumentedWords() {
        for (String nan : List.of("", "nan", "NaN", "NAN", "bogus")) {
            assertThat(TraceFile.parseNumber(nan)).as(nan).isNaN();
        }
        assertThat(TraceFile.parseNumber("+inf")).isEqualTo(Double.POSITIVE_INFINITY);
        assertThat(TraceFile.parseNumber("-Infinity")).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(TraceFile.parseNumber("-.5e-3")).isEqualTo(-0.0005);
        assertThat(TraceFile.parseNumber("7.")).isEqualTo(7.0);
    }
}
