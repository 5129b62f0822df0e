package org.loopwright.sim.plant;

/**
 * A process driven by one input and observed through one output, advanced in time by its caller.
 * The input is held constant over each interval (zero-order hold), which is how a sampled
 * controller drives a real actuator.
 *
 * <p>Example: {@code plant.advance(40.0, 0.5); double temperature = plant.output();}
 *
 * <p>Not thread-safe: one simulation thread owns a plant. {@link #advance} allocates nothing once
 * the plant has seen each interval length it is asked for.
 */
public interface Plant {

    /** Returns to rest: every state, and any input history held for a dead time, at its initial value. */
    void reset();

    /** The output at the current time, in process units. */
    double output();

    /**
     * Moves time forward with the input held constant.
     *
     * @param inputHeldOverInterval the input applied over the whole interval, in input units
     * @param seconds               the interval's length, &gt; 0 (a zero or negative length does nothing)
     */
    void advance(double inputHeldOverInterval, double seconds);
}
