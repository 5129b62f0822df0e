package org.loopwright.pid.monitor;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;

/**
 * The idle index on square waves, where its value follows from the definition alone (Hägglund 1999,
 * from memory, as in {@link LoopMonitor}'s javadoc): Ii = (tpos − tneg)/(tpos + tneg), tpos the time
 * the increments of measurement and output have the same sign (reverse action), tneg the time they have
 * opposite signs, a zero increment counting in neither; the figure is the plain mean of the episodes
 * while there are at most four. After a step the low-pass filtered signals approach their new level
 * from one side, so every increment of an excursion has the sign of its step and each episode is
 * exactly +1 or −1.
 */
class IdleIndexTest {

    /** Samples per half period: 1 s at h = 2⁻⁶, against a filter time of 0.05·T = 0.1 s. */
    private static final int HALF = 64;

    private static LoopMonitor monitor(Action action) {
        return new LoopMonitor(MonitorSettings.builder().samplePeriodSeconds(1.0 / HALF).timeScaleSeconds(2.0)
                .acceptableAmplitude(0.1).outputRange(0.0, 100.0).action(action).build());
    }

    /**
     * Feeds a square wave of the measurement around r = 1 (e = −1, +1, −1, ...: every half period a step of
     * 2 across the setpoint), with the output held at {@code outputs[i]} during half period i.
     */
    private static MonitorSummary feed(LoopMonitor monitor, double... outputs) {
        for (int i = 0; i < outputs.length; i++) {
            double y = i % 2 == 0 ? 2.0 : 0.0;
            for (int k = 0; k < HALF; k++) {
                monitor.sample(1.0, y, outputs[i], true);
            }
        }
        return monitor.readSummary(new MonitorSummary());
    }

    @Test
    void anOutputThatDoesNotMoveGivesNoIdleEvaluation() {
        // the output never moves: every increment product is zero, so tpos = tneg = 0 and no episode is
        // evaluated, while the same excursions do count as load disturbances (amplitude 1, period 2 s)
        MonitorSummary s = feed(monitor(Action.REVERSE), 50.0, 50.0, 50.0, 50.0, 50.0);
        assertThat(s.oscillationAmplitude()).isEqualTo(1.0);
        assertThat(s.oscillationPeriodSeconds()).isCloseTo(2.0, within(1e-12));
        assertThat(s.idleEpisodes()).isZero();
        assertThat(s.idleIndex()).isNaN();
    }

    @Test
    void anExcursionClosedByTheNextCrossingEndsItsEpisodeThere() {
        // |e| = 1 throughout, never under a tenth of its peak: each episode ends at the crossing that closes
        // its excursion. Steps of the measurement: −2, +2, −2, +2; of the output: −10, +10, +10 (same, same,
        // opposite sign): episodes +1, +1, −1, whose mean is 1/3
        MonitorSummary s = feed(monitor(Action.REVERSE), 50.0, 40.0, 50.0, 60.0, 60.0);
        assertThat(s.idleEpisodes()).isEqualTo(3);
        assertThat(s.idleIndex()).isCloseTo(1.0 / 3.0, within(1e-15));
    }

    @Test
    void directActionCountsOppositeIncrementsAsTheSlowRecovery() {
        // the same signals under direct action: the recovery sign flips, so do the episodes (−1, −1, +1)
        MonitorSummary s = feed(monitor(Action.DIRECT), 50.0, 40.0, 50.0, 60.0, 60.0);
        assertThat(s.idleEpisodes()).isEqualTo(3);
        assertThat(s.idleIndex()).isCloseTo(-1.0 / 3.0, within(1e-15));
    }
}
