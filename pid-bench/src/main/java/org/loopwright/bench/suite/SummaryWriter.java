package org.loopwright.bench.suite;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

import org.loopwright.sim.timing.TimingResult;

/** Writes a {@link SuiteSummary} as {@code summary.md} and {@code summary.json} in a directory. */
public final class SummaryWriter {

    private SummaryWriter() {
    }

    /**
     * Writes both files, creating the directory when needed.
     *
     * @return the Markdown file
     * @throws IOException when a file cannot be written
     */
    public static Path write(SuiteSummary summary, Path directory) throws IOException {
        Files.createDirectories(directory);
        new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
                .writeValue(directory.resolve("summary.json").toFile(), summary);
        Path markdown = directory.resolve("summary.md");
        Files.writeString(markdown, markdown(summary), StandardCharsets.UTF_8);
        return markdown;
    }

    /** The Markdown text: machine, targets, benchmarks, loop timing. */
    public static String markdown(SuiteSummary s) {
        StringBuilder md = new StringBuilder();
        Machine m = s.machine();
        md.append("# Loopwright benchmark summary\n\n");
        if (s.mode().equals("smoke")) {
            md.append("**Smoke run: one very short iteration each; the figures only show that every benchmark ran.**\n\n");
        }
        md.append("Command: `").append(s.command()).append("`\n\n");
        md.append(f("Machine: %d logical processors, %s; %s; %s. One-minute load average %.2f before, %.2f after.%n%n",
                m.processors(), m.cpuModel(), m.os(), m.jvm(), m.loadAverageBefore(), m.loadAverageAfter()));

        md.append("## Targets\n\n| Target | Measured | Met |\n|---|---|---|\n");
        for (TargetCheck t : s.targets()) {
            md.append("| ").append(t.target()).append(" | ").append(t.measured()).append(" | ")
                    .append(t.met() ? "yes" : "**NO: target missed**").append(" |\n");
        }
        md.append('\n');

        md.append("## Update benchmarks (JMH, average time, GC profiler)\n\n")
                .append("| Benchmark | ns/op | ± (99.9 %) | B/op | Baseline | Baseline ns/op | Ratio |\n")
                .append("|---|---:|---:|---:|---|---:|---:|\n");
        for (Comparison c : s.benchmarks()) {
            JmhFigure fig = c.figure();
            md.append(f("| %s | %.2f | %.2f | %s | %s | %.2f | %.2f× |%n", fig.name(), fig.nsPerOp(), fig.errorNs(),
                    Double.isNaN(fig.bytesPerOp()) ? "n/a" : f("%.3f", fig.bytesPerOp()), c.baseline().name(),
                    c.baseline().nsPerOp(), c.ratio()));
        }
        md.append('\n');

        md.append("## Loop timing\n\n").append(timingTable(s.timing()));

        md.append("\n## Command-line runs\n\nEach in a JVM of its own, from process start to exit.\n\n")
                .append("| Command | Wall s | Exit | Load average before |\n|---|---:|---:|---:|\n");
        for (CommandTiming c : s.commands()) {
            md.append(f("| `%s` | %.2f | %d | %.2f |%n", c.command(), c.wallSeconds(), c.exitCode(),
                    c.loadAverageBefore()));
        }
        return md.toString();
    }

    /** The loop-timing table: period error |(start(k) − start(k−1)) − h| beside the busy-wait baseline. */
    public static String timingTable(List<TimingComparison> timing) {
        StringBuilder md = new StringBuilder();
        md.append("Period error |(start(k) − start(k−1)) − h| in µs, each with its ratio to the busy-wait baseline"
                        + " at the same rate; CPU is the loop thread's CPU time over the wall time.\n\n")
                .append("| Rate | Loop | Margin µs | Ticks | Overruns | Skipped | p50 µs | p99 µs | p99.9 µs | max µs"
                        + " | CPU |\n")
                .append("|---|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|\n");
        for (TimingComparison c : timing) {
            TimingResult t = c.result();
            md.append(f("| %s | %s | %s | %d | %d | %d | %s | %s | %s | %s | %s |%n",
                    rate(t.periodNanos()), t.loop(), t.spinMarginNanos() == 0 ? "–" : f("%.0f", t.spinMarginNanos() / 1e3),
                    t.ticks(), t.overruns(), t.skipped(),
                    micros(t.p50Nanos(), c.p50Ratio()), micros(t.p99Nanos(), c.p99Ratio()),
                    micros(t.p999Nanos(), c.p999Ratio()), micros(t.maxNanos(), c.maxRatio()),
                    f("%.0f %% (%.2f×)", 100.0 * t.cpuFraction(), c.cpuRatio())));
        }
        return md.toString();
    }

    private static String rate(long periodNanos) {
        double hertz = 1e9 / periodNanos;
        return hertz >= 1000 ? f("%.0f kHz", hertz / 1000) : f("%.0f Hz", hertz);
    }

    private static String micros(long nanos, double ratio) {
        return f("%.2f (%.1f×)", nanos / 1e3, ratio);
    }

    private static String f(String format, Object... args) {
        return String.format(Locale.ROOT, format, args);
    }
}
