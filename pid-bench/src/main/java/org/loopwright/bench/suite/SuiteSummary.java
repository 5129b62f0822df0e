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
 * @param targets    the design targets and whether this run met them
 */
public record SuiteSummary(String command, String mode, Machine machine, List<Comparison> benchmarks,
        List<TimingComparison> timing, List<TargetCheck> targets) {

    /** The limit every update is compared with. */
    static final String BARE = "UpdateBenchmark.bareRecurrence";
    /** The full-featured update: the baseline of the bank, the variable period and the simulation step. */
    static final String FULL = "UpdateBenchmark.fullFeatured";
    static final String BANK = "BankBenchmark.tick";
    static final String SIMULATION_STEP = "SimulationStepBenchmark.plantAndController";

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
            List<TimingResult> timings) {
        Map<String, JmhFigure> byName = figures.stream().collect(Collectors.toMap(JmhFigure::name, Function.identity()));
        JmhFigure bare = required(byName, BARE);
        JmhFigure full = required(byName, FULL);
        List<Comparison> comparisons = new ArrayList<>();
        for (JmhFigure f : figures) {
            JmhFigure baseline = baselineOf(f, bare, full);
            comparisons.add(new Comparison(f, baseline, f.nsPerOp() / baseline.nsPerOp()));
        }
        List<TimingComparison> timingComparisons = compareTimings(timings);
        List<TargetCheck> targets = List.of(
                fullOverBare(full, bare),
                fullAllocation(full),
                bankPerController(required(byName, BANK), full),
                simulationStep(required(byName, SIMULATION_STEP), full));
        return new SuiteSummary(command, mode, machine, comparisons, timingComparisons, targets);
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
    private static JmhFigure baselineOf(JmhFigure f, JmhFigure bare, JmhFigure full) {
        String name = f.name();
        if (name.equals(BARE)) {
            return bare;
        }
        if (name.startsWith("UpdateBenchmark.variablePeriod") || name.startsWith("BankBenchmark")
                || name.startsWith("SimulationStepBenchmark")) {
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

    private static TargetCheck simulationStep(JmhFigure step, JmhFigure full) {
        double r = step.nsPerOp() / full.nsPerOp();
        return new TargetCheck("simulation step (FOPDT plant + controller) within " + STEP_OVER_UPDATE_LIMIT
                + "× of the update", String.format("%.2f ns vs %.2f ns: %.2f×", step.nsPerOp(), full.nsPerOp(), r),
                r <= STEP_OVER_UPDATE_LIMIT);
    }

    private static double finiteOrZero(double value) {
        return Double.isFinite(value) ? value : 0.0;
    }
}
