package org.loopwright.bench.suite;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

/**
 * The machine a suite ran on.
 *
 * @param processors        logical processors the JVM sees
 * @param cpuModel          the CPU's model name (from /proc/cpuinfo on Linux, else "unknown")
 * @param os                operating system name, version and architecture
 * @param jvm               the JVM's name and version
 * @param loadAverageBefore one-minute system load average when the suite began (−1 when unavailable)
 * @param loadAverageAfter  the same when it ended
 */
public record Machine(int processors, String cpuModel, String os, String jvm, double loadAverageBefore,
        double loadAverageAfter) {

    /** This machine now; {@code loadAverageAfter} is filled in with {@link #ended()}. */
    public static Machine now() {
        return new Machine(Runtime.getRuntime().availableProcessors(), readCpuModel(),
                System.getProperty("os.name") + " " + System.getProperty("os.version") + " "
                        + System.getProperty("os.arch"),
                System.getProperty("java.vm.name") + " " + System.getProperty("java.runtime.version"),
                loadAverage(), Double.NaN);
    }

    /** This record with the load average at the end of the suite. */
    public Machine ended() {
        return new Machine(processors, cpuModel, os, jvm, loadAverageBefore, loadAverage());
    }

    private static double loadAverage() {
        return ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage();
    }

    private static String readCpuModel() {
        Path cpuinfo = Path.of("/proc/cpuinfo");
        if (!Files.isReadable(cpuinfo)) {
            return "unknown";
        }
        try (Stream<String> lines = Files.lines(cpuinfo)) {
            return lines.filter(line -> line.startsWith("model name"))
                    .map(line -> line.substring(line.indexOf(':') + 1).trim())
                    .findFirst().orElse("unknown");
        } catch (IOException e) {
            return "unknown";
        }
    }
}
