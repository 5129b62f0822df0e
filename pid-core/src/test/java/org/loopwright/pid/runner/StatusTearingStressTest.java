package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReference;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ParallelGains;

/**
 * The published status is never torn: readers on other threads, reading as fast as they can while
 * the loop publishes, only ever see a status that some tick published. Each tick's figures are tied
 * together by construction, so a mix of two ticks breaks an identity: a pure integrator (Ki = 1,
 * forward Euler) fed e = 1 at h = 2⁻¹³ s outputs exactly (n − 1)·h after tick n (sums of a power of
 * two are exact in binary floating point), and the measurement read at tick n is n − 1 (the source
 * counts its reads; the setpoint follows it by 1, so e stays 1). Asserts invariants, not timings.
 */
class StatusTearingStressTest {

    private static final double H = 1.0 / 8192.0;

    @Test
    void readersNeverSeeAMixOfTwoTicks() throws InterruptedException {
        PidController integrator = new PidController(ControllerSettings.builder()
                .gains(new ParallelGains(0.0, 1.0, 0.0)).integralMethod(IntegralMethod.FORWARD_EULER)
                .windupProtection(WindupProtection.NONE).samplePeriodSeconds(H).build());
        long[] reads = {0};
        LoopRunner runner = new LoopRunner(RunnerSettings.builder().waitStrategy(WaitStrategy.PARK).daemon(true)
                .build(), integrator, () -> reads[0] + 1.0, () -> reads[0]++, u -> { }, TimingListener.NONE);
        AtomicReference<String> torn = new AtomicReference<>();
        AtomicLong reads1 = new AtomicLong();
        Thread[] readers = new Thread[2];
        runner.start();
        for (int i = 0; i < readers.length; i++) {
            readers[i] = new Thread(() -> {
                LoopStatus s = new LoopStatus();
                long seen = 0;
                while (runner.state() == RunnerState.RUNNING && torn.get() == null) {
                    runner.readStatus(s);
                    long n = s.tickCount();
                    if (n == 0) {
                        continue;
                    }
                    boolean whole = s.output() == (n - 1) * H && s.measurement() == n - 1
                            && s.setpoint() == n && n >= seen;
                    if (!whole) {
                        torn.compareAndSet(null, s.toString() + ", measurement " + s.measurement()
                                + ", setpoint " + s.setpoint());
                    }
                    seen = n;
                    reads1.incrementAndGet();
                }
            }, "status-reader-" + i);
            readers[i].setDaemon(true);
            readers[i].start();
        }
        long deadline = System.nanoTime() + Duration.ofSeconds(60).toNanos();
        while (runner.tickCount() < 5000 && System.nanoTime() < deadline) {
            Thread.sleep(10);
        }
        runner.stop();
        for (Thread r : readers) {
            r.join();
        }
        assertThat(torn.get()).as("a torn status").isNull();
        assertThat(runner.tickCount()).isGreaterThanOrEqualTo(5000);
        assertThat(reads1.get()).as("the readers did read").isPositive();
    }
}
