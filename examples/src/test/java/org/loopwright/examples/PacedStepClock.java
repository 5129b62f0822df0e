package org.loopwright.examples;

import java.util.concurrent.locks.LockSupport;

import org.loopwright.pid.runner.LoopClock;
import org.loopwright.pid.testing.VirtualClock;

/**
 * A {@link VirtualClock} that also really waits as long as each park asks, so the loop runs at about
 * real speed and another thread (the operator) has time to act, while the schedule the runner sees
 * stays exact: its time moves only by the parks and the fixed read cost, whatever the machine does.
 */
final class PacedStepClock implements LoopClock {

    private final VirtualClock virtual;

    PacedStepClock(long readCostNanos) {
        this.virtual = new VirtualClock(readCostNanos);
    }

    @Override
    public long nanoTime() {
        return virtual.nanoTime();
    }

    @Override
    public void parkNanos(long nanos) {
        virtual.parkNanos(nanos);
        LockSupport.parkNanos(nanos);
    }
}
