package org.loopwright.pid.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.testing.AllocationWindows;

/**
 * A sample allocates nothing once warm, nor does reading the summary into a recycled holder: the
 * thread's allocated bytes over three windows of 100,000 samples, every path taken (oscillation,
 * idle evaluation, saturation, frozen stretches, bad samples, manual, setpoint steps), judged by
 * {@link AllocationWindows} (one 16-byte object per sample would be 1.6 MB a window).
 */
class LoopMonitorAllocationTest {

    private static final int WINDOW = 100_000;
    private static final int WINDOWS = AllocationWindows.COUNT;

    private static double feed(LoopMonitor monitor, MonitorSummary summary, int from, int count) {
        double sink = 0.0;
        for (int k = from; k < from + count; k++) {
            double r = (k / 5000) % 2 == 0 ? 1.0 : 2.0;
            double e = (k / 20_000) % 2 == 0 ? 0.5 * Math.sin(k * 0.02) : 0.01 * Math.cos(k * 0.7);
            double y = (k % 7000) < 300 ? 1.25 : r - e;
            double u = Math.min(100.0, Math.max(0.0, 50.0 + 150.0 * e + (k % 13)));
            boolean automatic = k % 10_000 > 200;
            if (k % 1009 == 0) {
                y = Double.NaN;
            }
            monitor.sample(r, y, u, automatic);
            if (k % 1000 == 0) {
                sink += monitor.readSummary(summary).oscillationEvents() + monitor.worst().ordinal();
            }
        }
        return sink;
    }

    @Test
    void aSampleAndASummaryReadAllocateNothing() {
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long thread = Thread.currentThread().getId();
        LoopMonitor monitor = new LoopMonitor(MonitorSettings.builder().samplePeriodSeconds(0.01)
                .timeScaleSeconds(2.0).acceptableAmplitude(0.05).outputRange(0.0, 100.0).frozenSamples(100).build());
        MonitorSummary summary = new MonitorSummary();
        double sink = feed(monitor, summary, 0, 200_000);
        long[] allocated = new long[WINDOWS];
        for (int w = 0; w < WINDOWS; w++) {
            long before = threads.getThreadAllocatedBytes(thread);
            sink += feed(monitor, summary, 200_000 + w * WINDOW, WINDOW);
            allocated[w] = threads.getThreadAllocatedBytes(thread) - before;
        }
        assertThat(sink).isFinite();
        MonitorSummary s = monitor.readSummary(summary);
        assertThat(s.idleEpisodes()).as("idle evaluated").isPositive();
        assertThat(s.badSamples()).isPositive();
        AllocationWindows.assertNothingAllocated(allocated, "sample");
    }
}
