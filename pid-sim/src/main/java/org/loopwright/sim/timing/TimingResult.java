package org.loopwright.sim.timing;

/**
 * The figures of one timed loop. The period error of tick k is |(start(k) − start(k−1)) − h|, so a
 * skipped deadline shows as an error of a whole period or more.
 *
 * @param loop            which loop: {@code runner, <wait>} or {@link LoopTiming#BASELINE}
 * @param periodNanos     the nominal period h
 * @param spinMarginNanos the park-then-spin margin (0 for the other loops)
 * @param ticks           ticks run
 * @param overruns        ticks that ended after the next deadline
 * @param skipped         deadlines dropped after overruns
 * @param p50Nanos        median period error
 * @param p99Nanos        99th percentile of the period error
 * @param p999Nanos       99.9th percentile of the period error
 * @param maxNanos        largest period error
 * @param cpuFraction     the loop thread's CPU time over the wall time (1.0 is one core fully busy)
 * @param wallSeconds     the measured wall time
 * @param updateNanos     mean time from the measurement read to the output write: the update's own cost
 */
public record TimingResult(String loop, long periodNanos, long spinMarginNanos, long ticks, long overruns,
        long skipped, long p50Nanos, long p99Nanos, long p999Nanos, long maxNanos, double cpuFraction,
        double wallSeconds, double updateNanos) {
}
