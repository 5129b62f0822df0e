package org.loopwright.sim.replay;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.core.io.NumberOutput;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.sim.config.CsvRows;
import org.loopwright.sim.config.InputFileException;

/**
 * Runs a logged trace through a controller, one update per row, as the controller would have run
 * on the device: the measurements are the logged ones (the replay does not close the loop).
 *
 * <p>Before each row's update: a non-blank {@code mode} switches the mode (bumpless); a
 * {@code manual_output} sets the operator's output; a {@code track_value} sets the tracking value
 * and the actuator position; a {@code feedforward} sets the feedforward, which is on for the
 * whole replay when the column exists. The period is the configured sample period, or with
 * measured periods h(k) = time(k) − time(k−1) (the configured period for the first row); a period
 * that is not positive is a fault the controller handles by its policy, like a missing sample.
 *
 * <p>Started from the logged output (when the trace has an {@code output} column), the first row is
 * replayed in tracking mode on that row's logged output, and the controller then goes to automatic
 * bumplessly: its first output is the logged one, not the 0 of a controller at rest.
 *
 * <p>{@link #stream} reads, replays and writes the trace in batches of rows, so memory does not grow
 * with the trace; reading and formatting run on threads of their own beside the controller's one.
 * Thread-safe: stateless.
 */
public final class Replay {

    private Replay() {
    }

    /**
     * Replays every row of a trace held in memory, from a controller at rest.
     *
     * @param measuredPeriod take each row's period from the {@code time} column
     */
    public static ReplayResult run(ControllerSettings settings, Trace trace, boolean measuredPeriod) {
        int rows = trace.rowCount();
        ReplayResult.Columns out = new ReplayResult.Columns(rows);
        ReplayEngine engine = new ReplayEngine(settings, measuredPeriod, false, trace.hasFeedforward(),
                trace.hasTrackValue());
        for (int k = 0; k < rows; k++) {
            engine.step(trace.row(k));
            PidController c = engine.controller;
            out.output[k] = c.output();
            out.position[k] = c.position();
            out.proportional[k] = c.proportionalTerm();
            out.integral[k] = c.integralTerm();
            out.derivative[k] = c.derivativeTerm();
            out.status[k] = c.fault();
            out.periodSeconds[k] = engine.period;
            out.mode[k] = c.mode();
        }
        return new ReplayResult(settings, trace, measuredPeriod, out);
    }

    /**
     * Replays a trace as it is read: rows are read, replayed in order and written to {@code out} (the
     * trace's columns, the logged {@code output} renamed {@code logged_output}, then
     * {@link TraceFile#OUTPUT_COLUMNS}) as UTF-8 a batch at a time, reading and formatting on threads of
     * their own, so memory does not grow with the trace. On an error {@code out} holds a part of the result: write it to a file
     * that is moved into place only when this returns.
     *
     * @param measuredPeriod      take each row's period from the {@code time} column
     * @param startFromLoggedOutput start the controller from the first row's logged output
     * @return the summary of the whole replay
     * @throws InputFileException for a bad row, an empty trace, or a start from a logged output the trace lacks
     */
    public static ReplaySummary stream(ControllerSettings settings, TraceReader trace, boolean measuredPeriod,
            boolean startFromLoggedOutput, OutputStream out) throws IOException {
        if (startFromLoggedOutput && !trace.hasLoggedOutput()) {
            throw InputFileException.inRow(trace.fileName(), 1, TraceFile.LOGGED_OUTPUT, "is needed to start from the"
                    + " logged output; the header has " + String.join(", ", trace.header()));
        }
        ReplayEngine engine = new ReplayEngine(settings, measuredPeriod, startFromLoggedOutput, trace.hasFeedforward(),
                trace.hasTrackValue());
        ReplaySummary.Accumulator summary = new ReplaySummary.Accumulator(settings, measuredPeriod);
        StringBuilder header = new StringBuilder();
        printRow(header, resultHeader(trace.header()));
        out.write(header.toString().getBytes(StandardCharsets.UTF_8));
        new ReplayPipeline(trace, engine, summary).run(out);
        if (summary.rows() == 0) {
            throw InputFileException.whole(trace.fileName(), "has a header but no data rows");
        }
        return summary.finish();
    }

    /** The header of a replay's result for a trace with this header. */
    static List<String> resultHeader(List<String> traceHeader) {
        List<String> header = new ArrayList<>(traceHeader.size() + TraceFile.OUTPUT_COLUMNS.size());
        for (String name : traceHeader) {
            header.add(name.equals(TraceFile.LOGGED_OUTPUT) ? TraceFile.LOGGED_OUTPUT_RENAMED : name);
        }
        header.addAll(TraceFile.OUTPUT_COLUMNS);
        return header;
    }

    /**
     * Appends one result row, line break included: the trace's cells as read, then the replay's
     * columns, the numbers as {@link #number} writes them.
     */
    static void appendResultRow(StringBuilder line, List<String> cells, String output, String proportional,
            String integral, String derivative, String status) {
        for (int i = 0; i < cells.size(); i++) {
            CsvRows.appendCell(line, cells.get(i), i == 0);
        }
        line.append(',').append(output).append(',').append(proportional).append(',').append(integral).append(',')
                .append(derivative);
        CsvRows.appendCell(line, status, false);
        line.append('\n');
    }

    /**
     * The shortest decimal that reads back to the same double, in {@link Double#toString}'s format,
     * by Jackson's Schubfach writer (Giulietti's algorithm, the one Java 19 adopted for
     * {@code Double.toString}): Java 17's own is several times slower and, for a few values,
     * longer than it needs to be.
     */
    static String number(double value) {
        return NumberOutput.toString(value, true);
    }

    /** One record, quoted where the harness's CSV dialect needs it. */
    static void printRow(Appendable out, List<String> cells) throws IOException {
        StringBuilder line = new StringBuilder();
        for (int i = 0; i < cells.size(); i++) {
            CsvRows.appendCell(line, cells.get(i), i == 0);
        }
        out.append(line.append('\n'));
    }
}
