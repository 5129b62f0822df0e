package org.loopwright.sim.sweep;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntConsumer;

import org.hipparchus.complex.Complex;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.frequency.CascadeAnalysis;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.PulseTransferFunction;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.PlantParameters;
import org.loopwright.sim.plant.PlantType;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.InnerLoop;
import org.loopwright.sim.scenario.Scenario;

/**
 * A parameter sweep: runs the scenario's closed loop on many plants drawn around its nominal
 * plant, in parallel, and keeps every run's figures. A linear plant's gain, time constants and dead
 * time are spread and its runs judged by their closed-loop poles; a nonlinear plant's parameters are
 * spread by their file keys and its runs judged by the simulation alone ({@link StabilityBasis}).
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

    /**
     * Runs a thread steps on one {@link SweepRunner} before it builds a fresh one. A runner lives for many
     * collections, and once the collector has moved its objects some layouts make every step two to three
     * times slower (measured with G1, the default collector on two cores: a CLI sweep of 10⁴ runs took
     * 5.8–14.5 s from one start to the next with one runner per thread, 5.3–6.5 s with one every 50 runs).
     * A fresh runner is laid out together again; building one costs far less than a run.
     */
    static final int RUNS_PER_RUNNER = 50;

    private final Scenario scenario;
    private final PlantModel nominalPlant;
    private final Spread spread;
    private final long seed;
    /** C(z), the same in every run, made once; null without a sampled loop or for a controller the analysis rejects. */
    private final PulseTransferFunction controllerPulse;

    /**
     * A sweep around the scenario's plant.
     *
     * @param scenario the nominal scenario
     * @param spread   how far the plant parameters stray, by the plant type's spread keys
     * @param seed     the seed of the plant draws
     * @throws InputException for a key the plant type does not take, a spread of a parameter whose
     *                                  nominal value is 0 or infinite (a factor cannot move it), or a spread
     *                                  whose extremes give a plant the model refuses
     */
    public Sweep(Scenario scenario, Spread spread, long seed) {
        this.scenario = Objects.requireNonNull(scenario, "scenario");
        this.spread = Objects.requireNonNull(spread, "spread");
        this.nominalPlant = scenario.plant();
        this.seed = seed;
        this.controllerPulse = scenario.sampledLoop().map(Sweep::controllerPulseOf).orElse(null);
        spread.requireKeysOf(nominalPlant.type());
        if (!(nominalPlant instanceof TransferFunction)) {
            requireDrawable(nominalPlant, spread);
        }
    }

    /**
     * Checks a nonlinear plant's spread before any run: each key spread must have a finite, non-zero
     * nominal value, and every corner of the spread (each factor at 1 − s or 1 + s) must give a plant the
     * model accepts. The models' rules are bounds on single values or on pairs (static friction at
     * least Coulomb friction), so the corners are where they fail first.
     */
    private static void requireDrawable(PlantModel nominal, Spread spread) {
        List<FileKey<Double>> spreadKeys = new ArrayList<>();
        for (FileKey<Double> key : nominal.type().spreadKeys()) {
            double value = PlantParameters.value(nominal, key);
            if (spread.fraction(key.word()) > 0.0) {
                if (value == 0.0 || Double.isInfinite(value)) {
                    throw new InputException("--spread " + key.word() + " cannot vary on plant type "
                            + nominal.type().word() + ": its nominal value is " + value
                            + " and a spread multiplies it; give the scenario a finite non-zero " + key.word());
                }
                spreadKeys.add(key);
            }
        }
        for (int corner = 0; corner < 1 << spreadKeys.size(); corner++) {
            Map<FileKey<Double>, Double> factors = new LinkedHashMap<>();
            for (int i = 0; i < spreadKeys.size(); i++) {
                double s = spread.fraction(spreadKeys.get(i).word());
                factors.put(spreadKeys.get(i), (corner >> i & 1) == 0 ? 1.0 - s : 1.0 + s);
            }
            try {
                PlantParameters.scaled(nominal, factors);
            } catch (InvalidSettingException refused) {
                StringBuilder drawn = new StringBuilder();
                factors.forEach((key, factor) -> drawn.append(drawn.length() == 0 ? "" : ", ").append(key.word())
                        .append(" x").append(factor));
                throw new InputException("--spread " + spread.text() + " can draw a " + nominal.type().word()
                        + " the model refuses: " + fileTerms(nominal.type(), refused.field()) + " "
                        + fileTerms(nominal.type(), refused.rule()) + ": " + fileTerms(nominal.type(), refused.field())
                        + "=" + refused.value() + ", at " + drawn
                        + "; narrow the spread or change the nominal values");
            }
        }
    }

    /** The model's field names in a text replaced by the file keys that fill them. */
    private static String fileTerms(PlantType type, String text) {
        String terms = text;
        for (FileKey<?> key : type.keys()) {
            terms = terms.replaceAll("\\b" + key.field() + "\\b", key.word());
        }
        return terms;
    }

    /** The factors of run {@code index}: the same for the same seed and index, whatever else runs. */
    public PlantDraw draw(int index) {
        return PlantDraw.draw(nominalPlant.type(), spread, new SplittableRandom(runSeed(seed, index)));
    }

    /** The scenario of run {@code index}: the nominal one with the drawn plant. */
    public Scenario scenario(int index) {
        return scenario.withPlant(draw(index).apply(nominalPlant));
    }

    /** What this sweep's stability verdicts rest on. */
    public StabilityBasis stabilityBasis() {
        return StabilityBasis.of(scenario);
    }

    /** A runner for one thread: its own loop, rewound onto each run's plant. */
    public SweepRunner runner() {
        return new SweepRunner(this, scenario);
    }

    /** The nominal scenario. */
    Scenario scenario() {
        return scenario;
    }

    /** The nominal plant with a draw's factors applied. */
    PlantModel plant(PlantDraw draw) {
        return draw.apply(nominalPlant);
    }

    /**
     * Runs {@code runs} simulations and the nominal one on {@code threads} threads. Each thread has a
     * {@link SweepRunner}, one closed loop rewound onto each run's plant (a fresh one every
     * {@value #RUNS_PER_RUNNER} runs), and takes run indices (the nominal run first) one at a time from a
     * shared counter, so a slow run does not hold up a fixed share of the work; each result goes to its
     * index's slot, whichever thread ran it.
     *
     * @param runs          how many plants to draw, at least 1
     * @param threads       the pool's size, at least 1
     * @param onRunFinished told the index of each drawn run as it finishes (from the pool's threads)
     */
    public SweepResult run(int runs, int threads, IntConsumer onRunFinished) {
        if (runs < 1 || threads < 1) {
            throw new IllegalArgumentException("runs and threads must be >= 1: runs=" + runs + ", threads=" + threads);
        }
        int workers = Math.min(threads, runs + 1);
        ExecutorService pool = Executors.newFixedThreadPool(workers);
        try {
            // slot 0 holds the nominal run (index -1), slot i + 1 run i
            SweepRun[] results = new SweepRun[runs + 1];
            AtomicInteger next = new AtomicInteger(NOMINAL_INDEX);
            List<Future<?>> futures = new ArrayList<>(workers);
            for (int w = 0; w < workers; w++) {
                futures.add(pool.submit(() -> {
                    SweepRunner runner = null;
                    int taken = 0;
                    for (int index = next.getAndIncrement(); index < runs; index = next.getAndIncrement()) {
                        if (taken++ % RUNS_PER_RUNNER == 0) {
                            runner = runner();
                        }
                        results[index + 1] = runner.run(index);
                        if (index != NOMINAL_INDEX) {
                            onRunFinished.accept(index);
                        }
                    }
                }));
            }
            for (Future<?> future : futures) {
                future.get();
            }
            return new SweepResult(scenario, spread, seed, results[0], List.of(results).subList(1, runs + 1));
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

    /**
     * The largest closed-loop pole magnitude of the sampled linear loop (sensor delay included; for a
     * cascade, of the outer loop with the inner loop closed, the inner plant as given); NaN for an on-off
     * controller, too long a delay, or a controller the analysis rejects.
     */
    static double largestPoleMagnitude(Scenario drawn) {
        return largestPoleMagnitude(drawn, drawn.sampledLoop().map(Sweep::controllerPulseOf).orElse(null));
    }

    /**
     * The same with the controller's pulse transfer function given (null when the analysis rejects the
     * controller): every run of a sweep has the nominal scenario's controller and period, so a sweep makes it
     * once ({@link #controllerPulse()}), and each run adds only its plant.
     */
    static double largestPoleMagnitude(Scenario drawn, PulseTransferFunction controller) {
        SampledLoop loop = drawn.sampledLoop().orElse(null);
        if (loop == null || loop.totalDelaySeconds() > MAX_DELAY_PERIODS * loop.periodSeconds()) {
            return Double.NaN;
        }
        try {
            if (drawn.inner().isPresent()) {
                // a cascade: the outer loop with the inner loop closed, whose poles include the inner loop's
                InnerLoop inner = drawn.inner().get();
                return CascadeAnalysis.outerSampled(loop.plant(), loop.controller(), inner.plant().linear().orElseThrow(),
                        inner.controller(), loop.sensorDelaySamples()).largestPoleMagnitude();
            }
            if (controller == null) {
                return Double.NaN;
            }
            double largest = 0.0;
            for (Complex pole : LoopAnalysis.closedLoopPoles(LoopAnalysis.sampledLoop(loop, controller))) {
                largest = Math.max(largest, pole.norm());
            }
            return largest;
        } catch (IllegalArgumentException notAnalysable) {
            return Double.NaN;
        }
    }

    /** The controller's pulse transfer function C(z) of this sweep's runs; null when there is none to analyse. */
    PulseTransferFunction controllerPulse() {
        return controllerPulse;
    }

    /** C(z) of a sampled loop's controller at its period; null when the analysis rejects it. */
    private static PulseTransferFunction controllerPulseOf(SampledLoop loop) {
        try {
            return LoopAnalysis.discreteController(loop.controller(), loop.periodSeconds());
        } catch (IllegalArgumentException notAnalysable) {
            return null;
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
