package org.loopwright.pid.testing;

import org.loopwright.pid.runner.LoopClock;

/**
 * A clock whose time moves only when the runner parks, reads it (by a fixed cost per read) or a
 * test advances it to stand for work: schedules become exact and independent of the machine and its
 * load. The one test clock of pid-core's and the examples' runner tests. Used by one thread at a
 * time: the starting thread before the runner starts, then the loop thread alone; the test reads it
 * after the join.
 */
public final class VirtualClock implements LoopClock {

    private final long readCostNanos;
    private long now = 1_000_000_000L;

    /**
     * A clock at 1 s.
     *
     * @param readCostNanos how far each {@link #nanoTime()} moves the clock, ns
     */
    public VirtualClock(long readCostNanos) {
        this.readCostNanos = readCostNanos;
    }

    @Override
    public long nanoTime() {
        now += readCostNanos;
        return now;
    }

    @Override
    public void parkNanos(long nanos) {
        now += nanos;
    }

    /**
     * Time spent working inside a callback.
     *
     * @param nanos how far to move the clock, ns
     */
    public void advance(long nanos) {
        now += nanos;
    }
}
