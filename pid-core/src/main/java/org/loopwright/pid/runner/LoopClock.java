package org.loopwright.pid.runner;

import java.util.concurrent.locks.LockSupport;

/**
 * The runner's source of time and its way to sleep. {@link #SYSTEM} is the monotonic clock of the
 * JVM with {@link LockSupport#parkNanos(long)}; tests inject a virtual clock whose time advances when
 * the runner parks, so that schedules can be checked exactly.
 *
 * <p>Implementations are called from the loop thread only, once or more per tick, and must not
 * allocate.
 */
public interface LoopClock {

    /** {@link System#nanoTime()} and {@link LockSupport#parkNanos(long)}. */
    LoopClock SYSTEM = new LoopClock() {
        @Override
        public long nanoTime() {
            return System.nanoTime();
        }

        @Override
        public void parkNanos(long nanos) {
            LockSupport.parkNanos(nanos);
        }
    };

    /** {@return monotonic time in nanoseconds from an arbitrary origin (differences only are meaningful)} */
    long nanoTime();

    /**
     * Waits for at most about this many nanoseconds; may return early (spuriously or because the
     * runner is being stopped), after which the runner checks the time again.
     *
     * @param nanos the longest wait in nanoseconds
     */
    void parkNanos(long nanos);
}
