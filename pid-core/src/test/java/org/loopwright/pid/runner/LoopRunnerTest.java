package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.util.concurrent.atomic.AtomicReference;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.testing.VirtualClock;
import org.junit.jupiter.api.Test;

/**
 * Timing logic on a {@link VirtualClock} (exact and independent of load: assertions are on counts,
 * order and exact virtual times), stop semantics on the system clock (counts and order only).
 */
class LoopRunnerTest {

    private static final long PERIOD = 1_000_000L; // 1 kHz
    private static final Duration PATIENCE = Duration.ofSeconds(60);

    /**
     * A pure forward-Euler integrator, Ki = 1, fed e = 1: I(k) = I(k−1) + h(k)·e(k−1), so its output
     * at tick k is the sum of the periods it received since tick 0 (Åström &amp; Wittenmark 1997, §8.2,
     * the rectangle rule). That makes the period the runner hands over visible in the output.
     */
    private static PidController periodSummingController(FaultPolicy policy, double safeOutput) {
        return new PidController(ControllerSettings.builder()
                .gains(new ParallelGains(0.0, 1.0, 0.0))
                .integralMethod(IntegralMethod.FORWARD_EULER)
                .windupProtection(WindupProtection.NONE)
                .faultPolicy(policy, safeOutput)
                .samplePeriodSeconds(PERIOD * 1e-9)
                .build());
    }

    /** Parking on a virtual clock lands exactly on the deadline; spinning needs a read cost to progress. */
    private static RunnerSettings.Builder virtual(VirtualClock clock) {
        return RunnerSettings.builder().clock(clock).waitStrategy(WaitStrategy.PARK).daemon(true);
    }

    private static void runToEnd(LoopRunner runner) throws InterruptedException {
        runner.start();
        assertThat(runner.awaitStop(PATIENCE)).as("runner stopped").isTrue();
    }

    @Test
    void ticksFallOnAbsoluteDeadlinesWhateverTheWorkTakes() throws InterruptedException {
        VirtualClock clock = new VirtualClock(3);
        TickRecorder ticks = new TickRecorder(1000);
        int[] reads = {0};
        // work varies from 0.1 to 0.9 of the period: a relative schedule would drift by all of it
        MeasurementSource busySensor = () -> {
            clock.advance(100_000L + 800_000L * (reads[0]++ % 7) / 6);
            return 1.0;
        };
        LoopRunner runner = new LoopRunner(virtual(clock).waitStrategy(WaitStrategy.PARK).build(),
                periodSummingController(FaultPolicy.HOLD, 0.0), () -> 2.0, busySensor, u -> { }, ticks);
        ticks.runner = runner;
        runToEnd(runner);

        for (int k = 0; k < 1000; k++) {
            assertThat(ticks.scheduled[k]).isEqualTo(ticks.scheduled[0] + k * PERIOD);
            assertThat(ticks.start[k] - ticks.scheduled[k]).isBetween(0L, 10L);
            assertThat(ticks.overrun[k]).isFalse();
        }
        assertThat(runner.tickCount()).isEqualTo(1000);
        assertThat(runner.overrunCount()).isZero();
        assertThat(runner.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(runner.state()).isEqualTo(RunnerState.STOPPED);
    }

    @Test
    void eachWaitStrategyReachesTheDeadlineExactlyOnAVirtualClock() throws InterruptedException {
        for (WaitStrategy strategy : WaitStrategy.values()) {
            VirtualClock clock = new VirtualClock(1);
            TickRecorder ticks = new TickRecorder(50);
            LoopRunner runner = new LoopRunner(virtual(clock).waitStrategy(strategy).spinMarginNanos(20_000).build(),
                    periodSummingController(FaultPolicy.HOLD, 0.0), () -> 2.0, () -> 1.0, u -> { }, ticks);
            ticks.runner = runner;
            runToEnd(runner);
            for (int k = 0; k < 50; k++) {
                assertThat(ticks.scheduled[k]).as(strategy + " tick " + k).isEqualTo(ticks.scheduled[0] + k * PERIOD);
                // a spin advances one read (1 ns) at a time, so every strategy starts within 3 reads
                assertThat(ticks.start[k] - ticks.scheduled[k]).as(strategy + " tick " + k).isBetween(0L, 3L);
            }
        }
    }

    /** Tick 3 takes 2.5 periods: deadlines 4 and 5 have passed when it ends. */
    private static MeasurementSource stallOnFourthRead(VirtualClock clock) {
        int[] reads = {0};
        return () -> {
            if (reads[0]++ == 3) {
                clock.advance(5 * PERIOD / 2);
            }
            return 1.0;
        };
    }

    @Test
    void skipMissedDropsPassedDeadlinesAndMeasuredPeriodCoversThem() throws InterruptedException {
        VirtualClock clock = new VirtualClock(0);
        TickRecorder ticks = new TickRecorder(10);
        double[] outputs = new double[10];
        int[] writes = {0};
        LoopRunner runner = new LoopRunner(
                virtual(clock).overrunPolicy(OverrunPolicy.SKIP_MISSED).periodMode(PeriodMode.MEASURED).build(),
                periodSummingController(FaultPolicy.HOLD, 0.0), () -> 2.0, stallOnFourthRead(clock),
                u -> outputs[writes[0]++] = u, ticks);
        ticks.runner = runner;
        runToEnd(runner);

        long origin = ticks.scheduled[0];
        long[] expectedTickNumbers = {0, 1, 2, 3, 6, 7, 8, 9, 10, 11};
        for (int i = 0; i < 10; i++) {
            assertThat(ticks.scheduled[i] - origin).isEqualTo(expectedTickNumbers[i] * PERIOD);
            assertThat(ticks.overrun[i]).isEqualTo(i == 3);
            // the integrator's output is the sum of measured periods: the elapsed time since tick 0
            assertThat(outputs[i]).isCloseTo((ticks.start[i] - ticks.start[0]) * 1e-9, within(1e-12));
        }
        assertThat(outputs[4] - outputs[3]).isCloseTo(3 * PERIOD * 1e-9, within(1e-12));
        assertThat(runner.overrunCount()).isEqualTo(1);
        assertThat(runner.skippedTickCount()).isEqualTo(2);
        assertThat(runner.tickCount()).isEqualTo(10);
    }

    @Test
    void runLateRunsEveryMissedTickBackToBackThenReturnsToTheGrid() throws InterruptedException {
        VirtualClock clock = new VirtualClock(0);
        TickRecorder ticks = new TickRecorder(10);
        double[] outputs = new double[10];
        int[] writes = {0};
        LoopRunner runner = new LoopRunner(
                virtual(clock).overrunPolicy(OverrunPolicy.RUN_LATE).periodMode(PeriodMode.FIXED).build(),
                periodSummingController(FaultPolicy.HOLD, 0.0), () -> 2.0, stallOnFourthRead(clock),
                u -> outputs[writes[0]++] = u, ticks);
        ticks.runner = runner;
        runToEnd(runner);

        long origin = ticks.scheduled[0];
        for (int k = 0; k < 10; k++) {
            assertThat(ticks.scheduled[k] - origin).isEqualTo(k * PERIOD);
            // fixed-period mode: the controller counts k·h whatever the timing
            assertThat(outputs[k]).isCloseTo(k * PERIOD * 1e-9, within(1e-12));
        }
        long stallEnd = origin + 3 * PERIOD + 5 * PERIOD / 2;
        assertThat(ticks.start[4]).isEqualTo(stallEnd);
        assertThat(ticks.start[5]).isEqualTo(stallEnd);
        assertThat(ticks.start[6]).isEqualTo(origin + 6 * PERIOD);
        // tick 3 ended after deadline 4, tick 4 (run late) after deadline 5; tick 5 is in time for 6
        assertThat(ticks.overrun).containsExactly(false, false, false, true, true, false, false, false, false, false);
        assertThat(runner.overrunCount()).isEqualTo(2);
        assertThat(runner.skippedTickCount()).isZero();
    }

    @Test
    void failedReadsGoToTheControllersFaultPolicyAndAreCounted() throws InterruptedException {
        VirtualClock clock = new VirtualClock(0);
        TickRecorder ticks = new TickRecorder(8);
        double[] outputs = new double[8];
        int[] writes = {0};
        int[] reads = {0};
        IllegalStateException probeFault = new IllegalStateException("probe disconnected");
        MeasurementSource flakyProbe = () -> {
            int k = reads[0]++;
            if (k == 2) {
                throw probeFault;
            }
            return k == 3 ? Double.NaN : 1.0;
        };
        PidController controller = periodSummingController(FaultPolicy.SAFE_OUTPUT, -5.0);
        LoopRunner runner = new LoopRunner(virtual(clock).maxConsecutiveFailures(3).build(), controller, () -> 2.0,
                flakyProbe, u -> outputs[writes[0]++] = u, ticks);
        ticks.runner = runner;
        runToEnd(runner);

        assertThat(outputs[2]).isEqualTo(-5.0);
        assertThat(outputs[3]).isEqualTo(-5.0);
        assertThat(controller.faultCount()).isEqualTo(2);
        assertThat(runner.failedTickCount()).isEqualTo(2);
        assertThat(runner.consecutiveFailures()).isZero();
        assertThat(runner.lastFailedCallback()).isEqualTo(LoopCallback.MEASUREMENT);
        assertThat(runner.lastFailureCause()).isNull(); // the last failure was the NaN, not the exception
        assertThat(runner.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(runner.tickCount()).isEqualTo(8);
    }

    @Test
    void stopsAfterTheConfiguredNumberOfFailedTicksInARow() throws InterruptedException {
        VirtualClock clock = new VirtualClock(0);
        int[] reads = {0};
        // good, bad, bad, good, then bad for ever: only the last run of 4 reaches the limit
        MeasurementSource dyingProbe = () -> {
            int k = reads[0]++;
            return k == 0 || k == 3 ? 20.0 : Double.NaN;
        };
        TickRecorder ticks = new TickRecorder(100);
        PidController controller = periodSummingController(FaultPolicy.HOLD, 0.0);
        LoopRunner runner = new LoopRunner(virtual(clock).maxConsecutiveFailures(4).build(), controller,
                () -> 20.0, dyingProbe, u -> { }, ticks);
        ticks.runner = runner;
        runToEnd(runner);

        assertThat(runner.stopReason()).isEqualTo(StopReason.CONSECUTIVE_FAILURES);
        assertThat(runner.tickCount()).isEqualTo(8);
        assertThat(ticks.ticks).isEqualTo(8);
        assertThat(runner.failedTickCount()).isEqualTo(6);
        assertThat(runner.consecutiveFailures()).isEqualTo(4);
        assertThat(runner.lastFailedCallback()).isEqualTo(LoopCallback.MEASUREMENT);
        assertThat(controller.faultCount()).isEqualTo(6);
        assertThat(runner.state()).isEqualTo(RunnerState.STOPPED);
        assertThat(runner.stop()).isEqualTo(StopReason.CONSECUTIVE_FAILURES);
    }

    @Test
    void aFailedWriteAppliesTheFaultPolicyAndRetriesWithItsOutput() throws InterruptedException {
        VirtualClock clock = new VirtualClock(0);
        TickRecorder ticks = new TickRecorder(6);
        double[] written = new double[10];
        int[] attempts = {0};
        int[] writes = {0};
        UnsupportedOperationException busFault = new UnsupportedOperationException("heater relay bus timeout");
        OutputSink flakyHeater = u -> {
            if (attempts[0]++ == 3) {
                throw busFault;
            }
            written[writes[0]++] = u;
        };
        PidController controller = periodSummingController(FaultPolicy.SAFE_OUTPUT, -1.0);
        LoopRunner runner = new LoopRunner(virtual(clock).build(), controller, () -> 2.0, () -> 1.0, flakyHeater, ticks);
        ticks.runner = runner;
        runToEnd(runner);

        assertThat(writes[0]).isEqualTo(6);
        assertThat(written[3]).isEqualTo(-1.0);
        assertThat(runner.failedTickCount()).isEqualTo(1);
        assertThat(runner.lastFailedCallback()).isEqualTo(LoopCallback.OUTPUT);
        assertThat(runner.lastFailureCause()).isSameAs(busFault);
        assertThat(controller.faultCount()).isEqualTo(1);
    }

    @Test
    void aNonFiniteSetpointIsAFailedTick() throws InterruptedException {
        VirtualClock clock = new VirtualClock(0);
        TickRecorder ticks = new TickRecorder(5);
        PidController controller = periodSummingController(FaultPolicy.HOLD, 0.0);
        LoopRunner runner = new LoopRunner(virtual(clock).build(), controller, () -> Double.POSITIVE_INFINITY,
                () -> 1.0, u -> { }, ticks);
        ticks.runner = runner;
        runToEnd(runner);
        assertThat(runner.failedTickCount()).isEqualTo(5);
        assertThat(runner.lastFailedCallback()).isEqualTo(LoopCallback.SETPOINT);
        assertThat(controller.faultCount()).isEqualTo(5);
    }

    @Test
    void aThrowingListenerStopsTheLoopAsAnUnexpectedError() throws InterruptedException {
        IllegalArgumentException broken = new IllegalArgumentException("histogram full");
        LoopRunner runner = new LoopRunner(virtual(new VirtualClock(0)).build(),
                periodSummingController(FaultPolicy.HOLD, 0.0), () -> 2.0, () -> 1.0, u -> { },
                (scheduled, start, end, overrun) -> {
                    throw broken;
                });
        runToEnd(runner);
        assertThat(runner.stopReason()).isEqualTo(StopReason.UNEXPECTED_ERROR);
        assertThat(runner.lastFailureCause()).isSameAs(broken);
        assertThat(runner.tickCount()).isEqualTo(1);
    }

    @Test
    void stopReturnsAfterTheLastTickHasCompleted() throws InterruptedException {
        AtomicReference<Thread> loopThread = new AtomicReference<>();
        long[] listened = {0};
        long[] written = {0};
        RunnerSettings settings = RunnerSettings.builder().waitStrategy(WaitStrategy.PARK)
                .threadName("water-bath-loop").daemon(true).build();
        LoopRunner runner = new LoopRunner(settings, periodSummingController(FaultPolicy.HOLD, 0.0), () -> 60.0,
                () -> {
                    loopThread.compareAndSet(null, Thread.currentThread());
                    return 59.0;
                },
                u -> written[0]++, (scheduled, start, end, overrun) -> listened[0]++);
        assertThat(runner.state()).isEqualTo(RunnerState.NEW);
        runner.start();
        assertThat(runner.state()).isEqualTo(RunnerState.RUNNING);
        assertThatThrownBy(runner::start).isInstanceOf(IllegalStateException.class)
                .hasMessage("the runner is running already; stop() it before starting it again");
        long deadline = System.nanoTime() + PATIENCE.toNanos();
        while (runner.tickCount() < 20 && System.nanoTime() < deadline) {
            Thread.sleep(5);
        }
        assertThat(runner.stop()).isEqualTo(StopReason.STOP_REQUESTED);

        // the join gives happens-before: every tick begun has written and been listened to
        assertThat(runner.tickCount()).isGreaterThanOrEqualTo(20);
        assertThat(written[0]).isEqualTo(runner.tickCount());
        assertThat(listened[0]).isEqualTo(runner.tickCount());
        assertThat(loopThread.get().isAlive()).isFalse();
        assertThat(loopThread.get().getName()).isEqualTo("water-bath-loop");
        assertThat(loopThread.get().isDaemon()).isTrue();
        assertThat(runner.state()).isEqualTo(RunnerState.STOPPED);
        assertThat(runner.stop()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(written[0]).isEqualTo(runner.tickCount());
    }

    @Test
    void stopWakesALoopParkedForALongPeriod() throws InterruptedException {
        RunnerSettings settings = RunnerSettings.builder()
                .waitStrategy(WaitStrategy.PARK).daemon(true).build();
        PidController controller = new PidController(ControllerSettings.builder()
                .gains(new ParallelGains(1.0, 0.0, 0.0)).samplePeriodSeconds(60.0).build());
        LoopRunner runner = new LoopRunner(settings, controller, () -> 1.0, () -> 0.0, u -> { }, TimingListener.NONE);
        runner.start();
        long deadline = System.nanoTime() + PATIENCE.toNanos();
        while (runner.tickCount() < 1 && System.nanoTime() < deadline) {
            Thread.sleep(5);
        }
        long before = System.nanoTime();
        runner.stop();
        // generous bound: without the unpark, stop would wait for the 60 s deadline
        assertThat(System.nanoTime() - before).isLessThan(30_000_000_000L);
        assertThat(runner.tickCount()).isEqualTo(1);
    }

    @Test
    void aRunnerStoppedBeforeStartingCanStillStart() throws InterruptedException {
        TickRecorder ticks = new TickRecorder(5);
        LoopRunner runner = new LoopRunner(virtual(new VirtualClock(0)).build(),
                periodSummingController(FaultPolicy.HOLD, 0.0), () -> 2.0, () -> 1.0, u -> { }, ticks);
        ticks.runner = runner;
        assertThat(runner.stop()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(runner.state()).isEqualTo(RunnerState.STOPPED);
        runToEnd(runner);
        assertThat(runner.tickCount()).isEqualTo(5);
    }

    @Test
    void theRunnerTicksAtTheControllersSamplePeriod() {
        PidController tenMillis = new PidController(ControllerSettings.builder()
                .gains(new ParallelGains(1.0, 0.0, 0.0)).samplePeriodSeconds(0.01).build());
        LoopRunner runner = new LoopRunner(RunnerSettings.builder().build(), tenMillis, () -> 2.0, () -> 1.0,
                u -> { }, TimingListener.NONE);
        assertThat(runner.periodNanos()).isEqualTo(10_000_000L);
    }

    @Test
    void aPeriodShorterThanOneNanosecondIsRefused() {
        PidController tooFast = new PidController(ControllerSettings.builder()
                .gains(new ParallelGains(1.0, 0.0, 0.0)).samplePeriodSeconds(1e-10).build());
        assertThatThrownBy(() -> new LoopRunner(RunnerSettings.builder().build(), tooFast, () -> 2.0, () -> 1.0,
                u -> { }, TimingListener.NONE))
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage("samplePeriodSeconds must be at least 1e-9 (one nanosecond) for the loop runner:"
                        + " samplePeriodSeconds=1.0E-10");
    }
}
