package org.loopwright.bench.suite;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.function.Function;
import java.util.stream.Collectors;

import org.loopwright.sim.timing.LoopTiming;
import org.loopwright.sim.timing.TimingResult;

/**
 * Everything one suite run measured, each figure beside its baseline, and the targets checked.
 *
 * @param command    the command that produced it
 * @param mode       "full" or "smoke" (a smoke run's figures are not measurements)
 * @param machine    where it ran
 * @param benchmarks JMH figures beside their baselines
 * @param timing     loop timings beside the busy-wait baseline at the same rate
 * @param commands   command-line runs timed from JVM start to exit
 * @param targets    the design targets and whether this run met them
 */
public record SuiteSummary(String command, String mode, Machine machine, List<Comparison> benchmarks,
        List<TimingComparison> timing, List<CommandTiming> commands, List<TargetCheck> targets) {

    /** The limit every update is compared with. */
    static final String BARE = "UpdateBenchmark.bareRecurrence";
    /** The full-featured update: the baseline of the bank, the variable period and the simulation step. */
    static final String FULL = "UpdateBenchmark.fullFeatured";
    static final String BANK = "BankBenchmark.tick";
    static final String SIMULATION_STEP = "SimulationStepBenchmark.plantAndController";
    /** The sweep's own plant + controller step, the baseline of its marginal cost per step. */
    static final String SWEEP_STEP = "SweepBenchmark.plantAndController";
    /** The sweep benchmark at a run length and thread count: {@code sweep(10000, 1)}. */
    static String sweep(int steps, int threads) {
        return "SweepBenchmark.sweep[steps=" + steps + ",threads=" + threads + "]";
    }
    /** The bare plant + controller runs on the sweep's pool pattern: the machine's ceiling for the speed-up. */
    static String bareRuns(int threads) {
        return "SweepBenchmark.bareRuns[threads=" + threads + "]";
    }
    /** The two run lengths of the sweep benchmark. */
    static final int SHORT_RUN_STEPS = 1_000;
    /** The files of the CLI figure's sweep, written cold: {@code SweepFilesBenchmark.write[runs=10000]}. */
    static final String SWEEP_FILES = "SweepFilesBenchmark.write[runs=10000]";
    /** Target: a sweep's files "well under a second" (our reading: half of one), cold, as the CLI writes them. */
    static final double SWEEP_FILES_SECONDS = 0.5;
    /** JVMs the sweep's files are written in, one cold shot each. */
    static final int SWEEP_FILES_FORKS = 5;
    static final int LONG_RUN_STEPS = 10_000;
    /** Target: a sweep's marginal cost per step within this factor of its plant + controller step. */
    static final double SWEEP_STEP_LIMIT = 2.0;
    /** Target: two threads at least this much faster than one. */
    static final double TWO_THREAD_SPEED_UP = 1.8;

    /** The loop monitor's sample; its target is checked when the run has it. */
    static final String MONITOR_SAMPLE = "MonitorBenchmark.monitorSample";

    /** Target: the full-featured update within this factor of the bare recurrence. */
    static final double FULL_OVER_BARE_LIMIT = 1.3;
    /** Target: the simulation step within this factor of the update alone. */
    static final double STEP_OVER_UPDATE_LIMIT = 2.0;
    /** Below this, the GC profiler's normalised allocation is reported as 0 B/op (its own noise). */
    static final double ZERO_BYTES_PER_OP = 0.5;

    /**
     * Sets the figures beside their baselines and checks the targets.
     *
     * @throws IllegalArgumentException when a baseline benchmark is missing from the figures
     */
    public static SuiteSummary of(String command, String mode, Machine machine, List<JmhFigure> figures,
            List<TimingResult> timings, List<CommandTiming> commands, int sweepRunsPerOp) {
        Map<String, JmhFigure> byName = figures.stream().collect(Collectors.toMap(JmhFigure::name, Function.identity()));
        JmhFigure bare = required(byName, BARE);
        JmhFigure full = required(byName, FULL);
        List<Comparison> comparisons = new ArrayList<>();
        for (JmhFigure f : figures) {
            JmhFigure baseline = baselineOf(f, bare, full, byName);
            comparisons.add(new Comparison(f, baseline, f.nsPerOp() / baseline.nsPerOp()));
        }
        List<TimingComparison> timingComparisons = compareTimings(timings);
        List<TargetCheck> targets = new ArrayList<>(List.of(
                fullOverBare(full, bare),
                fullAllocation(full),
                bankPerController(required(byName, BANK), full),
                simulationStep(required(byName, SIMULATION_STEP), full)));
        if (byName.containsKey(MONITOR_SAMPLE)) {
            targets.add(monitorSample(byName.get(MONITOR_SAMPLE), full));
        }
        if (byName.containsKey(SWEEP_STEP)) {
            JmhFigure longOne = required(byName, sweep(LONG_RUN_STEPS, 1));
            targets.add(sweepMarginalStep(required(byName, sweep(SHORT_RUN_STEPS, 1)), longOne,
                    byName.get(SWEEP_STEP), sweepRunsPerOp));
            targets.add(sweepSpeedUp(longOne, required(byName, sweep(LONG_RUN_STEPS, 2)), byName.get(bareRuns(1)),
                    byName.get(bareRuns(2))));
        }
        if (byName.containsKey(SWEEP_FILES)) {
            targets.add(sweepFiles(byName.get(SWEEP_FILES)));
        }
        for (CommandTiming c : commands) {
            targets.add(commandTarget(c));
        }
        return new SuiteSummary(command, mode, machine, comparisons, timingComparisons, List.copyOf(commands), targets);
    }

    /**
     * Sets each loop's timing beside the busy-wait baseline at the same rate.
     *
     * @throws IllegalArgumentException when a rate has no baseline
     */
    public static List<TimingComparison> compareTimings(List<TimingResult> timings) {
        List<TimingComparison> comparisons = new ArrayList<>();
        for (TimingResult t : timings) {
            TimingResult base = timings.stream()
                    .filter(b -> LoopTiming.BASELINE.equals(b.loop()) && b.periodNanos() == t.periodNanos())
                    .findFirst().orElseThrow(() -> new IllegalArgumentException(
                            "no busy-wait baseline at periodNanos=" + t.periodNanos()));
            comparisons.add(new TimingComparison(t, ratio(t.p50Nanos(), base.p50Nanos()),
                    ratio(t.p99Nanos(), base.p99Nanos()), ratio(t.p999Nanos(), base.p999Nanos()),
                    ratio(t.maxNanos(), base.maxNanos()), t.cpuFraction() / base.cpuFraction()));
        }
        return comparisons;
    }

    private static JmhFigure required(Map<String, JmhFigure> byName, String name) {
        JmhFigure f = byName.get(name);
        if (f == null) {
            throw new IllegalArgumentException("benchmark " + name + " is missing from the results");
        }
        return f;
    }

    /** The bare recurrence for every controller update, the full-featured update for what builds on it. */
    private static JmhFigure baselineOf(JmhFigure f, JmhFigure bare, JmhFigure full, Map<String, JmhFigure> byName) {
        String name = f.name();
        if (name.equals(BARE)) {
            return bare;
        }
        if (name.startsWith("SweepFilesBenchmark")) {
            return f; // a wall time of its own, read in its target
        }
        if (name.startsWith("SweepBenchmark.sweep") || name.startsWith("SweepBenchmark.bareRuns")) {
            // each sweep beside the same sweep on one thread; the figures are read in the targets
            return byName.getOrDefault(name.replaceFirst("threads=\\d+", "threads=1"), f);
        }
        if (name.startsWith("UpdateBenchmark.variablePeriod") || name.startsWith("BankBenchmark")
                || name.startsWith("SimulationStepBenchmark") || name.startsWith("MonitorBenchmark")
                || name.equals(SWEEP_STEP)) {
            return full;
        }
        return bare;
    }

    private static double ratio(long value, long baseline) {
        return baseline == 0 ? Double.POSITIVE_INFINITY : (double) value / baseline;
    }

    private static TargetCheck fullOverBare(JmhFigure full, JmhFigure bare) {
        double r = full.nsPerOp() / bare.nsPerOp();
        return new TargetCheck("full-featured update within " + FULL_OVER_BARE_LIMIT + "× of the bare recurrence",
                String.format("%.2f ns vs %.2f ns: %.2f×", full.nsPerOp(), bare.nsPerOp(), r),
                r <= FULL_OVER_BARE_LIMIT);
    }

    private static TargetCheck fullAllocation(JmhFigure full) {
        double b = full.bytesPerOp();
        if (Double.isNaN(b)) {
            return new TargetCheck("full-featured update allocates 0 B/op", "not measured (no GC profiler)", false);
        }
        return new TargetCheck("full-featured update allocates 0 B/op",
                String.format("%.4f B/op (GC profiler, gc.alloc.rate.norm)", b), b < ZERO_BYTES_PER_OP);
    }

    /** Met when the bank is not slower, or slower by less than the two confidence half-widths together. */
    private static TargetCheck bankPerController(JmhFigure bank, JmhFigure full) {
        double r = bank.nsPerOp() / full.nsPerOp();
        double excess = bank.nsPerOp() - full.nsPerOp();
        double noise = finiteOrZero(bank.errorNs()) + finiteOrZero(full.errorNs());
        boolean met = excess <= noise;
        String within = r > 1.0 && met ? " (slower by less than the measurement error)" : "";
        return new TargetCheck("bank of 1,000: cost per controller no worse than one controller alone",
                String.format("%.2f ns per controller vs %.2f ns alone: %.2f×%s", bank.nsPerOp(), full.nsPerOp(), r,
                        within), met);
    }

    /** Met when the monitor's sample costs no more than the update, within the two confidence half-widths. */
    private static TargetCheck monitorSample(JmhFigure sample, JmhFigure full) {
        double r = sample.nsPerOp() / full.nsPerOp();
        boolean met = sample.nsPerOp() - full.nsPerOp() <= finiteOrZero(sample.errorNs()) + finiteOrZero(full.errorNs());
        boolean zero = !(sample.bytesPerOp() >= ZERO_BYTES_PER_OP);
        return new TargetCheck("loop monitor: cost per sample no more than one update, 0 B per sample",
                String.format("%.2f ns per sample vs %.2f ns per update: %.2f×, %.4f B/op", sample.nsPerOp(),
                        full.nsPerOp(), r, sample.bytesPerOp()), met && zero);
    }

    private static TargetCheck simulationStep(JmhFigure step, JmhFigure full) {
        double r = step.nsPerOp() / full.nsPerOp();
        return new TargetCheck("simulation step (FOPDT plant + controller) within " + STEP_OVER_UPDATE_LIMIT
                + "× of the update", String.format("%.2f ns vs %.2f ns: %.2f×", step.nsPerOp(), full.nsPerOp(), r),
                r <= STEP_OVER_UPDATE_LIMIT);
    }

    /**
     * The marginal cost of a step: the extra time of the long runs over the short ones, over the extra
     * steps ({@code runs} runs a sweep, each {@value #LONG_RUN_STEPS} − {@value #SHORT_RUN_STEPS} steps longer),
     * so what a run costs whatever its length (drawing, poles, the pool) cancels out.
     */
    private static TargetCheck sweepMarginalStep(JmhFigure shortRuns, JmhFigure longRuns, JmhFigure step, int runs) {
        double perStep = (longRuns.nsPerOp() - shortRuns.nsPerOp()) / ((double) runs * (LONG_RUN_STEPS - SHORT_RUN_STEPS));
        double r = perStep / step.nsPerOp();
        return new TargetCheck("sweep: marginal cost per step on one thread within " + SWEEP_STEP_LIMIT
                + "× of the plant + controller step", String.format(
                        "%.2f ns per step ((%.0f − %.0f ns) / (%d runs × %d steps)) vs %.2f ns: %.2f×", perStep,
                        longRuns.nsPerOp(), shortRuns.nsPerOp(), runs, LONG_RUN_STEPS - SHORT_RUN_STEPS,
                        step.nsPerOp(), r), r <= SWEEP_STEP_LIMIT);
    }

    /**
     * The sweep's speed-up from 1 to 2 threads, and beside it, when measured, the same for bare plant + controller
     * runs shared out the same way: what this machine gives any such work at that moment (its ceiling).
     */
    private static TargetCheck sweepSpeedUp(JmhFigure one, JmhFigure two, JmhFigure bareOne, JmhFigure bareTwo) {
        double speedUp = one.nsPerOp() / two.nsPerOp();
        String ceiling = bareOne == null || bareTwo == null ? "" : String.format(
                "; bare plant + controller runs on the same pool: %.2f×", bareOne.nsPerOp() / bareTwo.nsPerOp());
        return new TargetCheck("sweep: 2 threads at least " + TWO_THREAD_SPEED_UP + "× as fast as 1",
                String.format("%.2f ms on 1 thread, %.2f ms on 2: %.2f×%s", one.nsPerOp() / 1e6, two.nsPerOp() / 1e6,
                        speedUp, ceiling), speedUp >= TWO_THREAD_SPEED_UP);
    }

    private static TargetCheck sweepFiles(JmhFigure files) {
        double seconds = files.nsPerOp() / 1e9;
        return new TargetCheck("sweep: CSV, PNG and SVG of 10⁴ runs, cold, under " + SWEEP_FILES_SECONDS + " s",
                String.format("%.3f s ± %.3f s (one shot in each of %d JVMs)", seconds, files.errorNs() / 1e9,
                        SWEEP_FILES_FORKS),
                seconds < SWEEP_FILES_SECONDS);
    }

    private static TargetCheck commandTarget(CommandTiming c) {
        String outcome = c.exitCode() == 0 ? "" : "FAILED with exit " + c.exitCode() + ", so not a timing; ";
        return new TargetCheck(c.what() + " under " + c.limitSeconds() + " s wall time, JVM start included",
                String.format("%s%.2f s (load average %.2f before): %s", outcome, c.wallSeconds(),
                        c.loadAverageBefore(), c.command()), c.exitCode() == 0 && c.wallSeconds() < c.limitSeconds());
    }

    private static double finiteOrZero(double value) {
        return Double.isFinite(value) ? value : 0.0;
    }
}
