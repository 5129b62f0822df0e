package org.loopwright.bench.suite;

import org.loopwright.sim.timing.TimingResult;

/**
 * A loop's timing beside the busy-wait baseline at the same rate.
 *
 * @param result      what the loop measured
 * @param p50Ratio    its median period error ÷ the baseline's
 * @param p99Ratio    its 99th percentile ÷ the baseline's
 * @param p999Ratio   its 99.9th percentile ÷ the baseline's
 * @param maxRatio    its largest error ÷ the baseline's
 * @param cpuRatio    its CPU fraction ÷ the baseline's
 */
public record TimingComparison(TimingResult result, double p50Ratio, double p99Ratio, double p999Ratio,
        double maxRatio, double cpuRatio) {
}
