package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import java.time.Duration;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.StateCapture;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.testing.AllocationWindows;
import org.loopwright.pid.testing.VirtualClock;

/**
 * A tick allocates nothing: the listener, which runs on the loop thread, reads that thread's
 * allocated bytes ({@link com.sun.management.ThreadMXBean#getCurrentThreadAllocatedBytes()}) after a
 * warm-up and at the ends of three windows of ticks, judged by the rule of {@link AllocationWindows}.
 * The ticks take every path: park and spin, overruns with skips, measured period, failed reads.
 */
class LoopRunnerAllocationTest {

    private static final long PERIOD = 100_000L; // 10 kHz

    /** Reads the allocation counter after the warm-up and at the end of each window, then stops the runner. */
    private static final class AllocationProbe implements TimingListener {
        private final com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        private final long warmUpTicks;
        private final long windowTicks;
        private final long[] marks = new long[AllocationWindows.COUNT + 1];
        private int marked;
        long ticks;
        LoopRunner runner;

        AllocationProbe(long warmUpTicks, long windowTicks) {
            this.warmUpTicks = warmUpTicks;
            this.windowTicks = windowTicks;
        }

        @Override
        public void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overrun) {
            ticks++;
            if (ticks >= warmUpTicks && (ticks - warmUpTicks) % windowTicks == 0 && marked < marks.length) {
                marks[marked++] = threads.getCurrentThreadAllocatedBytes();
                if (marked == marks.length) {
                    runner.stop();
                }
            }
        }

        long[] bytesPerWindow() {
            long[] bytes = new long[AllocationWindows.COUNT];
            for (int w = 0; w < bytes.length; w++) {
                bytes[w] = marks[w + 1] - marks[w];
            }
            return bytes;
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
        AllocationProbe listener = new AllocationProbe(50_000, 70_000);
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
        AllocationWindows.assertNothingAllocated(listener.bytesPerWindow(), "tick");
    }

    @Test
    void aTickOnTheSystemClockAllocatesNothing() throws InterruptedException {
        // 50 kHz, parking until 10 µs before each deadline: 0.6 s of real time (more when parks overrun)
        long period = 20_000L;
        AllocationProbe listener = new AllocationProbe(10_000, 7_000);
        LoopRunner runner = new LoopRunner(RunnerSettings.builder()
                .waitStrategy(WaitStrategy.PARK_THEN_SPIN).spinMarginNanos(10_000).periodMode(PeriodMode.MEASURED)
                .daemon(true).build(),
                bathHeater(), () -> 60.0, () -> 58.5, u -> { }, listener);
        listener.runner = runner;
        runner.start();
        assertThat(runner.awaitStop(Duration.ofSeconds(240))).isTrue();
        AllocationWindows.assertNothingAllocated(listener.bytesPerWindow(), "tick");
    }

    /** Reads the allocation counter at the ends of three windows after a warm-up, then stops the runner. */
    private static final class WindowProbe implements TimingListener {
        private final com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        private final long warmUpTicks;
        private final long windowTicks;
        final long[] bytes = new long[4];
        long ticks;
        LoopRunner runner;

        WindowProbe(long warmUpTicks, long windowTicks) {
            this.warmUpTicks = warmUpTicks;
            this.windowTicks = windowTicks;
        }

        @Override
        public void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overrun) {
            ticks++;
            long sinceWarm = ticks - warmUpTicks;
            if (sinceWarm >= 0 && sinceWarm % windowTicks == 0) {
                int mark = (int) (sinceWarm / windowTicks);
                bytes[mark] = threads.getCurrentThreadAllocatedBytes();
                if (mark == 3) {
                    runner.stop();
                }
            }
        }

        long[] perWindow() {
            return new long[] {bytes[1] - bytes[0], bytes[2] - bytes[1], bytes[3] - bytes[2]};
        }
    }

    /**
     * Every tick takes one or two operator commands (sent from the loop thread itself, so the sending
     * is measured too): mode switches, manual outputs, setpoints, retunes between two settings, captures
     * and the status read. Judged by {@link AllocationWindows}: a tick that allocated one 16-byte
     * object would charge 800 kB to every window of 50,000 ticks.
     */
    @Test
    void aTickWithCommandsFlowingAllocatesNothing() throws InterruptedException {
        VirtualClock clock = new VirtualClock(500);
        PidController controller = bathHeater();
        ControllerSettings gentle = controller.settings();
        ControllerSettings brisk = gentle.toBuilder().gains(new IdealGains(6.0, 90.0, 10.0)).build();
        StateCapture capture = new StateCapture();
        LoopStatus status = new LoopStatus();
        WindowProbe probe = new WindowProbe(50_000, 50_000);
        long[] reads = {0};
        LoopRunner[] self = new LoopRunner[1];
        MeasurementSource sensorThatSendsCommands = () -> {
            long k = reads[0]++;
            OperatorChannel operator = self[0].operator();
            switch ((int) (k % 8)) {
                case 0 -> operator.requestMode(Mode.MANUAL);
                case 1 -> operator.requestManualOutput(20.0 + k % 13);
                case 2 -> operator.requestMode(Mode.AUTOMATIC);
                case 3 -> operator.requestSetpoint(55.0 + k % 7);
                case 4 -> operator.requestRetune(k % 16 < 8 ? brisk : gentle);
                case 5 -> operator.requestCapture(capture);
                case 6 -> self[0].readStatus(status);
                default -> {
                    operator.requestSetpoint(58.0);
                    operator.requestManualOutput(30.0);
                }
            }
            return 55.0 + 0.01 * (k % 50);
        };
        LoopRunner runner = new LoopRunner(RunnerSettings.builder().clock(clock).waitStrategy(WaitStrategy.PARK)
                .daemon(true).build(), controller, 60.0, sensorThatSendsCommands, u -> { }, probe);
        self[0] = runner;
        probe.runner = runner;
        runner.start();
        assertThat(runner.awaitStop(Duration.ofSeconds(120))).isTrue();

        assertThat(runner.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(runner.status().appliedCommandCount()).isGreaterThanOrEqualTo(200_000);
        long[] perWindow = probe.perWindow();
        AllocationWindows.assertNothingAllocated(perWindow, "tick");
    }
}
