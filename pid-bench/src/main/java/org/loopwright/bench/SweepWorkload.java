package org.loopwright.bench;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.sweep.Spread;

/**
 * The sweep every sweep figure is measured on: the shipped booster pump scenario
 * ({@code scenarios/booster-pump.yaml}, h = 50 ms) stretched to a longer run, with the spread of the
 * sweep's committed reference (gain ±30 %, time constant ±20 %, dead time ±40 %), seed 42. At 500 s a
 * run is 10⁴ steps.
 */
public final class SweepWorkload {

    /** The spread of every benchmarked sweep. */
    public static final String SPREAD = "gain=30%,time-constant=20%,dead-time=40%";
    /** The seed of every benchmarked sweep. */
    public static final long SEED = 42L;
    /** The run length of the CLI figure: 10⁴ steps of 50 ms. */
    public static final double LONG_RUN_SECONDS = 500.0;

    private static final String RESOURCE = "/scenarios/booster-pump.yaml";

    private SweepWorkload() {
    }

    /** The spread, parsed. */
    public static Spread spread() {
        return Spread.parse(SPREAD);
    }

    /**
     * Writes the booster pump scenario with its duration replaced into {@code directory} and returns the file.
     *
     * @throws UncheckedIOException when the file cannot be written
     */
    public static Path writePump(Path directory, double durationSeconds) {
        try (InputStream in = SweepWorkload.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("the benchmarks jar lacks " + RESOURCE);
            }
            String text = new String(in.readAllBytes(), StandardCharsets.UTF_8)
                    .replaceFirst("(?m)^duration:.*$", "duration: " + durationSeconds);
            Path file = directory.resolve("booster-pump-" + (long) durationSeconds + "s.yaml");
            Files.writeString(file, text, StandardCharsets.UTF_8);
            return file;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The booster pump scenario lasting {@code durationSeconds}, read through a temporary file. */
    public static Scenario pump(double durationSeconds) {
        try {
            Path directory = Files.createTempDirectory("sweep-workload");
            Path file = writePump(directory, durationSeconds);
            try {
                return ScenarioFile.read(file);
            } finally {
                Files.delete(file);
                Files.delete(directory);
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
