package org.loopwright.pid.runner;

/** How the loop thread waits for the next deadline. */
public enum WaitStrategy {
    /** Parks the thread until the deadline: least CPU, lateness set by the OS timer (tens of µs typically). */
    PARK,
    /** Spins on the clock with {@link Thread#onSpinWait()}: smallest lateness, one core fully busy. */
    SPIN,
    /**
     * Parks until {@link RunnerSettings#spinMarginNanos()} before the deadline, then spins: lateness
     * close to spinning at a fraction of its CPU time.
     */
    HYBRID
}
