package org.loopwright.sim.sweep;

import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.ClosedLoop;

/**
 * A thread's share of a sweep (up to {@value Sweep#RUNS_PER_RUNNER} runs): one closed loop and one
 * {@link RunRecorder}, built once and rewound onto each run's drawn plant ({@link ClosedLoop#rewind(PlantModel)}),
 * so a run allocates nothing per step after the runner's first run and keeps no trajectory. What a run still allocates, once per run: the drawn
 * plant and its scenario, the plant's discretisation for each new interval length, the stability verdict
 * and the result.
 *
 * <p>Example: {@code SweepRunner r = sweep.runner(); SweepRun first = r.run(0), second = r.run(1);}
 *
 * <p>Not thread-safe: one thread uses a runner; make one per thread with {@link Sweep#runner()}.
 */
public final class SweepRunner {

    private final Sweep sweep;
    private final RunRecorder recorder;
    private final ClosedLoop loop;

    // the run in progress
    private int index;
    private PlantDraw draw;
    private PlantModel plant;
    private Scenario drawn;
    private SustainedOscillation oscillation;

    SweepRunner(Sweep sweep, Scenario scenario) {
        this.sweep = sweep;
        this.recorder = new RunRecorder(scenario);
        this.loop = new ClosedLoop(scenario, recorder);
    }

    /**
     * Run {@code index} of the sweep, from start to end.
     *
     * @param runIndex the run's number, from 0, or {@link Sweep#NOMINAL_INDEX} for the nominal plant
     */
    public SweepRun run(int runIndex) {
        begin(runIndex);
        loop.runToEnd();
        return end();
    }

    /** Draws run {@code runIndex}'s plant and rewinds the loop onto it. */
    void begin(int runIndex) {
        index = runIndex;
        draw = runIndex == Sweep.NOMINAL_INDEX ? PlantDraw.NOMINAL : sweep.draw(runIndex);
        plant = sweep.plant(draw);
        drawn = sweep.scenario().withPlant(plant);
        loop.rewind(plant);
        // a nonlinear plant has no poles to ask: the oscillation check watches the run as it goes
        oscillation = StabilityBasis.of(drawn) == StabilityBasis.POLES ? null : SustainedOscillation.of(drawn);
        recorder.watch(oscillation);
    }

    /** One sample of the run in progress; false at its end. */
    boolean step() {
        return loop.step();
    }

    /** The result of the run in progress, its stability judged. */
    SweepRun end() {
        double poleMagnitude = Double.NaN;
        double decayRatio = Double.NaN;
        LoopStability stability;
        if (oscillation == null) {
            poleMagnitude = Sweep.largestPoleMagnitude(drawn, sweep.controllerPulse());
            stability = recorder.diverged() ? LoopStability.DIVERGED
                    : poleMagnitude >= 1.0 ? LoopStability.UNSTABLE
                    : Double.isNaN(poleMagnitude) ? LoopStability.NOT_ASSESSED : LoopStability.STABLE;
        } else {
            decayRatio = oscillation.decayRatio();
            // an on-off loop cycles by design: its cycling is not instability
            stability = recorder.diverged() ? LoopStability.DIVERGED
                    : drawn.onOffController().isPresent() ? LoopStability.NOT_ASSESSED
                    : oscillation.sustained() ? LoopStability.OSCILLATING : LoopStability.STABLE;
        }
        return new SweepRun(index, draw, plant, recorder.metrics(), stability, poleMagnitude, decayRatio,
                recorder.plot());
    }
}
