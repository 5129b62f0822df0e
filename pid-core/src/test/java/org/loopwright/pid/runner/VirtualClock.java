package org.loopwright.pid.runner;

/**
 * A clock whose time moves only when the runner parks, reads it (by a fixed cost per read) or a
 * callback advances it to stand for work: schedules become exact and independent of machine load.
 * Used by the loop thread alone while the runner runs; the test reads it after the join.
 */
final class VirtualClock implements LoopClock {

    private final long readCostNanos;
    private long now = 1_000_000_000L;

    VirtualClock(long readCostNanos) {
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

    /** Time spent working inside a callback. */
    void advance(long nanos) {
        now += nanos;
    }
}
