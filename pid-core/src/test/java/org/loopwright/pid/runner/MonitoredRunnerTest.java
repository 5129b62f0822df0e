package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import java.time.Duration;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.monitor.ConditionStatus;
import org.loopwright.pid.monitor.LoopCondition;
import org.loopwright.pid.monitor.LoopMonitor;
import org.loopwright.pid.monitor.MonitorSettings;
import org.loopwright.pid.monitor.MonitorSummary;
import org.loopwright.pid.testing.AllocationWindows;
import org.loopwright.pid.testing.VirtualClock;

/** A runner built with a monitor feeds it once per tick with what the actuator got, allocating nothing. */
class MonitoredRunnerTest {

    private static final long PERIOD = 1_000_000L;

    private static final long WARM_UP = 200_000;
    private static final long WINDOW = 100_000;
    private static final int WINDOWS = AllocationWindows.COUNT;

    /**
     * Reads the loop thread's allocated bytes after the warm-up and at the end of each of three windows,
     * then stops the runner; {@link AllocationWindows} judges them.
     */
    private static final class Probe implements TimingListener {
        private final com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        final long[] marks = new long[WINDOWS + 1];
        long ticks;
        LoopRunner runner;

        @Override
        public void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overrun) {
            ticks++;
            if (ticks >= WARM_UP && (ticks - WARM_UP) % WINDOW == 0) {
                int mark = (int) ((ticks - WARM_UP) / WINDOW);
                marks[mark] = threads.getCurrentThreadAllocatedBytes();
                if (mark == WINDOWS) {
                    runner.stop();
                }
            }
        }

        long[] windows() {
            long[] bytes = new long[WINDOWS];
            for (int w = 0; w < WINDOWS; w++) {
                bytes[w] = marks[w + 1] - marks[w];
            }
            return bytes;
        }
    }

    @Test
    void everyTickFeedsTheMonitorAndAllocatesNothing() throws InterruptedException {
        PidController controller = new PidController(ControllerSettings.builder().gains(IdealGains.pi(2.0, 0.5))
                .samplePeriodSeconds(PERIOD * 1e-9).outputRange(0.0, 100.0).build());
        LoopMonitor monitor = new LoopMonitor(MonitorSettings.builder().samplePeriodSeconds(PERIOD * 1e-9)
                .timeScaleSeconds(0.5).acceptableAmplitude(0.1).outputRange(0.0, 100.0).frozenSamples(100).build());
        Probe probe = new Probe();
        // a probe stuck at 20 while the setpoint is 60: the integral drives the output to its upper limit
        LoopRunner runner = LoopRunner.monitored(RunnerSettings.builder()
                .clock(new VirtualClock(3)).waitStrategy(WaitStrategy.PARK).daemon(true).build(),
                controller, () -> 60.0, () -> 20.0, u -> { }, probe, monitor);
        probe.runner = runner;
        runner.start();
        assertThat(runner.awaitStop(Duration.ofSeconds(120))).isTrue();

        MonitorSummary s = monitor.readSummary(new MonitorSummary());
        assertThat(runner.monitor()).containsSame(monitor);
        assertThat(s.samples()).isEqualTo(runner.tickCount());
        assertThat(monitor.status(LoopCondition.SATURATION)).isEqualTo(ConditionStatus.ALARM);
        assertThat(monitor.status(LoopCondition.FROZEN_MEASUREMENT)).isEqualTo(ConditionStatus.ALARM);
        // the runner's published status carries the monitor's conditions of the last tick
        LoopStatus published = runner.status();
        for (LoopCondition c : LoopCondition.values()) {
            assertThat(published.condition(c)).as(c.label()).isEqualTo(monitor.status(c));
        }
        assertThat(published.worstCondition()).isEqualTo(ConditionStatus.ALARM);
        AllocationWindows.assertNothingAllocated(probe.windows(), "tick");
    }
}
