package org.loopwright.sim.study;

import java.util.List;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The outcome of a {@link DiscretisationStudy}: the continuous reference row first, then one row per
 * sample period and method pair. Thread-safe: immutable (the trajectories in the rows are only read).
 *
 * @param loop                    the scenario's sampled loop (plant, controller as the file gives it, sensor delay)
 * @param continuousMargins       the margins of the continuous design
 * @param crossoverRadPerSecond   the continuous design's gain crossover ω_c (its smallest-margin one)
 * @param periodsSeconds          the sample periods studied
 * @param referencePeriodSeconds  the fine period at which the continuous design was simulated
 * @param setpointStepSize        the size of the simulated set-point step, process units
 * @param loadStepSize            the size of the simulated load step, plant-input units
 * @param rows                    the table
 */
public record StudyResult(SampledLoop loop, StabilityMargins continuousMargins,
        double crossoverRadPerSecond, List<Double> periodsSeconds, double referencePeriodSeconds,
        double setpointStepSize, double loadStepSize, List<StudyRow> rows) {

    /** Copies the lists. */
    public StudyResult {
        periodsSeconds = List.copyOf(periodsSeconds);
        rows = List.copyOf(rows);
    }

    /** The plant studied. */
    public TransferFunction plant() {
        return loop.plant();
    }

    /** The controller as the scenario gives it. */
    public ControllerSettings settings() {
        return loop.controller();
    }
}
