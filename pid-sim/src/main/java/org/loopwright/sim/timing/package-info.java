/**
 * Loop timing on the machine at hand: the {@link org.loopwright.pid.runner.LoopRunner} at a rate
 * and wait strategy, and a bare busy-wait loop at the same rate as the baseline, each tick doing the
 * same work (a controller update against a synthetic first-order plant). The period error goes
 * into an HdrHistogram; the loop thread's CPU time and the update's own cost are measured beside it.
 * Used by the {@code timing} command and by the benchmark suite.
 */
package org.loopwright.sim.timing;
