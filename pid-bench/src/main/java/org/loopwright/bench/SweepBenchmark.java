package org.loopwright.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.sim.plant.LinearPlant;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.sweep.Sweep;
import org.loopwright.sim.sweep.SweepResult;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Sweeps of the booster pump ({@link SweepWorkload}), {@value #RUNS} drawn runs and the nominal one per
 * operation, at two run lengths and on one and two threads, beside the plant + controller step they
 * are made of. The marginal cost of a step is the difference between the two lengths over the extra
 * steps, so every cost per run (drawing, pole computation, the pool) cancels; the speed-up is the one
 * thread's time over the two threads'.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
public class SweepBenchmark {

    /** Drawn runs per operation; with the nominal run, an even number of runs to share between two threads. */
    public static final int RUNS = 47;

    /** A sweep of {@code steps} samples a run on {@code threads} threads. */
    @State(Scope.Thread)
    public static class SweepState {
        /** Samples per run: the run lasts steps × 50 ms. */
        @Param({"1000", "10000"})
        public int steps;
        /** Threads of the sweep's pool. */
        @Param({"1", "2"})
        public int threads;

        Sweep sweep;

        /** Builds the sweep. */
        @Setup
        public void setUp() {
            Scenario pump = SweepWorkload.pump(SweepWorkload.LONG_RUN_SECONDS);
            Scenario stretched = pump.toBuilder().durationSeconds((steps - 1) * pump.samplePeriodSeconds()).build();
            sweep = new Sweep(stretched, SweepWorkload.spread(), SweepWorkload.SEED);
        }
    }

    /** One loop of the sweep stepped by hand: run 0's drawn plant, stepped exactly, and the scenario's controller. */
    @State(Scope.Thread)
    public static class StepState {
        LinearPlant plant;
        PidController controller;
        double setpoint;
        double period;
        double output;

        /** Builds run 0's plant and the controller. */
        @Setup
        public void setUp() {
            Scenario pump = SweepWorkload.pump(SweepWorkload.LONG_RUN_SECONDS);
            Sweep sweep = new Sweep(pump, SweepWorkload.spread(), SweepWorkload.SEED);
            plant = new LinearPlant((TransferFunction) sweep.scenario(0).plant());
            controller = new PidController(pump.controller().orElseThrow());
            setpoint = pump.setpoint().get(0).value();
            period = pump.samplePeriodSeconds();
        }
    }

    /**
     * The machine's own ceiling for the speed-up: {@value #RUNS} + 1 runs of the bare plant + controller step
     * ({@value #BARE_RUN_STEPS} steps each, run 0's plant and the scenario's controller), shared out exactly as
     * {@link Sweep#run} shares its runs (a pool of {@code threads} made per call, indices taken from one counter,
     * one plant and controller per thread), with nothing of the sweep's own work. A sweep cannot scale better
     * than this; what the machine's other load takes from the second core shows here too.
     */
    @State(Scope.Thread)
    public static class BareRunsState {
        /** Threads of the pool. */
        @Param({"1", "2"})
        public int threads;

        TransferFunction plant;
        ControllerSettings settings;
        double setpoint;
        double period;

        /** Reads run 0's plant and the controller. */
        @Setup
        public void setUp() {
            Scenario pump = SweepWorkload.pump(SweepWorkload.LONG_RUN_SECONDS);
            plant = (TransferFunction) new Sweep(pump, SweepWorkload.spread(), SweepWorkload.SEED).scenario(0).plant();
            settings = pump.controller().orElseThrow();
            setpoint = pump.setpoint().get(0).value();
            period = pump.samplePeriodSeconds();
        }
    }

    /** Steps of each bare run: as many as a long sweep run. */
    public static final int BARE_RUN_STEPS = 10_000;

    /** {@value #RUNS} + 1 bare runs on the sweep's pool pattern; the sum of the outputs, so the JIT keeps the work. */
    @Benchmark
    public double bareRuns(BareRunsState s) throws InterruptedException, ExecutionException {
        ExecutorService pool = Executors.newFixedThreadPool(s.threads);
        try {
            AtomicInteger next = new AtomicInteger();
            List<Future<Double>> sums = new ArrayList<>();
            for (int w = 0; w < s.threads; w++) {
                sums.add(pool.submit(() -> {
                    LinearPlant plant = new LinearPlant(s.plant);
                    PidController controller = new PidController(s.settings);
                    double sum = 0.0;
                    while (next.getAndIncrement() <= RUNS) {
                        plant.reset();
                        controller.reset();
                        double output = 0.0;
                        for (int k = 0; k < BARE_RUN_STEPS; k++) {
                            plant.advance(output, s.period);
                            output = controller.update(s.setpoint, plant.output());
                        }
                        sum += output;
                    }
                    return sum;
                }));
            }
            double total = 0.0;
            for (Future<Double> sum : sums) {
                total += sum.get();
            }
            return total;
        } finally {
            pool.shutdownNow();
        }
    }

    /** {@value #RUNS} runs and the nominal one. */
    @Benchmark
    public SweepResult sweep(SweepState state) {
        return state.sweep.run(RUNS, state.threads, index -> { });
    }

    /** The plant advanced one period, then the controller updated: the step a sweep run repeats. */
    @Benchmark
    public double plantAndController(StepState s) {
        s.plant.advance(s.output, s.period);
        s.output = s.controller.update(s.setpoint, s.plant.output());
        return s.output;
    }
}
