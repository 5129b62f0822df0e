package org.loopwright.sim.replay;

import java.io.IOException;
import java.util.Locale;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Fault;
import org.loopwright.pid.Mode;

/**
 * What a {@link Replay} produced, row by row: the output, the proportional, integral and derivative
 * contributions (those of the last good sample on a faulty row), the status, the actuator position
 * and the period used.
 *
 * <p>Thread-safe: immutable once the replay has filled it (its arrays are never handed out).
 */
public final class ReplayResult {

    /**
     * The word the {@code status} column writes: {@code normal} for a good sample, else the fault's
     * name in lower case with hyphens ({@code measurement-not-finite}), so a fault added to the core
     * later gets a word too.
     */
    public static String statusWord(Fault fault) {
        return fault == Fault.NONE ? "normal" : fault.name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The per-row columns a replay fills. */
    static final class Columns {
        final double[] output;
        final double[] position;
        final double[] proportional;
        final double[] integral;
        final double[] derivative;
        final double[] periodSeconds;
        final Fault[] status;
        final Mode[] mode;

        Columns(int rows) {
            output = new double[rows];
            position = new double[rows];
            proportional = new double[rows];
            integral = new double[rows];
            derivative = new double[rows];
            periodSeconds = new double[rows];
            status = new Fault[rows];
            mode = new Mode[rows];
        }
    }

    private final ControllerSettings settings;
    private final Trace trace;
    private final boolean measuredPeriod;
    private final Columns columns;

    ReplayResult(ControllerSettings settings, Trace trace, boolean measuredPeriod, Columns columns) {
        this.settings = settings;
        this.trace = trace;
        this.measuredPeriod = measuredPeriod;
        this.columns = columns;
    }

    /** The settings replayed. */
    public ControllerSettings settings() {
        return settings;
    }

    /** The trace replayed. */
    public Trace trace() {
        return trace;
    }

    /** Whether the periods came from the {@code time} column. */
    public boolean measuredPeriod() {
        return measuredPeriod;
    }

    /** The number of rows. */
    public int rowCount() {
        return columns.output.length;
    }

    /** The controller's output for a row (an increment for increment output). */
    public double output(int row) {
        return columns.output[row];
    }

    /** The actuator position the controller asked for at a row (equal to the output for position output). */
    public double position(int row) {
        return columns.position[row];
    }

    /** The proportional contribution at a row. */
    public double proportional(int row) {
        return columns.proportional[row];
    }

    /** The integral contribution at a row. */
    public double integral(int row) {
        return columns.integral[row];
    }

    /** The derivative contribution at a row. */
    public double derivative(int row) {
        return columns.derivative[row];
    }

    /** The fault seen at a row, {@link Fault#NONE} for a good sample. */
    public Fault status(int row) {
        return columns.status[row];
    }

    /** The period used for a row's update, in seconds. */
    public double periodSeconds(int row) {
        return columns.periodSeconds[row];
    }

    /** The controller's mode after a row's update. */
    public Mode mode(int row) {
        return columns.mode[row];
    }

    /**
     * Writes the trace's columns as read (its logged {@code output} renamed {@code logged_output}),
     * then {@code output, proportional, integral, derivative, status}, one row per trace row, as
     * {@link Replay#stream} does. Numbers are written in Java's shortest exact form.
     */
    public void writeCsv(Appendable out) throws IOException {
        Replay.printRow(out, Replay.resultHeader(trace.header()));
        StringBuilder line = new StringBuilder();
        for (int k = 0; k < rowCount(); k++) {
            line.setLength(0);
            Replay.appendResultRow(line, trace.row(k).cells(), Replay.number(output(k)),
                    Replay.number(proportional(k)), Replay.number(integral(k)), Replay.number(derivative(k)),
                    statusWord(status(k)));
            out.append(line);
        }
    }
}
