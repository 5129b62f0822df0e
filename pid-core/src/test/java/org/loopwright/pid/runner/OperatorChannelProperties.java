package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.lifecycle.AfterContainer;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.StateCapture;
import org.loopwright.pid.form.ParallelGains;

/**
 * Commands sent from several threads while the loop sits between two ticks (held there by a
 * {@link GatedClock}) land at exactly the next tick, in the order the channel took them, each once:
 * the applied count moves from the previous total to the new one in that tick and not before; the
 * setpoint and the manual output are the last ones sent; every capture saw the manual output of
 * the last command before it in the order and was written once.
 */
class OperatorChannelProperties {

    private static final int THREADS = 4;
    private static final ExecutorService SENDERS = Executors.newFixedThreadPool(THREADS, r -> {
        Thread t = new Thread(r, "operator-sender");
        t.setDaemon(true);
        return t;
    });

    enum Kind { SETPOINT, MANUAL_OUTPUT, CAPTURE }

    record Command(Kind kind, double value) { }

    /** What a sender did: the command's number, the command, and the capture holder if any. */
    record Sent(long number, Command command, StateCapture capture) { }

    @AfterContainer
    static void stopSenders() {
        SENDERS.shutdownNow();
    }

    @Provide
    Arbitrary<List<List<List<Command>>>> rounds() {
        Arbitrary<Command> command = Combinators.combine(Arbitraries.of(Kind.class),
                Arbitraries.doubles().between(-1000.0, 1000.0)).as(Command::new);
        Arbitrary<List<Command>> perThread = command.list().ofMaxSize(8);
        return perThread.list().ofMinSize(1).ofMaxSize(THREADS).list().ofMinSize(1).ofMaxSize(6);
    }

    @Property
    void commandsLandAtTheNextTickInOrderOnce(@ForAll("rounds") List<List<List<Command>>> rounds)
            throws InterruptedException, ExecutionException {
        GatedClock clock = new GatedClock();
        PidController controller = new PidController(ControllerSettings.builder()
                .gains(new ParallelGains(1.0, 0.0, 0.0)).outputRange(-1e6, 1e6).samplePeriodSeconds(0.001).build());
        LoopRunner runner = new LoopRunner(RunnerSettings.builder().clock(clock).waitStrategy(WaitStrategy.PARK)
                .daemon(true).build(), controller, 0.0, () -> 0.0, u -> { }, TimingListener.NONE);
        OperatorChannel operator = runner.operator();
        runner.start();
        LoopStatus status = new LoopStatus();
        try {
            clock.awaitParked(); // tick 0 has run
            long sentSoFar = operator.requestMode(Mode.MANUAL);
            double setpoint = 0.0;
            double manual = runner.readStatus(status).output();
            for (List<List<Command>> round : rounds) {
                List<Sent> sent = sendFromSeveralThreads(operator, round);
                runner.readStatus(status);
                assertThat(status.appliedCommandCount()).as("nothing applied between ticks").isEqualTo(
                        sentSoFar - (status.tickCount() == 1 ? 1 : 0));
                long ticksBefore = status.tickCount();

                clock.nextTick();
                clock.awaitParked();
                runner.readStatus(status);

                sentSoFar += sent.size();
                assertThat(status.tickCount()).isEqualTo(ticksBefore + 1);
                assertThat(status.appliedCommandCount()).as("all applied at the next tick").isEqualTo(sentSoFar);
                sent.sort(Comparator.comparingLong(Sent::number));
                for (Sent s : sent) {
                    switch (s.command().kind()) {
                        case SETPOINT -> setpoint = s.command().value();
                        case MANUAL_OUTPUT -> manual = s.command().value();
                        case CAPTURE -> {
                            assertThat(s.capture().captureCount()).as("captured once").isEqualTo(1);
                            assertThat(StateText.value(s.capture().toSnapshot(), "manual-value"))
                                    .as("capture in order").isEqualTo(manual);
                        }
                    }
                }
                assertThat(status.setpoint()).isEqualTo(setpoint);
                assertThat(status.output()).isEqualTo(manual);
                assertThat(status.mode()).isEqualTo(Mode.MANUAL);
            }
        } finally {
            clock.open();
            runner.stop();
        }
    }

    private static List<Sent> sendFromSeveralThreads(OperatorChannel operator, List<List<Command>> round)
            throws InterruptedException, ExecutionException {
        ConcurrentLinkedQueue<Sent> sent = new ConcurrentLinkedQueue<>();
        List<Future<?>> senders = new ArrayList<>();
        for (List<Command> commands : round) {
            senders.add(SENDERS.submit(() -> {
                for (Command c : commands) {
                    switch (c.kind()) {
                        case SETPOINT -> sent.add(new Sent(operator.requestSetpoint(c.value()), c, null));
                        case MANUAL_OUTPUT -> sent.add(new Sent(operator.requestManualOutput(c.value()), c, null));
                        case CAPTURE -> {
                            StateCapture holder = new StateCapture();
                            sent.add(new Sent(operator.requestCapture(holder), c, holder));
                        }
                    }
                }
            }));
        }
        for (Future<?> f : senders) {
            f.get();
        }
        return new ArrayList<>(sent);
    }
}
