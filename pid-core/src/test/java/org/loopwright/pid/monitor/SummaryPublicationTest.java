package org.loopwright.pid.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;

import org.junit.jupiter.api.Test;

/**
 * A reader on another thread never sees half a sample. The writer feeds a measurement that never
 * changes while the output moves, so after every whole sample unchangedSamples = samples − 1 and the
 * frozen status follows from the count alone; a torn read would break one of these.
 */
class SummaryPublicationTest {

    @Test
    void aReaderOnAnotherThreadSeesWholeSamplesOnly() throws InterruptedException {
        int n = 50;
        LoopMonitor monitor = new LoopMonitor(MonitorSettings.builder().samplePeriodSeconds(0.001)
                .timeScaleSeconds(1.0).acceptableAmplitude(0.1).outputRange(0.0, 100.0).frozenSamples(n).build());
        AtomicBoolean done = new AtomicBoolean();
        AtomicLong reads = new AtomicLong();
        AtomicLong torn = new AtomicLong();
        Thread reader = new Thread(() -> {
            MonitorSummary s = new MonitorSummary();
            while (!done.get()) {
                monitor.readSummary(s);
                reads.incrementAndGet();
                if (s.samples() > 0 && (s.unchangedSamples() != s.samples() - 1
                        || (s.unchangedSamples() >= n) != (s.status(LoopCondition.FROZEN_MEASUREMENT) == ConditionStatus.ALARM))) {
                    torn.incrementAndGet();
                }
            }
        });
        reader.start();
        for (int k = 0; k < 3_000_000; k++) {
            monitor.sample(1.0, 1.0, 10.0 + (k % 50), true);
        }
        done.set(true);
        reader.join();
        assertThat(reads.get()).isPositive();
        assertThat(torn.get()).isZero();
    }
}
