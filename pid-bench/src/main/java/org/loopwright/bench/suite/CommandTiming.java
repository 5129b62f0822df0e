package org.loopwright.bench.suite;

import java.io.File;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;

/**
 * The wall time of one command-line run of the harness in a JVM of its own, start-up included, as a
 * user meets it: {@code java -cp <this jar> org.loopwright.sim.cli.LoopwrightCommand ARGS}, output discarded.
 *
 * @param what            what the run is, for the target's wording
 * @param limitSeconds    the wall time it should stay under
 * @param command         the arguments after the main class, as one line
 * @param wallSeconds     from starting the process to its exit
 * @param exitCode        the process's exit code (0 when it ran through)
 * @param loadAverageBefore one-minute system load average just before it started
 */
public record CommandTiming(String what, double limitSeconds, String command, double wallSeconds, int exitCode,
        double loadAverageBefore) {

    /** Target: the CLI sweep of 10⁴ runs × 10⁴ steps within this wall time, JVM start included. */
    public static final double SWEEP_SECONDS = 5.0;
    /** Target: design with its defaults within this wall time. */
    public static final double DESIGN_SECONDS = 10.0;

    private static final String MAIN = "org.loopwright.sim.cli.LoopwrightCommand";

    /**
     * Runs the harness with {@code arguments} in {@code workDirectory} and times it.
     *
     * @throws IOException when the JVM cannot be started
     */
    public static CommandTiming measure(String what, double limitSeconds, List<String> arguments, Path workDirectory)
            throws IOException, InterruptedException {
        List<String> command = new ArrayList<>(List.of(javaBinary(), "-cp", absoluteClassPath(), MAIN));
        command.addAll(arguments);
        double load = ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
        ProcessBuilder builder = new ProcessBuilder(command).directory(workDirectory.toFile())
                .redirectOutput(ProcessBuilder.Redirect.DISCARD).redirectError(ProcessBuilder.Redirect.DISCARD);
        long start = System.nanoTime();
        Process process = builder.start();
        int exit = process.waitFor();
        double seconds = (System.nanoTime() - start) / 1e9;
        return new CommandTiming(what, limitSeconds, String.join(" ", arguments), seconds, exit, load);
    }

    /** This JVM's class path with every entry absolute: the run starts in another directory. */
    private static String absoluteClassPath() {
        return Stream.of(System.getProperty("java.class.path").split(File.pathSeparator))
                .map(entry -> Path.of(entry).toAbsolutePath().toString())
                .collect(Collectors.joining(File.pathSeparator));
    }

    private static String javaBinary() {
        return ProcessHandle.current().info().command().orElse(Path.of(System.getProperty("java.home"), "bin", "java")
                .toString());
    }
}
