package org.loopwright.bench.suite;

/**
 * One JMH result.
 *
 * @param name       short name, "Class.method" plus the parameters, e.g. "FormBenchmark.update[form=IDEAL]"
 * @param nsPerOp    average time per operation in nanoseconds
 * @param errorNs    JMH's 99.9 % confidence half-width (NaN when there are too few iterations)
 * @param bytesPerOp allocation per operation from the GC profiler (NaN when it did not run)
 */
public record JmhFigure(String name, double nsPerOp, double errorNs, double bytesPerOp) {
}
