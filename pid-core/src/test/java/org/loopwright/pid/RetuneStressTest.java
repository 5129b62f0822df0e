package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.loopwright.pid.form.ParallelGains;

/**
 * An update thread against a retune thread that alternates two settings as fast as it can. Every
 * output must be what one of the two would give, never a mix.
 *
 * <p>Designed to be exact: both settings are proportional-only with gains that are powers of two
 * (A: Kp = 2, reverse action; B: Kp = 0.5, direct action), the setpoint is 0 and the measurements
 * are small integers, so every product and sum is exact in binary floating point. Because a retune
 * rebalances the integral (here a bias) so that the output at the last inputs is unchanged, the
 * output after any sample is the last output plus the active setting's own step:
 * u(k) = u(k−1) + 2·Δe (A) or u(k) = u(k−1) − 0.5·Δe (B), with e = r − y and Δe never 0. A mix of
 * the two (A's gain with B's action, or the reverse) would give −2·Δe or +0.5·Δe, which matches
 * neither.
 *
 * <p>Only the invariant is asserted: how often each setting is in play depends on the scheduler,
 * so the test does not ask that both were seen.
 */
class RetuneStressTest {

    private static final long RUN_NANOS = TimeUnit.MILLISECONDS.toNanos(1500);

    @Test
    @Timeout(10)
    void everyOutputBelongsToOneOfTheTwoSettings() throws InterruptedException {
        ControllerSettings a = ControllerSettings.builder().gains(new ParallelGains(2.0, 0.0, 0.0))
                .samplePeriodSeconds(0.001).action(Action.REVERSE).build();
        ControllerSettings b = a.toBuilder().gains(new ParallelGains(0.5, 0.0, 0.0)).action(Action.DIRECT).build();
        PidController c = new PidController(a);
        AtomicBoolean running = new AtomicBoolean(true);
        Thread retuner = new Thread(() -> {
            while (running.get()) {
                c.retune(b);
                c.retune(a);
            }
        }, "retune");

        double previousOutput = c.update(0.0, 0.0);
        double previousError = 0.0;
        long mixed = 0;
        retuner.start();
        long start = System.nanoTime();
        try {
            for (int k = 1; (k & 1023) != 0 || System.nanoTime() - start < RUN_NANOS; k++) {
                double error = (k % 3) - 1.0; // Δe is 1, 1, −2: never 0
                double output = c.update(0.0, -error);
                double step = error - previousError;
                if (output != previousOutput + 2.0 * step && output != previousOutput - 0.5 * step) {
                    mixed++;
                }
                previousOutput = output;
                previousError = error;
            }
        } finally {
            running.set(false);
            retuner.join();
        }
        assertThat(mixed).as("outputs of neither setting").isZero();
        assertThat(c.fault()).isEqualTo(Fault.NONE);
    }
}
