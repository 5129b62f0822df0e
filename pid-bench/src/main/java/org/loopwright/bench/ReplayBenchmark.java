package org.loopwright.bench;

import java.io.IOException;
import java.io.OutputStream;
import java.io.StringReader;
import java.util.concurrent.TimeUnit;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.sim.replay.Replay;
import org.loopwright.sim.replay.ReplaySummary;
import org.loopwright.sim.replay.TraceReader;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The cost per row of {@code replay}: read a CSV row, update the controller, write the result row
 * (target: 10⁷ rows in a few seconds, so a few hundred ns a row), beside the controller update
 * alone over the same rows. The trace is the bath heater's workload as text, three columns like a
 * gateway's log; the result goes to a stream that keeps nothing, so the file system is not measured.
 * The replay reads and formats on threads of its own: the figure is wall time per row with every
 * core the machine gives it; the noisy measurement changes the terms every row, so a decimal is
 * seldom reused (a real log at an output limit is cheaper).
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Thread)
public class ReplayBenchmark {

    /** Rows a replay: 16 of its batches, so the threads it starts cost little per row. */
    private static final int ROWS = 64 * Workloads.LENGTH;

    private ControllerSettings settings;
    private String trace;
    private double[] setpoints;
    private double[] measurements;

    /** Builds the trace text. */
    @Setup
    public void setUp() {
        settings = Workloads.fullFeatured();
        setpoints = Workloads.setpoints();
        measurements = Workloads.measurements(3);
        StringBuilder text = new StringBuilder("time,setpoint,measurement\n");
        for (int k = 0; k < ROWS; k++) {
            int i = k & Workloads.MASK;
            text.append(k * Workloads.PERIOD_SECONDS).append(',').append(setpoints[i]).append(',')
                    .append(measurements[i]).append('\n');
        }
        trace = text.toString();
    }

    /** Read, update and write, per row. */
    @Benchmark
    @OperationsPerInvocation(ROWS)
    public long replayRow() throws IOException {
        try (TraceReader reader = TraceReader.of("bench.csv", new StringReader(trace))) {
            ReplaySummary summary = Replay.stream(settings, reader, false, false, OutputStream.nullOutputStream());
            return summary.rows();
        }
    }

    /** The controller update alone over the same rows: the yardstick. */
    @Benchmark
    @OperationsPerInvocation(ROWS)
    public double updateRow() {
        PidController controller = new PidController(settings);
        double sum = 0.0;
        for (int k = 0; k < ROWS; k++) {
            int i = k & Workloads.MASK;
            sum += controller.update(setpoints[i], measurements[i]);
        }
        return sum;
    }
}
