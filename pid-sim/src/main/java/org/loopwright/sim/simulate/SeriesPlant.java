package org.loopwright.sim.simulate;

import org.loopwright.sim.plant.Plant;

/**
 * The two plants of a cascade in series: the actuator drives the inner plant, whose output drives
 * the outer plant. Each sample interval is cut into {@value #SUB_STEPS} equal pieces; over each
 * piece the inner plant runs with the held input, and the outer plant with the mean of the inner
 * output at the piece's two ends (the trapezoidal rule: an error of order (h/m)² in the outer
 * plant's input, against an inner output that is not held between samples).
 *
 * <p>Not thread-safe: one simulation thread owns it. Allocates nothing once each plant has seen the
 * piece length.
 */
final class SeriesPlant implements Plant {

    /** Pieces per interval. */
    static final int SUB_STEPS = 10;

    private final Plant inner;
    private Plant outer;

    SeriesPlant(Plant inner, Plant outer) {
        this.inner = inner;
        this.outer = outer;
    }

    @Override
    public void reset() {
        inner.reset();
        outer.reset();
    }

    /** The outer plant's output. */
    @Override
    public double output() {
        return outer.output();
    }

    /** The outer plant: the scenario's own. */
    Plant outer() {
        return outer;
    }

    /** Puts another outer plant in place (at rest); the inner plant stays. */
    void replaceOuter(Plant replacement) {
        outer = replacement;
    }

    /** The inner plant's output: the inner measurement before any sensor. */
    double innerOutput() {
        return inner.output();
    }

    @Override
    public void advance(double inputHeldOverInterval, double seconds) {
        if (!(seconds > 0.0)) {
            return;
        }
        double piece = seconds / SUB_STEPS;
        for (int i = 0; i < SUB_STEPS; i++) {
            double start = inner.output();
            inner.advance(inputHeldOverInterval, piece);
            outer.advance(0.5 * (start + inner.output()), piece);
        }
    }
}
