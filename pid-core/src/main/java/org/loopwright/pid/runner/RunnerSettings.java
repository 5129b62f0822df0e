package org.loopwright.pid.runner;

import org.loopwright.pid.InvalidSettingException;

/**
 * Immutable, validated settings of a {@link LoopRunner}. The period is not here: the runner ticks at
 * its controller's {@link org.loopwright.pid.ControllerSettings#samplePeriodSeconds()}, the one place
 * the sample period is given. Example: a loop that parks until 50 µs before each deadline and then
 * spins:
 * <pre>
 *   RunnerSettings.builder().waitStrategy(WaitStrategy.PARK_THEN_SPIN)
 *       .spinMarginNanos(50_000).threadName("bath-heater-loop").build();
 * </pre>
 *
 * <p>Thread-safe (immutable).
 */
public final class RunnerSettings {

    /**
     * Default spin margin of the park-then-spin wait: 100 µs (or the whole period when it is shorter),
     * above typical timer slack on Linux (common practice).
     */
    public static final long DEFAULT_SPIN_MARGIN_NANOS = 100_000L;
    /** Default number of failed ticks in a row after which the runner stops. */
    public static final int DEFAULT_MAX_CONSECUTIVE_FAILURES = 10;
    /** Default number of operator commands that may wait for the next tick. */
    public static final int DEFAULT_COMMAND_CAPACITY = 64;
    /** Largest number of operator commands that may wait for the next tick. */
    public static final int MAX_COMMAND_CAPACITY = 1 << 20;
    /** Default name of the loop thread. */
    public static final String DEFAULT_THREAD_NAME = "loopwright-loop";

    private final WaitStrategy waitStrategy;
    private final long spinMarginNanos;
    private final OverrunPolicy overrunPolicy;
    private final PeriodMode periodMode;
    private final int maxConsecutiveFailures;
    private final int commandCapacity;
    private final String threadName;
    private final boolean daemon;
    private final LoopClock clock;

    private RunnerSettings(Builder b) {
        waitStrategy = required("waitStrategy", b.waitStrategy);
        if (b.spinMarginNanos < 0) {
            throw new InvalidSettingException("spinMarginNanos", b.spinMarginNanos, "must be >= 0");
        }
        spinMarginNanos = b.spinMarginNanos;
        overrunPolicy = required("overrunPolicy", b.overrunPolicy);
        periodMode = required("periodMode", b.periodMode);
        if (b.maxConsecutiveFailures < 1) {
            throw new InvalidSettingException("maxConsecutiveFailures", b.maxConsecutiveFailures, "must be >= 1");
        }
        maxConsecutiveFailures = b.maxConsecutiveFailures;
        if (b.commandCapacity < 1 || b.commandCapacity > MAX_COMMAND_CAPACITY) {
            throw new InvalidSettingException("commandCapacity", b.commandCapacity,
                    "must be between 1 and " + MAX_COMMAND_CAPACITY);
        }
        commandCapacity = b.commandCapacity;
        if (b.threadName == null || b.threadName.isBlank()) {
            throw new InvalidSettingException("threadName", b.threadName == null ? null : "\"" + b.threadName + "\"",
                    "must not be blank");
        }
        threadName = b.threadName;
        daemon = b.daemon;
        clock = required("clock", b.clock);
    }

    private static <T> T required(String field, T value) {
        if (value == null) {
            throw new InvalidSettingException(field, null, "must be given");
        }
        return value;
    }

    /**
     * A builder with the defaults: park-then-spin wait with a 100 µs margin, skip missed ticks, fixed period,
     * stop after 10 failed ticks in a row, room for 64 waiting operator commands, a non-daemon thread named "loopwright-loop", the system clock.
     *
     * @return a new builder holding those defaults
     */
    public static Builder builder() {
        return new Builder();
    }

    /** {@return a builder that starts from these settings} */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.waitStrategy = waitStrategy;
        b.spinMarginNanos = spinMarginNanos;
        b.overrunPolicy = overrunPolicy;
        b.periodMode = periodMode;
        b.maxConsecutiveFailures = maxConsecutiveFailures;
        b.commandCapacity = commandCapacity;
        b.threadName = threadName;
        b.daemon = daemon;
        b.clock = clock;
        return b;
    }

    /** {@return how the loop thread waits for a deadline} */
    public WaitStrategy waitStrategy() {
        return waitStrategy;
    }

    /**
     * For {@link WaitStrategy#PARK_THEN_SPIN}: how long before the deadline parking ends and spinning
     * begins. A margin of a whole period or more spins the whole period.
     *
     * @return the spin margin in nanoseconds, &ge; 0
     */
    public long spinMarginNanos() {
        return spinMarginNanos;
    }

    /** {@return what happens after a tick that ends past the next deadline} */
    public OverrunPolicy overrunPolicy() {
        return overrunPolicy;
    }

    /** {@return whether the controller gets its fixed period or the measured one} */
    public PeriodMode periodMode() {
        return periodMode;
    }

    /** {@return failed ticks in a row after which the runner stops with {@link StopReason#CONSECUTIVE_FAILURES}} */
    public int maxConsecutiveFailures() {
        return maxConsecutiveFailures;
    }

    /** {@return how many operator commands may wait for the next tick before requests are refused} */
    public int commandCapacity() {
        return commandCapacity;
    }

    /** {@return the loop thread's name} */
    public String threadName() {
        return threadName;
    }

    /** {@return whether the loop thread is a daemon (does not keep the JVM alive)} */
    public boolean daemon() {
        return daemon;
    }

    /** {@return the clock the runner reads and parks on} */
    public LoopClock clock() {
        return clock;
    }

    /** Mutable builder; {@link #build()} validates every value. Not thread-safe. */
    public static final class Builder {
        private WaitStrategy waitStrategy = WaitStrategy.PARK_THEN_SPIN;
        private long spinMarginNanos = DEFAULT_SPIN_MARGIN_NANOS;
        private OverrunPolicy overrunPolicy = OverrunPolicy.SKIP_MISSED;
        private PeriodMode periodMode = PeriodMode.FIXED;
        private int maxConsecutiveFailures = DEFAULT_MAX_CONSECUTIVE_FAILURES;
        private int commandCapacity = DEFAULT_COMMAND_CAPACITY;
        private String threadName = DEFAULT_THREAD_NAME;
        private boolean daemon;
        private LoopClock clock = LoopClock.SYSTEM;

        private Builder() {
        }

        /**
         * How to wait for each deadline.
         *
         * @param value park, spin or park-then-spin (default park-then-spin)
         * @return this builder
         */
        public Builder waitStrategy(WaitStrategy value) {
            waitStrategy = value;
            return this;
        }

        /**
         * The park-then-spin wait's spin margin, &ge; 0 (default 100 µs).
         *
         * @param value the margin in nanoseconds, &ge; 0
         * @return this builder
         */
        public Builder spinMarginNanos(long value) {
            spinMarginNanos = value;
            return this;
        }

        /**
         * What to do after an overrun.
         *
         * @param value skip the missed deadlines (default) or run late
         * @return this builder
         */
        public Builder overrunPolicy(OverrunPolicy value) {
            overrunPolicy = value;
            return this;
        }

        /**
         * Fixed or measured period for the controller.
         *
         * @param value fixed (the controller gets its sample period, default) or measured
         * @return this builder
         */
        public Builder periodMode(PeriodMode value) {
            periodMode = value;
            return this;
        }

        /**
         * Failed ticks in a row after which the runner stops (&ge; 1).
         *
         * @param value the count, &ge; 1 (default 10)
         * @return this builder
         */
        public Builder maxConsecutiveFailures(int value) {
            maxConsecutiveFailures = value;
            return this;
        }

        /**
         * Operator commands that may wait for the next tick, 1 to {@value RunnerSettings#MAX_COMMAND_CAPACITY} (default 64).
         *
         * @param value the queue size
         * @return this builder
         */
        public Builder commandCapacity(int value) {
            commandCapacity = value;
            return this;
        }

        /**
         * The loop thread's name (not blank).
         *
         * @param value the name, not blank (default "loopwright-loop")
         * @return this builder
         */
        public Builder threadName(String value) {
            threadName = value;
            return this;
        }

        /**
         * Whether the loop thread is a daemon.
         *
         * @param value true for a daemon thread, which does not keep the JVM alive (default false)
         * @return this builder
         */
        public Builder daemon(boolean value) {
            daemon = value;
            return this;
        }

        /**
         * The clock (default {@link LoopClock#SYSTEM}).
         *
         * @param value the clock the runner reads and parks on
         * @return this builder
         */
        public Builder clock(LoopClock value) {
            clock = value;
            return this;
        }

        /**
         * Validates and freezes the settings.
         *
         * @return the immutable settings
         * @throws InvalidSettingException naming the field, the value and what is allowed
         */
        public RunnerSettings build() {
            return new RunnerSettings(this);
        }
    }
}
