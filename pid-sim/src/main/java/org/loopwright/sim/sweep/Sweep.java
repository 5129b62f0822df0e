package org.loopwright.sim.sweep;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntConsumer;

import org.hipparchus.complex.Complex;
import org.loopwright.sim.frequency.CascadeAnalysis;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.InnerLoop;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.ClosedLoop;
import org.loopwright.sim.simulate.Trajectory;

/**
 * A parameter sweep: runs the scenario's closed loop on many plants drawn around its nominal
 * (linear) plant, in parallel, and keeps every run's figures.
 *
 * <p>Run i draws its plant from a random stream seeded by (seed, i) alone (see {@link PlantDraw#draw}),
 * so the result for a seed is the same whatever the number of threads and the order the runs finish
 * in. Everything else — controller, setpoint, loads, actuator, sensor and the sensor's noise seed —
 * is the scenario's, the same in every run: runs differ only in the plant, and a sweep with zero spread
 * repeats the nominal simulation exactly.
 *
 * <p>Example: 200 runs with the gain ±20 % on every core:
 * <pre>{@code
 * SweepResult r = new Sweep(scenario, Spread.parse("gain=20%"), 7L).run(200, 4, index -> { });
 * r.unstableShare();
 * }</pre>
 * Thread-safe: immutable; {@link #run(int, int, IntConsumer)} uses a pool of its own.
 */
public final class Sweep {

    /** Closed-loop poles are computed only up to this much dead time (plant and sensor), in sample periods. */
    public static final int MAX_DELAY_PERIODS = 100;

    /** Each run's measurement is kept for the plot thinned to about this many points. */
    public static final int PLOT_POINTS = 200;

    /** The index reported for the nominal run. */
    public static final int NOMINAL_INDEX = -1;

    private final Scenario scenario;
    private final TransferFunction nominalPlant;
    private final Spread spread;
    private final long seed;

    /**
     * A sweep around the scenario's plant.
     *
     * @param scenario the nominal scenario; its plant must be linear
     * @param spread   how far the plant parameters stray
     * @param seed     the seed of the plant draws
     * @throws IllegalArgumentException for a nonlinear plant
     */
    public Sweep(Scenario scenario, Spread spread, long seed) {
        this.scenario = Objects.requireNonNull(scenario, "scenario");
        this.spread = Objects.requireNonNull(spread, "spread");
        this.nominalPlant = scenario.linearPlant().orElseThrow(() -> new IllegalArgumentException(
                "a sweep needs a linear plant (its gain, time constants and dead time are varied): plant="
                        + scenario.plant()));
        this.seed = seed;
    }

    /** The factors of run {@code index}: the same for the same seed and index, whatever else runs. */
    public PlantDraw draw(int index) {
        return PlantDraw.draw(spread, new SplittableRandom(runSeed(seed, index)));
    }

    /** The scenario of run {@code index}: the nominal one with the drawn plant. */
    public Scenario scenario(int index) {
        return scenario.withPlant(draw(index).apply(nominalPlant));
    }

    /**
     * Runs {@code runs} simulations on {@code threads} threads. Each thread builds one closed loop and
     * rewinds it onto the next run's plant ({@link ClosedLoop#rewind(PlantModel)}), taking run indices
     * one at a time from a shared counter, so a slow run does not hold up a fixed share of the work;
     * each result goes to its index's slot, whichever thread ran it.
     *
     * @param runs          how many plants to draw, at least 1
     * @param threads       the pool's size, at least 1
     * @param onRunFinished told the index of each run as it finishes (from the pool's threads)
     */
    public SweepResult run(int runs, int threads, IntConsumer onRunFinished) {
        if (runs < 1 || threads < 1) {
            throw new IllegalArgumentException("runs and threads must be >= 1: runs=" + runs + ", threads=" + threads);
        }
        int workers = Math.min(threads, runs);
        ExecutorService pool = Executors.newFixedThreadPool(workers);
        try {
            SweepRun[] results = new SweepRun[runs];
            AtomicInteger next = new AtomicInteger();
            List<Future<?>> futures = new ArrayList<>(workers);
            for (int w = 0; w < workers; w++) {
                futures.add(pool.submit(() -> {
                    ClosedLoop loop = new ClosedLoop(scenario);
                    for (int index = next.getAndIncrement(); index < runs; index = next.getAndIncrement()) {
                        results[index] = run(loop, index, draw(index));
                        onRunFinished.accept(index);
                    }
                }));
            }
            SweepRun nominal = run(new ClosedLoop(scenario), NOMINAL_INDEX, PlantDraw.NOMINAL);
            for (Future<?> future : futures) {
                future.get();
            }
            return new SweepResult(scenario, spread, seed, nominal, List.of(results));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("sweep interrupted", e);
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException runtime) {
                throw runtime;
            }
            throw new IllegalStateException("a sweep run failed", e.getCause());
        } finally {
            pool.shutdownNow();
        }
    }

    /** One run on a thread's own loop, rewound onto the drawn plant. */
    private SweepRun run(ClosedLoop loop, int index, PlantDraw draw) {
        TransferFunction plant = draw.apply(nominalPlant);
        Scenario drawn = scenario.withPlant(plant);
        loop.rewind(plant);
        Trajectory trajectory = loop.run();
        ResponseMetrics metrics = ResponseMetrics.of(drawn, trajectory);
        double poleMagnitude = largestPoleMagnitude(drawn);
        LoopStability stability = trajectory.diverged() ? LoopStability.DIVERGED
                : poleMagnitude >= 1.0 ? LoopStability.UNSTABLE
                : Double.isNaN(poleMagnitude) ? LoopStability.NOT_ASSESSED : LoopStability.STABLE;
        int stride = Math.max(1, (trajectory.length() + PLOT_POINTS - 1) / PLOT_POINTS);
        int count = (trajectory.length() + stride - 1) / stride;
        boolean lastKept = (trajectory.length() - 1) % stride == 0;
        double[] times = new double[lastKept ? count : count + 1];
        double[] measurements = new double[times.length];
        for (int i = 0; i < count; i++) {
            times[i] = trajectory.time(i * stride);
            measurements[i] = trajectory.measurement(i * stride);
        }
        if (!lastKept) {
            times[count] = trajectory.time(trajectory.length() - 1);
            measurements[count] = trajectory.measurement(trajectory.length() - 1);
        }
        return new SweepRun(index, draw, plant, metrics, stability, poleMagnitude, times, measurements);
    }

    /**
     * The largest closed-loop pole magnitude of the sampled linear loop (sensor delay included; for a
     * cascade, of the outer loop with the inner loop closed, the inner plant as given); NaN for an on-off
     * controller, too long a delay, or a controller the analysis rejects.
     */
    private static double largestPoleMagnitude(Scenario drawn) {
        SampledLoop loop = drawn.sampledLoop().orElse(null);
        if (loop == null || loop.totalDelaySeconds() > MAX_DELAY_PERIODS * loop.periodSeconds()) {
            return Double.NaN;
        }
        try {
            if (drawn.inner().isPresent()) {
                // a cascade: the outer loop with the inner loop closed, whose poles include the inner loop's
                InnerLoop inner = drawn.inner().get();
                return CascadeAnalysis.outerSampled(loop.plant().withDeadTime(loop.totalDelaySeconds()),
                        loop.controller(), inner.plant().linear().orElseThrow(), inner.controller())
                        .largestPoleMagnitude();
            }
            double largest = 0.0;
            for (Complex pole : LoopAnalysis.closedLoopPoles(LoopAnalysis.sampledLoop(loop))) {
                largest = Math.max(largest, pole.norm());
            }
            return largest;
        } catch (IllegalArgumentException notAnalysable) {
            return Double.NaN;
        }
    }

    /**
     * The seed of run {@code index}'s stream: both numbers through the SplitMix64 finaliser (Steele,
     * Lea &amp; Flood, OOPSLA 2014), so neighbouring indices give unrelated streams.
     */
    static long runSeed(long seed, int index) {
        return mix(seed ^ mix(0x9E3779B97F4A7C15L * (index + 1L)));
    }

    private static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }
}
