package org.loopwright.pid.runner;

/**
 * Receives the timing of every tick, on the loop thread, after the output is written. The arguments
 * are primitives so that a histogram or a metrics counter can be fed without allocation; the
 * listener itself must not allocate or block, or it becomes part of the tick's cost.
 *
 * <p>Example: {@code (scheduled, start, end, overrun) -> lateness.recordValue(start - scheduled)}.
 */
@FunctionalInterface
public interface TimingListener {

    /** A listener that ignores every tick. */
    TimingListener NONE = (scheduledNanos, startNanos, endNanos, overrun) -> { };

    /**
     * One tick's timing, all in the runner clock's nanoseconds.
     *
     * @param scheduledNanos the tick's deadline on the grid, start + k·period
     * @param startNanos     when the tick began (at or after the deadline)
     * @param endNanos       when the output had been written
     * @param overrun        true when the tick ended after the next deadline (it overran its slot)
     */
    void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overrun);
}
