package org.loopwright.bench.suite;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.loopwright.bench.Workloads;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.runner.RunnerSettings;
import org.loopwright.pid.runner.WaitStrategy;
import org.loopwright.sim.timing.LoopTiming;
import org.loopwright.sim.timing.TimingResult;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * The loop-timing measurement on its own: the runner at 1 kHz and 10 kHz with each wait strategy,
 * and the busy-wait baseline, printed as a Markdown table. The timing itself is pid-sim's (the same
 * code as the {@code timing} command), here with the full-featured controller. Run with
 * {@code java -cp pid-bench/target/pid-bench-benchmarks.jar org.loopwright.bench.suite.LoopTimingProgram}.
 */
@Command(name = "loop-timing", mixinStandardHelpOptions = true,
        description = "Measures the loop runner's period error and CPU time at 1 kHz and 10 kHz.")
public final class LoopTimingProgram implements Callable<Integer> {

    /** The rates measured: 1 kHz and 10 kHz. */
    static final long[] PERIODS_NANOS = {1_000_000L, 100_000L};

    @Spec
    private CommandSpec spec;

    @Option(names = "--seconds", paramLabel = "SECONDS", defaultValue = "3",
            description = "How long each loop runs (default: ${DEFAULT-VALUE}).")
    private double seconds;

    /** Runs the program from the command line. */
    public static void main(String[] args) {
        System.exit(new CommandLine(new LoopTimingProgram()).execute(args));
    }

    @Override
    public Integer call() throws InterruptedException {
        if (!(seconds > 0.0) || !Double.isFinite(seconds)) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--seconds must be finite and > 0: --seconds=" + seconds);
        }
        List<TimingResult> results = measureAll(Duration.ofNanos((long) (seconds * 1e9)), true);
        System.out.print(SummaryWriter.timingTable(SuiteSummary.compareTimings(results)));
        return 0;
    }

    /** The park-then-spin margin: 100 µs, or half the period when that is shorter. */
    static long spinMarginFor(long periodNanos) {
        return Math.min(RunnerSettings.DEFAULT_SPIN_MARGIN_NANOS, periodNanos / 2);
    }

    /** Every loop at every rate, each for the given time, optionally reporting progress on standard output. */
    static List<TimingResult> measureAll(Duration each, boolean progress) throws InterruptedException {
        List<TimingResult> results = new ArrayList<>();
        for (long period : PERIODS_NANOS) {
            ControllerSettings settings = Workloads.fullFeatured().toBuilder().samplePeriodSeconds(period * 1e-9)
                    .build();
            for (WaitStrategy wait : WaitStrategy.values()) {
                results.add(report(LoopTiming.runner(settings, wait, spinMarginFor(period), each).result(),
                        progress));
            }
            results.add(report(LoopTiming.baseline(settings, each).result(), progress));
        }
        return results;
    }

    private static TimingResult report(TimingResult r, boolean progress) {
        if (progress) {
            System.out.printf("timing %s at %d ns: p50 %d ns, p99 %d ns, max %d ns, %d overruns%n", r.loop(),
                    r.periodNanos(), r.p50Nanos(), r.p99Nanos(), r.maxNanos(), r.overruns());
        }
        return r;
    }
}
