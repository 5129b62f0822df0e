package org.loopwright.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.sweep.Sweep;
import org.loopwright.sim.sweep.SweepFiles;
import org.loopwright.sim.sweep.SweepResult;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;

/**
 * The files of a sweep ({@link SweepFiles#write}: the CSV, and the envelope plot as PNG and SVG) after {@code runs}
 * runs of the CLI figure's workload ({@link SweepWorkload}, 10⁴ steps a run, on every core), timed as the CLI meets
 * them: once per JVM, cold, the runs having run and the writing code not yet. The suite runs it in forks of its own,
 * one shot each, no warm-up ({@code BenchmarkSuite}); a warmed-up figure would hide what a user waits for.
 */
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Benchmark)
public class SweepFilesBenchmark {

    /** Drawn runs of the sweep whose files are written. */
    @Param("10000")
    public int runs;

    private Scenario scenario;
    private SweepResult result;
    private Path directory;

    /** Runs the sweep. */
    @Setup(Level.Trial)
    public void sweep() throws IOException {
        scenario = SweepWorkload.pump(SweepWorkload.LONG_RUN_SECONDS);
        result = new Sweep(scenario, SweepWorkload.spread(), SweepWorkload.SEED)
                .run(runs, Runtime.getRuntime().availableProcessors(), index -> { });
        directory = Files.createTempDirectory("sweep-files");
    }

    /** Writes the CSV, the PNG and the SVG. */
    @Benchmark
    public List<Path> write() throws IOException {
        return SweepFiles.write(result, directory, "booster pump", scenario.units());
    }

    /** Removes the files. */
    @TearDown(Level.Trial)
    public void removeFiles() throws IOException {
        try (Stream<Path> files = Files.walk(directory)) {
            for (Path file : files.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(file);
            }
        }
    }
}
