package org.loopwright.sim.replay;

import java.nio.file.Path;
import java.util.HashSet;
import java.util.List;
import java.util.Set;

import org.loopwright.pid.Mode;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.InputText;

/**
 * Reads a logged loop for {@code assess}: the replay's trace format (see {@link TraceFile}) with the
 * logged controller output in an {@code output} column. Required: {@code time} (seconds, finite,
 * strictly increasing), {@code setpoint}, {@code measurement}, {@code output}; a blank, {@code nan}
 * or {@code inf} value in those three is a missing sample. Optional {@code mode} ({@code auto},
 * {@code manual}, {@code track}; blank keeps the last; automatic until the first). Other columns are
 * ignored.
 */
public final class LoggedLoopFile {

    /** The columns every logged loop must have. */
    public static final List<String> REQUIRED_COLUMNS = List.of("time", "setpoint", "measurement", "output");

    private LoggedLoopFile() {
    }

    /**
     * Reads and checks a file.
     *
     * @throws InputFileException naming the file, row and column of the first problem
     */
    public static LoggedLoop read(Path file) {
        return parse(file.toString(), InputText.read(file));
    }

    /**
     * Parses and checks text.
     *
     * @param fileName how messages name the source
     * @throws InputFileException naming the file, row and column of the first problem
     */
    public static LoggedLoop parse(String fileName, String text) {
        List<List<String>> rows = InputText.csvRows(fileName, text, REQUIRED_COLUMNS);
        List<String> header = rows.get(0);
        Set<String> seen = new HashSet<>();
        for (String name : header) {
            if (!seen.add(name)) {
                throw InputFileException.inRow(fileName, 1, name, "appears twice in the header; each name may appear once");
            }
        }
        for (String required : REQUIRED_COLUMNS) {
            if (!seen.contains(required)) {
                throw InputFileException.inRow(fileName, 1, required, "required column is missing; the header has "
                        + String.join(", ", header) + "; required columns: " + String.join(", ", REQUIRED_COLUMNS));
            }
        }
        int n = rows.size() - 1;
        if (n < 2) {
            throw InputFileException.whole(fileName, "has " + n + " data rows; a logged loop needs at least 2");
        }
        int timeColumn = header.indexOf("time");
        int modeColumn = header.indexOf("mode");
        double[] time = new double[n];
        double[] setpoint = new double[n];
        double[] measurement = new double[n];
        double[] output = new double[n];
        boolean[] automatic = new boolean[n];
        boolean inAutomatic = true;
        for (int i = 0; i < n; i++) {
            List<String> cells = rows.get(i + 1);
            int row = i + 2;
            if (cells.size() != header.size()) {
                String column = cells.size() < header.size() ? header.get(cells.size()) : "#" + (header.size() + 1);
                throw InputFileException.inRow(fileName, row, column, "the row has " + cells.size()
                        + " cells; the header has " + header.size() + " columns");
            }
            String timeCell = cells.get(timeColumn);
            time[i] = TraceFile.parseNumber(timeCell);
            if (!Double.isFinite(time[i])) {
                throw InputFileException.inRow(fileName, row, "time", "must be a finite number: time=" + timeCell);
            }
            if (i > 0 && !(time[i] > time[i - 1])) {
                throw InputFileException.inRow(fileName, row, "time", "must increase from row to row (previous row "
                        + time[i - 1] + "): time=" + timeCell);
            }
            setpoint[i] = sample(fileName, header, cells, row, "setpoint");
            measurement[i] = sample(fileName, header, cells, row, "measurement");
            output[i] = sample(fileName, header, cells, row, "output");
            if (modeColumn >= 0 && !cells.get(modeColumn).isEmpty()) {
                String cell = cells.get(modeColumn);
                Mode mode = TraceFile.MODES.value(cell).orElseThrow(() -> InputFileException.inRow(fileName, row,
                        "mode", "must be " + TraceFile.MODES.describe() + ", or blank to keep the mode: mode=" + cell));
                inAutomatic = mode == Mode.AUTOMATIC;
            }
            automatic[i] = inAutomatic;
        }
        return new LoggedLoop(fileName, time, setpoint, measurement, output, automatic);
    }

    private static double sample(String fileName, List<String> header, List<String> cells, int row, String column) {
        String cell = cells.get(header.indexOf(column));
        double value = TraceFile.parseNumber(cell);
        if (Double.isNaN(value) && !cell.isEmpty() && !cell.equalsIgnoreCase("nan")) {
            throw InputFileException.inRow(fileName, row, column,
                    "must be a number, or blank, nan or inf for a missing sample: " + column + "=" + cell);
        }
        return value;
    }
}
