package org.loopwright.bench.suite;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

import org.loopwright.bench.SweepBenchmark;
import org.loopwright.bench.SweepFilesBenchmark;
import org.loopwright.bench.SweepWorkload;
import org.loopwright.sim.timing.TimingResult;
import org.openjdk.jmh.infra.BenchmarkParams;
import org.openjdk.jmh.profile.GCProfiler;
import org.openjdk.jmh.results.Result;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.ChainedOptionsBuilder;
import org.openjdk.jmh.runner.options.OptionsBuilder;
import org.openjdk.jmh.runner.options.TimeValue;
import org.openjdk.jmh.runner.options.VerboseMode;

import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * The short benchmark suite in one command: every JMH benchmark (one fork, 2 × 1 s warm-up,
 * 3 × 1 s measurement, GC profiler) and the sweep's files (one cold shot in each of
 * {@value SuiteSummary#SWEEP_FILES_FORKS} forks), then the loop timing at 1 kHz and 10 kHz for each loop, then
 * the timed command-line runs (a sweep of 10⁴ runs × 10⁴ steps, design with its defaults), then the
 * summary. About five minutes on two cores. The JMH runner itself stays available as
 * {@code java -cp <jar> org.openjdk.jmh.Main}.
 */
@Command(name = "loopwright-bench", mixinStandardHelpOptions = true,
        description = "Runs the benchmark suite and writes summary.md and summary.json.")
public final class BenchmarkSuite implements Callable<Integer> {

    /** The run length of the smoke run's timed sweep command, seconds of the pump. */
    private static final double SMOKE_RUN_SECONDS = 20.0;

    @Spec
    private CommandSpec spec;

    @Option(names = "--output-dir", paramLabel = "DIR", defaultValue = "bench-results",
            description = "Where summary.md and summary.json go (default: ${DEFAULT-VALUE}).")
    private Path outputDirectory;

    @Option(names = "--timing-seconds", paramLabel = "SECONDS", defaultValue = "3",
            description = "How long each loop-timing run lasts (default: ${DEFAULT-VALUE}).")
    private double timingSeconds;

    @Option(names = "--smoke", description = "One very short in-process iteration of everything: checks that it runs.")
    private boolean smoke;

    @Option(names = "--command-text", paramLabel = "TEXT", defaultValue = "pid-bench/run-suite.sh", hidden = true,
            description = "The command recorded in the summary.")
    private String commandText;

    /** Runs the suite from the command line. */
    public static void main(String[] args) {
        System.exit(new CommandLine(new BenchmarkSuite()).execute(args));
    }

    @Override
    public Integer call() throws RunnerException, InterruptedException, java.io.IOException {
        if (!(timingSeconds > 0.0) || !Double.isFinite(timingSeconds)) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--timing-seconds must be finite and > 0: --timing-seconds=" + timingSeconds);
        }
        Machine machine = Machine.now();
        List<JmhFigure> figures = runJmh();
        List<TimingResult> timings = runTiming();
        List<CommandTiming> commands = runCommands();
        SuiteSummary summary = SuiteSummary.of(commandText, smoke ? "smoke" : "full", machine.ended(), figures, timings,
                commands, SweepBenchmark.RUNS + 1);
        Path markdown = SummaryWriter.write(summary, outputDirectory);
        System.out.println(SummaryWriter.markdown(summary));
        System.out.println("written: " + markdown + " and summary.json");
        return 0;
    }

    private List<JmhFigure> runJmh() throws RunnerException {
        ChainedOptionsBuilder options = new OptionsBuilder().include("org\\.loopwright\\.bench\\..*Benchmark\\..*")
                .exclude(SweepFilesBenchmark.class.getName()).shouldFailOnError(true);
        // the sweep's files: one cold shot per JVM, as the CLI writes them (a smoke run: in this JVM, 10 runs)
        ChainedOptionsBuilder files = new OptionsBuilder().include(SweepFilesBenchmark.class.getName())
                .shouldFailOnError(true).warmupIterations(0).measurementIterations(1);
        if (smoke) {
            options.forks(0).warmupIterations(0).measurementIterations(1)
                    .measurementTime(TimeValue.milliseconds(20)).verbosity(VerboseMode.SILENT);
            files.forks(0).param("runs", "10").verbosity(VerboseMode.SILENT);
        } else {
            options.forks(1).warmupIterations(2).warmupTime(TimeValue.seconds(1)).measurementIterations(3)
                    .measurementTime(TimeValue.seconds(1)).addProfiler(GCProfiler.class);
            files.forks(SuiteSummary.SWEEP_FILES_FORKS);
        }
        List<RunResult> results = new ArrayList<>(new Runner(options.build()).run());
        results.addAll(new Runner(files.build()).run());
        return results.stream().map(BenchmarkSuite::figure).collect(Collectors.toList());
    }

    static JmhFigure figure(RunResult run) {
        BenchmarkParams params = run.getParams();
        String benchmark = params.getBenchmark();
        String[] parts = benchmark.split("\\.");
        String name = parts[parts.length - 2] + "." + parts[parts.length - 1];
        if (!params.getParamsKeys().isEmpty()) {
            name += params.getParamsKeys().stream().map(k -> k + "=" + params.getParam(k))
                    .collect(Collectors.joining(",", "[", "]"));
        }
        Result<?> primary = run.getPrimaryResult();
        Result<?> allocation = run.getSecondaryResults().get("gc.alloc.rate.norm");
        return new JmhFigure(name, primary.getScore(), primary.getScoreError(),
                allocation == null ? Double.NaN : allocation.getScore());
    }

    /**
     * The command-line runs, each in a JVM of its own: the sweep of 10⁴ runs × 10⁴ steps of the booster pump and
     * design with its defaults on the pump's model (README's design example). A smoke run times a sweep of
     * 10 short runs only.
     */
    private List<CommandTiming> runCommands() throws java.io.IOException, InterruptedException {
        Path work = Files.createTempDirectory("loopwright-bench-commands");
        try {
            double seconds = smoke ? SMOKE_RUN_SECONDS : SweepWorkload.LONG_RUN_SECONDS;
            String runs = smoke ? "10" : "10000";
            Path scenario = SweepWorkload.writePump(work, seconds);
            List<CommandTiming> timings = new ArrayList<>();
            timings.add(CommandTiming.measure(smoke ? "CLI sweep (smoke: 10 runs of " + SMOKE_RUN_SECONDS + " s)"
                    : "CLI sweep of 10⁴ runs × 10⁴ steps", CommandTiming.SWEEP_SECONDS, List.of("sweep",
                            scenario.toString(), "--runs", runs, "--spread", SweepWorkload.SPREAD, "--seed",
                            String.valueOf(SweepWorkload.SEED), "--no-progress", "--out", work.resolve("sweep").toString()),
                    work));
            if (!smoke) {
                timings.add(CommandTiming.measure("design with its defaults", CommandTiming.DESIGN_SECONDS,
                        List.of("design", "--process-gain", "0.05", "--time-constant", "2", "--dead-time", "0.4",
                                "--sample-period", "0.05", "--output-min", "0", "--output-max", "100", "--no-progress",
                                "--out", work.resolve("design").toString()), work));
            }
            return timings;
        } finally {
            try (java.util.stream.Stream<Path> files = Files.walk(work)) {
                for (Path p : files.sorted(java.util.Comparator.reverseOrder()).toList()) {
                    Files.delete(p);
                }
            }
        }
    }

    private List<TimingResult> runTiming() throws InterruptedException {
        Duration each = smoke ? Duration.ofMillis(100) : Duration.ofNanos((long) (timingSeconds * 1e9));
        return LoopTimingProgram.measureAll(each, !smoke);
    }
}
