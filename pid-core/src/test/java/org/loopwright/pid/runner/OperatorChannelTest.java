package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.util.concurrent.Semaphore;
import java.util.concurrent.atomic.AtomicBoolean;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.StateCapture;
import org.loopwright.pid.StateSnapshot;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.testing.VirtualClock;

/** The operator channel's refusals, what it applies at stop, capture and restore, restart and JMX. */
class OperatorChannelTest {

    private static final Duration PATIENCE = Duration.ofSeconds(60);

    private static ControllerSettings settings() {
        return ControllerSettings.builder().gains(new ParallelGains(2.0, 5.0, 0.0)).outputRange(0.0, 100.0)
                .samplePeriodSeconds(0.001).build();
    }

    private static LoopRunner gated(GatedClock clock, PidController controller, int capacity) {
        return new LoopRunner(RunnerSettings.builder().clock(clock).waitStrategy(WaitStrategy.PARK)
                .commandCapacity(capacity).daemon(true).build(), controller, 20.0, () -> 18.0, u -> { },
                TimingListener.NONE);
    }

    @Test
    void aCommandBeforeStartOrAfterStopIsRefusedNotLost() {
        GatedClock clock = new GatedClock();
        LoopRunner runner = gated(clock, new PidController(settings()), 4);
        assertThatThrownBy(() -> runner.operator().requestMode(Mode.MANUAL))
                .isInstanceOf(CommandRefusedException.class)
                .hasMessage("mode refused: the runner is not running (commands are taken only between start() and"
                        + " stop())")
                .extracting(e -> ((CommandRefusedException) e).reason())
                .isEqualTo(CommandRefusedException.Reason.NOT_RUNNING);
        runner.start();
        clock.awaitParked();
        clock.open();
        runner.stop();
        assertThatThrownBy(() -> runner.operator().requestSetpoint(30.0))
                .isInstanceOf(CommandRefusedException.class)
                .hasMessageStartingWith("setpoint refused: the runner is not running");
    }

    @Test
    void aFullQueueIsRefusedAndTheLoopNeverWaits() {
        GatedClock clock = new GatedClock();
        LoopRunner runner = gated(clock, new PidController(settings()), 3);
        runner.start();
        try {
            clock.awaitParked();
            OperatorChannel operator = runner.operator();
            assertThat(operator.requestManualOutput(1.0)).isEqualTo(1);
            assertThat(operator.requestManualOutput(2.0)).isEqualTo(2);
            assertThat(operator.requestManualOutput(3.0)).isEqualTo(3);
            assertThatThrownBy(() -> operator.requestManualOutput(4.0))
                    .isInstanceOf(CommandRefusedException.class)
                    .hasMessage("manual output refused: 3 commands are already waiting for the next tick")
                    .extracting(e -> ((CommandRefusedException) e).reason())
                    .isEqualTo(CommandRefusedException.Reason.QUEUE_FULL);
            clock.nextTick();
            clock.awaitParked();
            assertThat(operator.appliedCount()).isEqualTo(3);
            assertThat(operator.requestManualOutput(4.0)).as("room again after the tick").isEqualTo(4);
        } finally {
            clock.open();
            runner.stop();
        }
    }

    @Test
    void badValuesAndMisfitCommandsAreRefusedAtOnce() {
        GatedClock clock = new GatedClock();
        PidController controller = new PidController(settings());
        LoopRunner readsItsSetpoint = new LoopRunner(RunnerSettings.builder().clock(clock).daemon(true).build(),
                controller, () -> 20.0, () -> 18.0, u -> { }, TimingListener.NONE);
        OperatorChannel operator = readsItsSetpoint.operator();
        assertThatThrownBy(() -> operator.requestSetpoint(30.0))
                .isInstanceOf(CommandRefusedException.class)
                .hasMessage("setpoint refused: this runner reads its setpoint from its SetpointSource; build the"
                        + " runner with an initial setpoint to set it through the operator channel: setpoint=30.0");
        assertThatThrownBy(() -> operator.requestManualOutput(Double.NaN))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("manualOutput must be finite: manualOutput=NaN");
        assertThatThrownBy(() -> operator.requestRetune(settings().toBuilder().samplePeriodSeconds(0.002).build()))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("retune refused: samplePeriodSeconds must stay 0.001 while the loop runs (stop, retune and"
                        + " start again to change it): samplePeriodSeconds=0.002");
    }

    @Test
    void commandsTakenBeforeStopAreAppliedBeforeTheLoopEnds() {
        GatedClock clock = new GatedClock();
        PidController controller = new PidController(settings());
        LoopRunner runner = gated(clock, controller, 8);
        runner.start();
        clock.awaitParked();
        OperatorChannel operator = runner.operator();
        operator.requestMode(Mode.MANUAL);
        operator.requestManualOutput(42.0);
        StateCapture capture = new StateCapture();
        long last = operator.requestCapture(capture);
        clock.open();
        runner.stop();
        // the join in stop() orders the loop's last writes before these reads
        assertThat(operator.appliedCount()).isEqualTo(last);
        assertThat(controller.mode()).isEqualTo(Mode.MANUAL);
        assertThat(StateText.value(capture.toSnapshot(), "manual-value")).isEqualTo(42.0);
        // whether one more tick ran between open() and stop() is the scheduler's choice, so only what the
        // commands set is compared, never the whole state (an update changes the previous output)
        assertThat(capture.toSnapshot().toString()).contains(" mode=manual ");
        assertThat(runner.status().appliedCommandCount()).isEqualTo(last);
    }

    @Test
    void aCommandCountsAsAppliedOnlyOnceTheStatusShowsIt() throws InterruptedException {
        // the tick after the command is held inside its measurement read, between applying and publishing
        Semaphore heldRead = new Semaphore(0);
        AtomicBoolean holdNextRead = new AtomicBoolean();
        GatedClock clock = new GatedClock();
        LoopRunner runner = new LoopRunner(RunnerSettings.builder().clock(clock).waitStrategy(WaitStrategy.PARK)
                .commandCapacity(4).daemon(true).build(), new PidController(settings()), 20.0, () -> {
                    if (holdNextRead.getAndSet(false)) {
                        heldRead.acquireUninterruptibly();
                    }
                    return 18.0;
                }, u -> { }, TimingListener.NONE);
        runner.start();
        clock.awaitParked();
        OperatorChannel operator = runner.operator();
        long manual = operator.requestMode(Mode.MANUAL);
        holdNextRead.set(true);
        clock.open();

        assertThat(operator.awaitApplied(manual, Duration.ofMillis(200))).isFalse();
        heldRead.release();
        assertThat(operator.awaitApplied(manual, PATIENCE)).isTrue();
        LoopStatus status = runner.status();
        assertThat(status.mode()).isEqualTo(Mode.MANUAL);
        assertThat(status.appliedCommandCount()).isGreaterThanOrEqualTo(manual);
        runner.stop();
    }

    @Test
    void aCaptureTakenThroughTheChannelRestoresThroughTheChannel() throws InterruptedException {
        GatedClock clock = new GatedClock();
        PidController controller = new PidController(settings());
        LoopRunner runner = gated(clock, controller, 8);
        runner.start();
        clock.awaitParked();
        for (int k = 0; k < 5; k++) {
            clock.nextTick();
            clock.awaitParked();
        }
        StateCapture capture = new StateCapture();
        assertThatThrownBy(capture::toSnapshot).isInstanceOf(IllegalStateException.class)
                .hasMessage("nothing captured yet: captureCount=0");
        long n = runner.operator().requestCapture(capture);
        clock.nextTick();
        clock.awaitParked();
        assertThat(runner.operator().awaitApplied(n, PATIENCE)).isTrue();
        StateSnapshot taken = capture.toSnapshot();
        clock.open();
        runner.stop();
        // the capture ran before tick 6's update; the controller has run that update since
        assertThat(StateText.value(taken, "integral")).isNotZero();

        GatedClock again = new GatedClock();
        PidController fresh = new PidController(settings());
        LoopRunner second = gated(again, fresh, 8);
        second.start();
        again.awaitParked();
        long restored = second.operator().requestRestore(taken);
        again.nextTick();
        again.awaitParked();
        assertThat(second.status().appliedCommandCount()).isEqualTo(restored);
        assertThat(second.status().rejectedCommandCount()).isZero();
        again.open();
        second.stop();
        // restored, then one tick on: the integral carried over (a fresh controller would start at 0)
        assertThat(fresh.integralTerm()).isGreaterThan(0.5 * StateText.value(taken, "integral"));
    }

    @Test
    void aRestoreThatDoesNotFitIsCountedAndExplained() {
        StateSnapshot reverse = new PidController(settings()).snapshot();
        GatedClock clock = new GatedClock();
        LoopRunner runner = gated(clock, new PidController(settings().toBuilder().action(Action.DIRECT).build()), 4);
        runner.start();
        clock.awaitParked();
        runner.operator().requestRestore(reverse);
        clock.nextTick();
        clock.awaitParked();
        assertThat(runner.status().rejectedCommandCount()).isEqualTo(1);
        assertThat(runner.lastRejectedCommand()).hasMessageContaining("action=reverse in the snapshot");
        clock.open();
        runner.stop();
    }

    @Test
    void aStoppedRunnerStartsAgainAndKeepsCounting() throws InterruptedException {
        VirtualClock clock = new VirtualClock(0);
        TickRecorder ticks = new TickRecorder(10);
        PidController controller = new PidController(settings());
        LoopRunner runner = new LoopRunner(RunnerSettings.builder().clock(clock).waitStrategy(WaitStrategy.PARK)
                .daemon(true).build(), controller, 20.0, () -> 18.0, u -> { }, ticks);
        ticks.runner = runner;
        runner.start();
        assertThat(runner.awaitStop(PATIENCE)).isTrue();
        assertThat(runner.tickCount()).isEqualTo(10);
        double integralAfterFirstRun = controller.integralTerm();

        ticks.ticks = 0;
        runner.start();
        assertThat(runner.awaitStop(PATIENCE)).isTrue();
        assertThat(runner.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(runner.tickCount()).isEqualTo(20);
        // the controller kept its state: the integral went on growing from where it was
        assertThat(controller.integralTerm()).isGreaterThan(integralAfterFirstRun);
    }

    @Test
    void theStatusCanBeReadOverJmx() throws Exception {
        GatedClock clock = new GatedClock();
        LoopRunner runner = gated(clock, new PidController(settings()), 4);
        runner.start();
        clock.awaitParked();
        try (LoopStatusRegistration jmx = LoopStatusRegistration.register(runner, "bath-heater")) {
            javax.management.MBeanServer server = java.lang.management.ManagementFactory.getPlatformMBeanServer();
            javax.management.ObjectName name = new javax.management.ObjectName(jmx.objectName());
            assertThat(jmx.objectName()).isEqualTo("org.loopwright:name=\"bath-heater\",type=LoopRunner");
            assertThat(server.getAttribute(name, "TickCount")).isEqualTo(1L);
            assertThat(server.getAttribute(name, "Setpoint")).isEqualTo(20.0);
            assertThat(server.getAttribute(name, "Mode")).isEqualTo("automatic");
            assertThat(server.getAttribute(name, "State")).isEqualTo("running");
            assertThat(server.getAttribute(name, "PeriodNanos")).isEqualTo(1_000_000L);
            assertThat(server.getAttribute(name, "Conditions")).as("no monitor, nothing watched").isEqualTo("");
            assertThatThrownBy(() -> LoopStatusRegistration.register(runner, "bath-heater"))
                    .isInstanceOf(IllegalArgumentException.class)
                    .hasMessageStartingWith("cannot register the loop status over JMX: name=bath-heater");
        } finally {
            clock.open();
            runner.stop();
        }
        assertThat(java.lang.management.ManagementFactory.getPlatformMBeanServer().queryNames(
                new javax.management.ObjectName("org.loopwright:*"), null)).isEmpty();
    }
}
