package org.loopwright.examples;

import org.loopwright.pid.runner.LoopClock;

/**
 * A clock whose time moves only when the runner parks or reads it (by a fixed cost per read), so a
 * run's schedule does not depend on the machine or its load. Read by one thread at a time: the
 * starting thread before the runner starts, then the loop thread alone.
 */
final class StepClock implements LoopClock {

    private final long readCostNanos;
    private long now = 5_000_000_000L;

    StepClock(long readCostNanos) {
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
}
