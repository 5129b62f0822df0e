package org.loopwright.pid.runner;

import org.loopwright.pid.InvalidSettingException;

/**
 * Immutable, validated settings of a {@link LoopRunner}. Example: a 1 kHz loop that parks until
 * 50 µs before each deadline and then spins:
 * <pre>
 *   RunnerSettings.builder().periodNanos(1_000_000).waitStrategy(WaitStrategy.HYBRID)
 *       .spinMarginNanos(50_000).threadName("bath-heater-loop").build();
 * </pre>
 *
 * <p>Thread-safe (immutable).
 */
public final class RunnerSettings {

    /** Default spin margin of the hybrid wait: 100 µs, above typical timer slack on Linux (common practice). */
    public static final long DEFAULT_SPIN_MARGIN_NANOS = 100_000L;
    /** Default number of failed ticks in a row after which the runner stops. */
    public static final int DEFAULT_MAX_CONSECUTIVE_FAILURES = 10;
    /** Default name of the loop thread. */
    public static final String DEFAULT_THREAD_NAME = "loopwright-loop";

    private final long periodNanos;
    private final WaitStrategy waitStrategy;
    private final long spinMarginNanos;
    private final OverrunPolicy overrunPolicy;
    private final PeriodMode periodMode;
    private final int maxConsecutiveFailures;
    private final String threadName;
    private final boolean daemon;
    private final LoopClock clock;

    private RunnerSettings(Builder b) {
        if (b.periodNanos <= 0) {
            throw new InvalidSettingException("periodNanos", b.periodNanos, "must be > 0");
        }
        periodNanos = b.periodNanos;
        waitStrategy = required("waitStrategy", b.waitStrategy);
        long margin = b.spinMarginGiven ? b.spinMarginNanos : Math.min(DEFAULT_SPIN_MARGIN_NANOS, periodNanos);
        if (margin < 0 || margin > periodNanos) {
            throw new InvalidSettingException("spinMarginNanos", margin,
                    "must be between 0 and periodNanos (" + periodNanos + ")");
        }
        spinMarginNanos = margin;
        overrunPolicy = required("overrunPolicy", b.overrunPolicy);
        periodMode = required("periodMode", b.periodMode);
        if (b.maxConsecutiveFailures < 1) {
            throw new InvalidSettingException("maxConsecutiveFailures", b.maxConsecutiveFailures, "must be >= 1");
        }
        maxConsecutiveFailures = b.maxConsecutiveFailures;
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

    /** A builder with the defaults: hybrid wait with a 100 µs margin, skip missed ticks, fixed period,
     * stop after 10 failed ticks in a row, a non-daemon thread named "loopwright-loop", the system clock. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder that starts from these settings. */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.periodNanos = periodNanos;
        b.waitStrategy = waitStrategy;
        b.spinMarginNanos = spinMarginNanos;
        b.spinMarginGiven = true;
        b.overrunPolicy = overrunPolicy;
        b.periodMode = periodMode;
        b.maxConsecutiveFailures = maxConsecutiveFailures;
        b.threadName = threadName;
        b.daemon = daemon;
        b.clock = clock;
        return b;
    }

    /** The period h in nanoseconds: tick k is due at start + k·h. */
    public long periodNanos() {
        return periodNanos;
    }

    /** The period h in seconds. */
    public double periodSeconds() {
        return periodNanos * 1e-9;
    }

    /** How the loop thread waits for a deadline. */
    public WaitStrategy waitStrategy() {
        return waitStrategy;
    }

    /** For {@link WaitStrategy#HYBRID}: how long before the deadline parking ends and spinning begins. */
    public long spinMarginNanos() {
        return spinMarginNanos;
    }

    /** What happens after a tick that ends past the next deadline. */
    public OverrunPolicy overrunPolicy() {
        return overrunPolicy;
    }

    /** Whether the controller gets its fixed period or the measured one. */
    public PeriodMode periodMode() {
        return periodMode;
    }

    /** Failed ticks in a row after which the runner stops with {@link StopReason#CONSECUTIVE_FAILURES}. */
    public int maxConsecutiveFailures() {
        return maxConsecutiveFailures;
    }

    /** The loop thread's name. */
    public String threadName() {
        return threadName;
    }

    /** Whether the loop thread is a daemon (does not keep the JVM alive). */
    public boolean daemon() {
        return daemon;
    }

    /** The clock the runner reads and parks on. */
    public LoopClock clock() {
        return clock;
    }

    /** Mutable builder; {@link #build()} validates every value. Not thread-safe. */
    public static final class Builder {
        private long periodNanos;
        private WaitStrategy waitStrategy = WaitStrategy.HYBRID;
        private long spinMarginNanos;
        private boolean spinMarginGiven;
        private OverrunPolicy overrunPolicy = OverrunPolicy.SKIP_MISSED;
        private PeriodMode periodMode = PeriodMode.FIXED;
        private int maxConsecutiveFailures = DEFAULT_MAX_CONSECUTIVE_FAILURES;
        private String threadName = DEFAULT_THREAD_NAME;
        private boolean daemon;
        private LoopClock clock = LoopClock.SYSTEM;

        private Builder() {
        }

        /** The period in nanoseconds (required, &gt; 0); 1 kHz is 1,000,000. */
        public Builder periodNanos(long value) {
            periodNanos = value;
            return this;
        }

        /** How to wait for each deadline. */
        public Builder waitStrategy(WaitStrategy value) {
            waitStrategy = value;
            return this;
        }

        /** The hybrid wait's spin margin, 0 to periodNanos (default 100 µs, or the period if shorter). */
        public Builder spinMarginNanos(long value) {
            spinMarginNanos = value;
            spinMarginGiven = true;
            return this;
        }

        /** What to do after an overrun. */
        public Builder overrunPolicy(OverrunPolicy value) {
            overrunPolicy = value;
            return this;
        }

        /** Fixed or measured period for the controller. */
        public Builder periodMode(PeriodMode value) {
            periodMode = value;
            return this;
        }

        /** Failed ticks in a row after which the runner stops (&ge; 1). */
        public Builder maxConsecutiveFailures(int value) {
            maxConsecutiveFailures = value;
            return this;
        }

        /** The loop thread's name (not blank). */
        public Builder threadName(String value) {
            threadName = value;
            return this;
        }

        /** Whether the loop thread is a daemon. */
        public Builder daemon(boolean value) {
            daemon = value;
            return this;
        }

        /** The clock (default {@link LoopClock#SYSTEM}). */
        public Builder clock(LoopClock value) {
            clock = value;
            return this;
        }

        /**
         * Validates and freezes the settings.
         *
         * @throws InvalidSettingException naming the field, the value and what is allowed
         */
        public RunnerSettings build() {
            return new RunnerSettings(this);
        }
    }
}
