package org.loopwright.pid.runner;

import java.util.concurrent.Semaphore;

/**
 * A virtual clock that holds the loop thread at every park until the test lets the next tick run:
 * between {@link #awaitParked()} and {@link #nextTick()} the loop is known to sit between two ticks,
 * so commands sent then must land exactly at the next one. Parking advances time to the deadline.
 */
final class GatedClock implements LoopClock {

    private final Semaphore parked = new Semaphore(0);
    private final Semaphore proceed = new Semaphore(0);
    private volatile boolean open;
    private long now = 1_000_000_000L;

    @Override
    public long nanoTime() {
        return now;
    }

    @Override
    public void parkNanos(long nanos) {
        now += nanos;
        if (!open) {
            parked.release();
            proceed.acquireUninterruptibly();
        }
    }

    /** Waits until the loop thread parks after its current tick. */
    void awaitParked() {
        parked.acquireUninterruptibly();
    }

    /** Lets the parked loop run its next tick. */
    void nextTick() {
        proceed.release();
    }

    /** Stops holding the loop (before stopping the runner). */
    void open() {
        open = true;
        proceed.release();
    }
}
