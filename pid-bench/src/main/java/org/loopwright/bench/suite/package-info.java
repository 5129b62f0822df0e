/**
 * The one-command suite: runs the JMH benchmarks (with the GC profiler) and the loop-timing
 * program, sets every figure beside its baseline as a ratio, checks the performance targets and
 * writes the summary as Markdown and JSON.
 */
package org.loopwright.bench.suite;
