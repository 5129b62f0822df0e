package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import java.time.Duration;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.form.IdealGains;

/**
 * A tick allocates nothing: the listener, which runs on the loop thread, reads that thread's
 * allocated bytes ({@link com.sun.management.ThreadMXBean#getCurrentThreadAllocatedBytes()}) after a
 * warm-up and again many ticks later. The ticks take every path: park and spin, overruns with skips,
 * measured period, failed reads.
 */
class LoopRunnerAllocationTest {

    private static final long PERIOD = 100_000L; // 10 kHz

    /** Reads the allocation counter at the two marks, then stops the runner. */
    private static final class AllocationProbe implements TimingListener {
        private final com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        private final long warmUpTicks;
        private final long measuredTicks;
        long ticks;
        long bytesAtWarm;
        long bytesAtEnd;
        LoopRunner runner;

        AllocationProbe(long warmUpTicks, long measuredTicks) {
            this.warmUpTicks = warmUpTicks;
            this.measuredTicks = measuredTicks;
        }

        @Override
        public void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overrun) {
            ticks++;
            if (ticks == warmUpTicks) {
                bytesAtWarm = threads.getCurrentThreadAllocatedBytes();
            } else if (ticks == warmUpTicks + measuredTicks) {
                bytesAtEnd = threads.getCurrentThreadAllocatedBytes();
                runner.stop();
            }
        }
    }

    private static PidController bathHeater() {
        return new PidController(ControllerSettings.builder()
                .gains(new IdealGains(4.0, 120.0, 10.0))
                .samplePeriodSeconds(PERIOD * 1e-9)
                .setpointWeights(0.7, 0.0)
                .derivativeMethod(DerivativeMethod.TUSTIN)
                .outputRange(0.0, 100.0)
                .outputSlewPerSecond(500.0)
                .windupProtection(WindupProtection.BACK_CALCULATION)
                .faultPolicy(FaultPolicy.SAFE_OUTPUT, 0.0)
                .build());
    }

    @Test
    void aTickAllocatesNothingOnAnyPath() throws InterruptedException {
        VirtualClock clock = new VirtualClock(500);
        long[] reads = {0};
        double[] heater = {0.0};
        MeasurementSource probe = () -> {
            long k = reads[0]++;
            if (k % 997 == 0) {
                clock.advance(3 * PERIOD); // a stall: overrun and skip
            }
            return k % 101 == 0 ? Double.NaN : 55.0 + 0.01 * (k % 50);
        };
        AllocationProbe listener = new AllocationProbe(50_000, 200_000);
        LoopRunner runner = new LoopRunner(RunnerSettings.builder().clock(clock)
                .waitStrategy(WaitStrategy.PARK_THEN_SPIN).spinMarginNanos(20_000).periodMode(PeriodMode.MEASURED)
                .overrunPolicy(OverrunPolicy.SKIP_MISSED).daemon(true).build(),
                bathHeater(), () -> 60.0, probe, u -> heater[0] = u, listener);
        listener.runner = runner;
        runner.start();
        assertThat(runner.awaitStop(Duration.ofSeconds(120))).isTrue();

        assertThat(runner.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(runner.overrunCount()).isPositive();
        assertThat(runner.skippedTickCount()).isPositive();
        assertThat(runner.failedTickCount()).isPositive();
        assertThat(listener.bytesAtEnd - listener.bytesAtWarm).isZero();
    }

    @Test
    void aTickOnTheSystemClockAllocatesNothing() throws InterruptedException {
        // 50 kHz, parking until 10 µs before each deadline: 0.6 s of real time (more when parks overrun)
        long period = 20_000L;
        AllocationProbe listener = new AllocationProbe(10_000, 20_000);
        LoopRunner runner = new LoopRunner(RunnerSettings.builder()
                .waitStrategy(WaitStrategy.PARK_THEN_SPIN).spinMarginNanos(10_000).periodMode(PeriodMode.MEASURED)
                .daemon(true).build(),
                bathHeater(), () -> 60.0, () -> 58.5, u -> { }, listener);
        listener.runner = runner;
        runner.start();
        assertThat(runner.awaitStop(Duration.ofSeconds(240))).isTrue();
        assertThat(listener.bytesAtEnd - listener.bytesAtWarm).isZero();
    }
}
