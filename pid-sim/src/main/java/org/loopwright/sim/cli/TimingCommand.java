package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.runner.WaitStrategy;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.timing.LoopTiming;
import org.loopwright.sim.timing.TimedRun;
import org.loopwright.sim.timing.TimingFiles;
import org.loopwright.sim.timing.TimingResult;

import com.fasterxml.jackson.annotation.JsonProperty;
import com.fasterxml.jackson.annotation.JsonUnwrapped;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code timing [--controller C.yaml] --rate HZ [--seconds S] [--wait park|spin|park-then-spin]
 * [--margin-us M] [--out DIR] [--json]}: runs the controller on the real loop runner on this machine
 * against a synthetic first-order plant stepped in the same tick, then a bare busy-wait loop doing
 * the same work at the same rate as the baseline, and judges the runner's period error against a
 * budget (p99.9 under {@value #BUDGET_PERCENT} % of the period, no skipped tick). The loop runs at the
 * controller's sample period: with a controller file, {@code --rate} may be left out, and must agree
 * with the file when given. Exit code 2 for bad input.
 */
@Command(name = "timing", mixinStandardHelpOptions = true,
        description = {"Times the loop runner on this machine: period error, overruns, CPU share and update cost,"
                + " beside a bare busy-wait loop at the same rate, with a verdict against a budget.",
                "Without --controller, runs a built-in demo controller (numbers of our own invention)."})
public final class TimingCommand implements Callable<Integer> {

    /** The budget: the runner's p99.9 period error under this share of the period. */
    static final double BUDGET_PERCENT = 10.0;
    /** What else runs on the machine changes every figure: said before any of them. */
    static final String CAUTION = "Caution: these figures depend on everything else this machine runs (other"
            + " processes, power saving, the host of a virtual machine); measure on a quiet machine, best with the"
            + " loop thread on an isolated core (common practice).";
    private static final double MAX_RATE_HZ = 100_000.0;
    private static final double MIN_SECONDS = 0.5;
    private static final double MAX_SECONDS = 600.0;
    private static final int MIN_TICKS = 100;

    @Spec
    private CommandSpec spec;

    @Option(names = "--controller", paramLabel = "C.yaml",
            description = "The controller file; its sample period is the loop's (default: a built-in demo).")
    private Path controllerFile;

    @Option(names = "--rate", paramLabel = "HZ",
            description = "The loop rate in Hz, up to 100000; required without --controller, optional with it"
                    + " (it must then match the file's sample period).")
    private Double rateHz;

    @Option(names = "--seconds", paramLabel = "S", defaultValue = "10",
            description = "How long each loop runs, 0.5 to 600 (default: ${DEFAULT-VALUE}); the whole command"
                    + " takes twice as long.")
    private double seconds;

    @Option(names = "--wait", paramLabel = "WAIT", defaultValue = "park-then-spin", converter = OptionWords.Waits.class,
            completionCandidates = OptionWords.Waits.class,
            description = "How the runner waits: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
    private WaitStrategy strategy;

    @Option(names = "--margin-us", paramLabel = "M", defaultValue = "100",
            description = "For park-then-spin: spin for the last M µs before each deadline, 0 to 1000000"
                    + " (default: ${DEFAULT-VALUE}).")
    private double marginMicros;

    /** Without --out, timing prints its table and writes no files. */
    @Mixin
    private OutputOptions output;

    @Override
    public Integer call() throws InterruptedException, IOException {
        PrintWriter out = spec.commandLine().getOut();
        ControllerSettings settings = controllerSettings();
        long margin = margin();
        Duration each = duration(settings);
        boolean json = output.json();
        // staged before the run, so that a --out that cannot be written is said at once (null: no --out, no files)
        try (OutputStage stage = output.givenDirectory().isPresent() ? output.stage() : null) {
            if (!json) {
                out.println(CAUTION);
                out.printf(Locale.ROOT, "Timing the loop runner at %s (h = %.1f µs), %s, wait %s%s, %.1f s per loop:"
                        + " the runner first, then the baseline...%n", TimingFiles.rate(periodNanos(settings)),
                        periodNanos(settings) / 1e3, controllerFile == null ? "demo controller (invented numbers)"
                                : "controller " + controllerFile, strategy.word(),
                        strategy == WaitStrategy.PARK_THEN_SPIN ? String.format(Locale.ROOT, " (margin %.0f µs)",
                                margin / 1e3) : "", seconds);
                out.flush();
            }
            LoopTiming.warmUp(settings);
            TimedRun runner = LoopTiming.runner(settings, strategy, margin, each);
            TimedRun baseline = LoopTiming.baseline(settings, each);
            Verdict verdict = Verdict.of(runner.result(), baseline.result());
            if (stage != null) {
                TimingFiles.writeLog(stage.directory(), runner, baseline);
                TimingFiles.writePlot(stage.directory(), runner, baseline, verdict.budgetNanos / 1e3);
                stage.commit();
            }
            if (json) {
                out.println(JsonOutput.text(json(runner.result(), baseline.result(), verdict)));
            } else {
                printTable(out, runner.result(), baseline.result(), verdict);
            }
        }
        out.flush();
        return 0;
    }

    private ControllerSettings controllerSettings() {
        if (rateHz != null && !(rateHz > 0.0 && rateHz <= MAX_RATE_HZ)) {
            throw bad("--rate must be > 0 and at most " + (long) MAX_RATE_HZ + " Hz: --rate=" + rateHz);
        }
        if (controllerFile == null) {
            if (rateHz == null) {
                throw bad("--rate is required without --controller (the demo controller runs at the rate given)");
            }
            return demo(1.0 / rateHz);
        }
        ControllerSettings settings = ControllerFile.read(controllerFile);
        double period = settings.samplePeriodSeconds();
        if (rateHz != null && Math.abs(1.0 / rateHz - period) > 1e-9 * period) {
            throw bad(String.format(Locale.ROOT, "--rate must match the controller file's sample period (the loop"
                    + " runs at the controller's period; leave --rate out to use it): sample-period=%s s in %s is"
                    + " %s, --rate=%s", period, controllerFile, TimingFiles.rate(periodNanos(settings)), rateHz));
        }
        if (1.0 / period > MAX_RATE_HZ) {
            throw bad("the controller's sample period must be at least 10 µs for timing: sample-period=" + period
                    + " in " + controllerFile);
        }
        return settings;
    }

    /** The demo: a PID with a filtered derivative and back-calculation, output 0–100, tuned for the plant's T. */
    static ControllerSettings demo(double periodSeconds) {
        return ControllerSettings.builder()
                .gains(new IdealGains(2.0, 40.0 * periodSeconds, 5.0 * periodSeconds))
                .derivativeFilterTimeSeconds(periodSeconds)
                .samplePeriodSeconds(periodSeconds)
                .outputRange(0.0, 100.0)
                .windupProtection(WindupProtection.BACK_CALCULATION)
                .build();
    }

    private long margin() {
        if (!(marginMicros >= 0.0 && marginMicros <= 1e6)) {
            throw bad("--margin-us must be between 0 and 1000000: --margin-us=" + marginMicros);
        }
        return Math.round(marginMicros * 1e3);
    }

    private Duration duration(ControllerSettings settings) {
        if (!(seconds >= MIN_SECONDS && seconds <= MAX_SECONDS)) {
            throw bad("--seconds must be between " + MIN_SECONDS + " and " + MAX_SECONDS + ": --seconds=" + seconds);
        }
        if (seconds < MIN_TICKS * settings.samplePeriodSeconds()) {
            throw bad(String.format(Locale.ROOT, "--seconds must cover at least %d periods (%s s at this rate):"
                    + " --seconds=%s", MIN_TICKS, MIN_TICKS * settings.samplePeriodSeconds(), seconds));
        }
        return Duration.ofNanos(Math.round(seconds * 1e9));
    }

    private static long periodNanos(ControllerSettings settings) {
        return Math.round(settings.samplePeriodSeconds() * 1e9);
    }

    private static InputException bad(String message) {
        return new InputException(message);
    }

    /** The judgement, with the figures it rests on. */
    private record Verdict(boolean withinBudget, long budgetNanos, String reason) {
        static Verdict of(TimingResult runner, TimingResult baseline) {
            long budget = Math.round(runner.periodNanos() * BUDGET_PERCENT / 100.0);
            boolean errorOk = runner.p999Nanos() < budget;
            boolean noSkips = runner.skipped() == 0;
            StringBuilder why = new StringBuilder(String.format(Locale.ROOT,
                    "p99.9 period error %.2f µs %s %.2f µs (%.0f %% of the period), %d skipped ticks",
                    runner.p999Nanos() / 1e3, errorOk ? "<" : ">=", budget / 1e3, BUDGET_PERCENT, runner.skipped()));
            if (!(errorOk && noSkips) && (baseline.p999Nanos() >= budget || baseline.skipped() > 0)) {
                why.append("; the bare busy-wait misses the budget too, so this machine (as loaded now) cannot"
                        + " hold this rate whatever the wait");
            }
            return new Verdict(errorOk && noSkips, budget, why.toString());
        }

        String word() {
            return withinBudget ? "within-budget" : "over-budget";
        }
    }

    /**
     * {@code timing --json}: the runner's figures at the top level, the bare busy-wait's under {@code baseline}.
     *
     * @param caution       the caution on timing figures from a shared machine
     * @param runner        the runner's figures
     * @param baseline      the bare busy-wait loop's figures
     * @param budgetUs      the period-error budget, µs
     * @param verdict       within-budget or over-budget
     * @param verdictReason the figures the verdict rests on, in words
     */
    record TimingJson(String caution, @JsonUnwrapped FiguresJson runner, FiguresJson baseline, double budgetUs,
            String verdict, String verdictReason) {
    }

    /**
     * One loop's figures.
     *
     * @param rateHz        the loop rate
     * @param waitWord      how it waited (busy-wait for the baseline), key {@code wait}
     * @param ticks         ticks run
     * @param overruns      ticks that overran their period
     * @param skipped       ticks skipped
     * @param cpuShare      the loop thread's CPU time over the wall time, or null
     * @param updateNs      mean time of one update, ns, or null
     * @param periodErrorUs percentiles of the period error, µs
     */
    record FiguresJson(double rateHz, @JsonProperty("wait") String waitWord, long ticks, long overruns, long skipped, double cpuShare,
            double updateNs, PeriodErrorJson periodErrorUs) {

        static FiguresJson of(TimingResult r) {
            return new FiguresJson(1e9 / r.periodNanos(), r.loop().equals(LoopTiming.BASELINE) ? "busy-wait"
                    : r.loop().substring("runner, ".length()), r.ticks(), r.overruns(), r.skipped(), r.cpuFraction(),
                    r.updateNanos(), new PeriodErrorJson(r.p50Nanos() / 1e3, r.p99Nanos() / 1e3, r.p999Nanos() / 1e3,
                            r.maxNanos() / 1e3));
        }
    }

    /** Period-error percentiles, µs. */
    record PeriodErrorJson(double p50, double p99, @JsonProperty("p99_9") double p999, double max) {
    }

    private static TimingJson json(TimingResult runner, TimingResult baseline, Verdict verdict) {
        return new TimingJson(CAUTION, FiguresJson.of(runner), FiguresJson.of(baseline), verdict.budgetNanos / 1e3,
                verdict.word(), verdict.reason);
    }

    private void printTable(PrintWriter out, TimingResult runner, TimingResult baseline, Verdict verdict) {
        String row = "%-24s %24s %24s%n";
        out.printf(Locale.ROOT, row, "", runner.loop(), baseline.loop());
        out.printf(Locale.ROOT, row, "ticks", runner.ticks(), baseline.ticks());
        out.printf(Locale.ROOT, row, "overruns", runner.overruns(), baseline.overruns());
        out.printf(Locale.ROOT, row, "skipped ticks", runner.skipped(), baseline.skipped());
        out.printf(Locale.ROOT, row, "CPU share of the thread", percent(runner.cpuFraction()),
                percent(baseline.cpuFraction()));
        out.printf(Locale.ROOT, row, "update ns (mean)", f(runner.updateNanos()), f(baseline.updateNanos()));
        out.printf(Locale.ROOT, row, "period error p50 µs", micros(runner.p50Nanos()), micros(baseline.p50Nanos()));
        out.printf(Locale.ROOT, row, "period error p99 µs", micros(runner.p99Nanos()), micros(baseline.p99Nanos()));
        out.printf(Locale.ROOT, row, "period error p99.9 µs", micros(runner.p999Nanos()),
                micros(baseline.p999Nanos()));
        out.printf(Locale.ROOT, row, "period error max µs", micros(runner.maxNanos()), micros(baseline.maxNanos()));
        out.printf(Locale.ROOT, "Verdict: %s: %s.%n", verdict.withinBudget ? "within budget" : "OVER BUDGET",
                verdict.reason);
        output.givenDirectory().ifPresent(directory -> out.printf("Wrote %s and %s%n",
                directory.resolve(TimingFiles.PLOT), directory.resolve(TimingFiles.LOG)));
    }

    private static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.0f %%", 100.0 * fraction);
    }

    private static String f(double value) {
        return String.format(Locale.ROOT, "%.1f", value);
    }

    private static String micros(long nanos) {
        return String.format(Locale.ROOT, "%.2f", nanos / 1e3);
    }
}
