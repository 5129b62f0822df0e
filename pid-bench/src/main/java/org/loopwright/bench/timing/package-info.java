/**
 * The loop-timing measurement: the {@link org.loopwright.pid.runner.LoopRunner} at a given rate with
 * each wait strategy, and a bare busy-wait loop as the baseline, each tick doing the same work; the
 * period error goes into an HdrHistogram and the loop thread's CPU time is read from the JVM.
 */
package org.loopwright.bench.timing;
