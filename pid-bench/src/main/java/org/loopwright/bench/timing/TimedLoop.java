package org.loopwright.bench.timing;

import org.loopwright.pid.runner.WaitStrategy;

/** The loops the timing program measures: the runner with each wait strategy, and the baseline. */
public enum TimedLoop {
    /** The runner, parking until each deadline. */
    RUNNER_PARK(WaitStrategy.PARK),
    /** The runner, spinning until each deadline. */
    RUNNER_SPIN(WaitStrategy.SPIN),
    /** The runner, parking until a margin before each deadline, then spinning. */
    RUNNER_PARK_THEN_SPIN(WaitStrategy.PARK_THEN_SPIN),
    /** A bare loop spinning on {@link System#nanoTime()} to absolute deadlines: the baseline. */
    BUSY_WAIT_BASELINE(null);

    private final WaitStrategy waitStrategy;

    TimedLoop(WaitStrategy waitStrategy) {
        this.waitStrategy = waitStrategy;
    }

    /** The runner's wait strategy, or null for the baseline. */
    public WaitStrategy waitStrategy() {
        return waitStrategy;
    }
}
