package org.loopwright.pid.monitor;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;

/** Each condition on signals whose answer is known in closed form (sources beside each check). */
class LoopMonitorTest {

    private static final double H = 0.01;

    private static MonitorSettings.Builder settings(double timeScale, double amplitude) {
        return MonitorSettings.builder().samplePeriodSeconds(H).timeScaleSeconds(timeScale)
                .acceptableAmplitude(amplitude).outputRange(0.0, 100.0);
    }

    /** Feeds e(t) = A·sin(2πt/P) around r = 1 for the given seconds, in automatic, output mid-range. */
    private static MonitorSummary feedSine(LoopMonitor monitor, double amplitude, double period, double seconds) {
        for (int k = 0; k < Math.round(seconds / H); k++) {
            double e = amplitude * Math.sin(2.0 * Math.PI * k * H / period);
            monitor.sample(1.0, 1.0 - e, 50.0 + 10.0 * e, true);
        }
        return monitor.readSummary(new MonitorSummary());
    }

    @Test
    void aSustainedSineIsAnOscillationWithItsOwnAmplitudeAndPeriod() {
        LoopMonitor monitor = new LoopMonitor(settings(2.0, 0.1).build());
        MonitorSummary s = feedSine(monitor, 0.5, 2.0, 60.0);
        assertThat(monitor.status(LoopCondition.OSCILLATION)).isEqualTo(ConditionStatus.ALARM);
        // analytic: zero crossings of a sine are P/2 apart; its peak is A (sampled 100 times a half period)
        assertThat(s.oscillationPeriodSeconds()).isCloseTo(2.0, within(1e-3));
        assertThat(s.oscillationAmplitude()).isCloseTo(0.5, within(1e-3));
        // Hägglund's count with forgetting, x ← γx + 1 each half period: a geometric sum, 59 crossings in 60 s
        double gamma = Math.pow(1.0 - H / 100.0, 100);
        double expected = 0.0;
        for (int i = 0; i < 59; i++) {
            expected = expected * gamma + 1.0;
        }
        assertThat(s.oscillationEvents()).isCloseTo(expected, within(0.3));
    }

    @Test
    void anExcursionCountsOnlyWhenItsIaeExceedsTheLimitTiedToTheTimeScale() {
        // half a sine of amplitude A and period P has IAE A·P/π; the limit is a·T/π: A·P vs a·T decides
        double limitProduct = 0.1 * 2.0;
        LoopMonitor above = new LoopMonitor(settings(2.0, 0.1).build());
        LoopMonitor below = new LoopMonitor(settings(2.0, 0.1).build());
        assertThat(feedSine(above, 1.05 * limitProduct / 2.0, 2.0, 60.0).oscillationEvents()).isGreaterThan(20.0);
        assertThat(feedSine(below, 0.95 * limitProduct / 2.0, 2.0, 60.0).oscillationEvents()).isZero();
        assertThat(below.status(LoopCondition.OSCILLATION)).isEqualTo(ConditionStatus.OK);
    }

    @Test
    void manualModeAndMovingSetpointsCountNothing() {
        LoopMonitor manual = new LoopMonitor(settings(2.0, 0.1).build());
        LoopMonitor ramping = new LoopMonitor(settings(2.0, 0.1).build());
        for (int k = 0; k < 6000; k++) {
            double e = Math.sin(Math.PI * k * H);
            manual.sample(1.0, 1.0 - e, 50.0, false);
            ramping.sample(1.0 + 1e-3 * k, 1.0 + 1e-3 * k - e, 50.0, true);
        }
        assertThat(manual.readSummary(new MonitorSummary()).oscillationEvents()).isZero();
        assertThat(ramping.readSummary(new MonitorSummary()).oscillationEvents()).isZero();
        assertThat(manual.readSummary(new MonitorSummary()).saturationShare()).isNaN();
    }

    @Test
    void aFrozenMeasurementIsFlaggedWithinTheConfiguredSamples() {
        int n = 25;
        LoopMonitor monitor = new LoopMonitor(settings(2.0, 0.1).frozenSamples(n).build());
        double y = 0.0;
        int freezeAt = 500;
        for (int k = 0; k < freezeAt + n; k++) {
            if (k < freezeAt) {
                y = 1.0 + 0.01 * Math.sin(0.3 * k);
            }
            monitor.sample(1.0, y, 40.0 + 0.2 * (k % 100), true);
            int unchanged = k - freezeAt + 1; // common practice: N samples without change while the output moves
            ConditionStatus expected = unchanged >= n ? ConditionStatus.ALARM
                    : unchanged >= (n + 1) / 2 ? ConditionStatus.WARN : ConditionStatus.OK;
            assertThat(monitor.status(LoopCondition.FROZEN_MEASUREMENT)).as("sample %d", k).isEqualTo(expected);
        }
    }

    @Test
    void aStillMeasurementWithAStillOutputIsNotFrozen() {
        LoopMonitor monitor = new LoopMonitor(settings(2.0, 0.1).frozenSamples(10).build());
        for (int k = 0; k < 1000; k++) {
            monitor.sample(1.0, 1.0, 40.0, true);
        }
        assertThat(monitor.status(LoopCondition.FROZEN_MEASUREMENT)).isEqualTo(ConditionStatus.OK);
        assertThat(monitor.readSummary(new MonitorSummary()).unchangedSamples()).isEqualTo(999);
    }

    @Test
    void theSaturationShareIsTheShareOfSamplesAtALimit() {
        LoopMonitor monitor = new LoopMonitor(settings(2.0, 0.1).build());
        for (int k = 0; k < 200_000; k++) {
            double u = k % 10 < 3 ? (k % 20 < 10 ? 100.0 : 0.0) : 50.0; // 3 of every 10 at a limit
            monitor.sample(1.0, 1.0, u, true);
        }
        // counting: 30 % of the samples; the running mean's ripple over a 10-sample pattern is < 1 %
        assertThat(monitor.readSummary(new MonitorSummary()).saturationShare()).isCloseTo(0.3, within(0.01));
        assertThat(monitor.status(LoopCondition.SATURATION)).isEqualTo(ConditionStatus.WARN);
    }

    @Test
    void theNoiseEstimateRecoversTheStandardDeviationOfWhiteGaussianNoise() {
        // E|Δy| = 2σ/√π for white Gaussian noise of standard deviation σ (Δy is N(0, 2σ²))
        for (double sigma : new double[] {0.02, 0.07, 0.15}) {
            LoopMonitor monitor = new LoopMonitor(settings(2.0, 0.1).noiseWindowSeconds(1000.0).build());
            Random random = new Random(42);
            for (int k = 0; k < 400_000; k++) {
                monitor.sample(5.0, 5.0 + sigma * random.nextGaussian(), 50.0, true);
            }
            assertThat(monitor.readSummary(new MonitorSummary()).noiseStdDev()).isCloseTo(sigma, within(0.02 * sigma));
            ConditionStatus expected = sigma > 0.1 ? ConditionStatus.ALARM
                    : sigma > 0.05 ? ConditionStatus.WARN : ConditionStatus.OK;
            assertThat(monitor.status(LoopCondition.NOISE)).as("sigma %s", sigma).isEqualTo(expected);
        }
    }

    /**
     * A load disturbance whose error rises to A at τ and creeps back, e = A·x·e^(1−x), x = t/τ, while
     * the output rises monotonically: the recovery has Δu and Δy of the same sign. Up to the peak
     * (x = 1) the signs differ; the evaluation ends when e is back under A/10 at x₂ (x₂e^(1−x₂) = 0.1),
     * so Ii = ((x₂ − 1) − 1)/x₂, less the low-pass filter's lag (T/20 = 0.1τ here) at the turn.
     */
    @Test
    void theIdleIndexOfACreepingRecoveryIsHighAndItsSignFollowsTheAction() {
        double tau = 5.0;
        double x2 = 4.0;
        for (int i = 0; i < 60; i++) {
            x2 -= (x2 * Math.exp(1.0 - x2) - 0.1) / (Math.exp(1.0 - x2) * (1.0 - x2)); // Newton
        }
        double expected = (x2 - 2.0) / x2;
        for (Action action : Action.values()) {
            LoopMonitor monitor = new LoopMonitor(settings(10.0, 0.01).action(action).build());
            for (int k = 0; k < 100; k++) {
                monitor.sample(1.0, 1.0, 20.0, true);
            }
            for (int k = 0; k < Math.round(8 * tau / H); k++) {
                double x = k * H / tau;
                double e = x * Math.exp(1.0 - x);
                monitor.sample(1.0, 1.0 - e, 20.0 + action.sign() * 10.0 * (1.0 - Math.exp(-x)), true);
            }
            MonitorSummary s = monitor.readSummary(new MonitorSummary());
            assertThat(s.idleEpisodes()).isEqualTo(1);
            assertThat(s.idleIndex()).as(action.name()).isCloseTo(expected, within(0.06));
            assertThat(monitor.status(LoopCondition.SLUGGISH)).isEqualTo(ConditionStatus.ALARM);
        }
    }

    @Test
    void aBadSampleIsSkippedAndChangesNoFigure() {
        LoopMonitor clean = new LoopMonitor(settings(2.0, 0.1).build());
        LoopMonitor dirty = new LoopMonitor(settings(2.0, 0.1).build());
        Random random = new Random(7);
        for (int k = 0; k < 20_000; k++) {
            double e = 0.5 * Math.sin(Math.PI * k * H) + 0.01 * random.nextGaussian();
            double u = Math.min(100.0, Math.max(0.0, 50.0 + 80.0 * e));
            clean.sample(1.0, 1.0 - e, u, true);
            dirty.sample(1.0, 1.0 - e, u, true);
            if (k % 97 == 0) {
                dirty.sample(1.0, Double.NaN, u, true);
                dirty.sample(Double.POSITIVE_INFINITY, 1.0, u, true);
                dirty.sample(1.0, 1.0, Double.NaN, false);
            }
        }
        MonitorSummary a = clean.readSummary(new MonitorSummary());
        MonitorSummary b = dirty.readSummary(new MonitorSummary());
        assertThat(b.badSamples()).isEqualTo(3 * 207);
        assertThat(b).usingRecursiveComparison().ignoringFields("badSamples").isEqualTo(a);
    }
}
