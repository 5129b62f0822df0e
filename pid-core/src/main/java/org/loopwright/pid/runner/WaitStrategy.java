package org.loopwright.pid.runner;

import java.util.Locale;

/** How the loop thread waits for the next deadline. */
public enum WaitStrategy {
    /** Parks the thread until the deadline: least CPU, lateness set by the OS timer (tens of µs typically). */
    PARK,
    /** Spins on the clock with {@link Thread#onSpinWait()}: smallest lateness, one core fully busy. */
    SPIN,
    /**
     * Parks until {@link RunnerSettings#spinMarginNanos()} before the deadline, then spins: lateness
     * close to spinning at a fraction of its CPU time. Users see it as {@code park-then-spin}.
     */
    PARK_THEN_SPIN;

    /** {@return the word users see and type: {@code park}, {@code spin} or {@code park-then-spin}} */
    public String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /**
     * The strategy a word names.
     *
     * @param word {@code park}, {@code spin} or {@code park-then-spin}
     * @return the strategy
     * @throws IllegalArgumentException naming the word and the allowed ones
     */
    public static WaitStrategy fromWord(String word) {
        for (WaitStrategy w : values()) {
            if (w.word().equals(word)) {
                return w;
            }
        }
        throw new IllegalArgumentException("wait strategy must be park, spin or park-then-spin: wait=" + word);
    }
}
