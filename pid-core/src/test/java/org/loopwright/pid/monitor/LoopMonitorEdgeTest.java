package org.loopwright.pid.monitor;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * The monitor's edges that a mutation run found unpinned (issue 11): interpolated crossing times,
 * the tolerance at the output limits, the plain mean of the first saturation window, the thresholds
 * (strictly above), the noise estimate's start, and the frozen-measurement bands. Signals are
 * triangle waves or exact binary steps, so each expected value is analytic.
 */
class LoopMonitorEdgeTest {

    private static MonitorSettings.Builder settings(double h) {
        return MonitorSettings.builder().samplePeriodSeconds(h).timeScaleSeconds(2.0).acceptableAmplitude(0.1)
                .outputRange(0.0, 100.0);
    }

    /** e(t) a triangle of amplitude a and period p, zero and rising at t = 0 (analytic: linear between corners). */
    private static double triangle(double t, double a, double p) {
        double phase = t / p - Math.floor(t / p);
        return phase < 0.25 ? 4.0 * a * phase : phase < 0.75 ? 2.0 * a - 4.0 * a * phase : 4.0 * a * phase - 4.0 * a;
    }

    private static MonitorSummary summary(LoopMonitor monitor) {
        return monitor.readSummary(new MonitorSummary());
    }

    @Test
    void zeroCrossingTimesAreInterpolatedBetweenSamples() {
        // a triangle of period P = 2 + 0.37·h: its zero crossings lie on straight lines, at a different
        // place between samples every time; linear interpolation finds them exactly, so the period is
        // P to rounding (taking the sample times instead would be off by up to h/4 over 8 half periods)
        double h = 0.01;
        double period = 2.0 + 0.37 * h;
        LoopMonitor monitor = new LoopMonitor(settings(h).build());
        for (int k = 0; k < 6000; k++) {
            double e = triangle(k * h, 0.5, period);
            monitor.sample(1.0, 1.0 - e, 50.0 + 10.0 * e, true);
        }
        MonitorSummary s = summary(monitor);
        assertThat(s.oscillationPeriodSeconds()).isCloseTo(period, within(1e-9));
        // the sampled peaks miss the corner by at most slope·h/2 = 4·0.5/P·0.005 = 0.005
        assertThat(s.oscillationAmplitude()).isCloseTo(0.5, within(0.005));
    }

    @Test
    void amplitudeAndPeriodNeedTwoDisturbancesAndAverageTheLastEight() {
        // h = 2⁻¹⁰ and periods that are multiples of 4·h: every corner is a sample, so each peak is exact
        double h = 1.0 / 1024.0;
        LoopMonitor monitor = new LoopMonitor(settings(h).build());
        int k = 0;
        // one half cycle of amplitude 1 closed by the next crossing: one disturbance, no figures yet
        for (; k <= 1024; k++) {
            double e = triangle(k * h, 1.0, 2.0);
            monitor.sample(1.0, 1.0 - e, 50.0, true);
        }
        assertThat(summary(monitor).oscillationAmplitude()).isNaN();
        assertThat(summary(monitor).oscillationPeriodSeconds()).isNaN();
        // the next crossing closes a second, and two are enough (e is 0 at k = 2048, positive after it)
        for (; k <= 1024 * 2 + 1; k++) {
            double e = triangle(k * h, 1.0, 2.0);
            monitor.sample(1.0, 1.0 - e, 50.0, true);
        }
        assertThat(summary(monitor).oscillationAmplitude()).isEqualTo(1.0);
        assertThat(summary(monitor).oscillationPeriodSeconds()).isCloseTo(2.0, within(1e-12));
        // nine more half cycles of amplitude 1, then eight of amplitude 0.5 (period 2 s throughout)
        for (; k <= 1024 * 11; k++) {
            double e = triangle(k * h, 1.0, 2.0);
            monitor.sample(1.0, 1.0 - e, 50.0, true);
        }
        assertThat(summary(monitor).oscillationAmplitude()).isEqualTo(1.0);
        for (; k <= 1024 * 19; k++) {
            double e = triangle(k * h, 0.5, 2.0);
            monitor.sample(1.0, 1.0 - e, 50.0, true);
        }
        MonitorSummary s = summary(monitor);
        assertThat(s.oscillationAmplitude()).isEqualTo(0.5);
        assertThat(s.oscillationPeriodSeconds()).isCloseTo(2.0, within(1e-12));
    }

    @Test
    void anOutputWithinAFewPartsInABillionOfALimitIsAtIt() {
        // the tolerance is 1e-9·max(1, |limit|): 1e-7 at 100, 1e-9 at 0 (our choice: the controller's
        // limits are exact, so only rounding in the caller's arithmetic can leave it a hair inside)
        // limits with their tolerance are inclusive: 100 − 1e-9·100 and 0 + 1e-9 themselves are at the limit
        double[][] cases = {{100.0 - 5e-8, 1.0}, {100.0 - 2e-7, 0.0}, {5e-10, 1.0}, {2e-9, 0.0}, {100.0, 1.0},
            {0.0, 1.0}, {50.0, 0.0}, {100.0 - 1e-9 * 100.0, 1.0}, {1e-9, 1.0}};
        for (double[] c : cases) {
            LoopMonitor monitor = new LoopMonitor(settings(0.01).build());
            monitor.sample(1.0, 1.0, c[0], true);
            assertThat(summary(monitor).saturationShare()).as("output %s", c[0]).isEqualTo(c[1]);
        }
    }

    @Test
    void theSaturationShareIsAPlainMeanOverTheFirstWindowAndSkipsManual() {
        // window 1 s at h = 0.01: for the first 100 automatic samples the share is the plain mean
        LoopMonitor monitor = new LoopMonitor(settings(0.01).saturationWindowSeconds(1.0).build());
        monitor.sample(1.0, 1.0, 100.0, true);
        monitor.sample(1.0, 1.0, 50.0, true);
        monitor.sample(1.0, 1.0, 100.0, false);
        monitor.sample(1.0, 1.0, 0.0, true);
        monitor.sample(1.0, 1.0, 50.0, true);
        // 2 of the 4 automatic samples at a limit (the manual one is not counted)
        assertThat(summary(monitor).saturationShare()).isCloseTo(0.5, within(1e-15));
    }

    @Test
    void aStatusChangesOnlyStrictlyAboveItsThreshold() {
        // shares 0.5 (warn) and 1 (alarm): a share of exactly 0.5 is ok, exactly 1 is a warning
        MonitorSettings s = settings(0.01).saturationWindowSeconds(1.0).saturationShares(0.5, 1.0).build();
        LoopMonitor half = new LoopMonitor(s);
        half.sample(1.0, 1.0, 100.0, true);
        half.sample(1.0, 1.0, 50.0, true);
        assertThat(half.status(LoopCondition.SATURATION)).isEqualTo(ConditionStatus.OK);
        LoopMonitor whole = new LoopMonitor(s);
        whole.sample(1.0, 1.0, 100.0, true);
        assertThat(whole.status(LoopCondition.SATURATION)).isEqualTo(ConditionStatus.WARN);
        assertThat(whole.worst()).isEqualTo(ConditionStatus.WARN);
        assertThat(summary(whole).worst()).isEqualTo(ConditionStatus.WARN);
        assertThat(half.worst()).isEqualTo(ConditionStatus.OK);
    }

    @Test
    void theNoiseEstimateStartsAfterTwoHundredDifferencesAndHoldsAConstantSpread() {
        // |Δy| = 0.25 every sample: the median of |Δy| is 0.25 exactly, so σ = 0.25/(0.6745·√2)
        // (white Gaussian noise: Δy is N(0, 2σ²), median |Δy| = 0.67449·√2·σ)
        double sigma = 0.25 / (0.6744897501960817 * Math.sqrt(2.0));
        LoopMonitor monitor = new LoopMonitor(settings(0.01).noiseLevels(0.05, 0.1).build());
        for (int k = 0; k < 200; k++) {
            monitor.sample(1.0, k % 2 == 0 ? 1.0 : 1.25, 50.0, true);
        }
        // 200 samples give 199 differences: not yet trusted
        assertThat(summary(monitor).noiseStdDev()).isNaN();
        assertThat(monitor.status(LoopCondition.NOISE)).isEqualTo(ConditionStatus.OK);
        monitor.sample(1.0, 1.0, 50.0, true);
        assertThat(summary(monitor).noiseStdDev()).isCloseTo(sigma, within(1e-15));
        assertThat(monitor.status(LoopCondition.NOISE)).isEqualTo(ConditionStatus.ALARM);
        for (int k = 0; k < 20_000; k++) {
            monitor.sample(1.0, k % 2 == 0 ? 1.25 : 1.0, 50.0, true);
        }
        assertThat(summary(monitor).noiseStdDev()).isCloseTo(sigma, within(1e-15));
    }

    @Test
    void theNoiseLevelsAreStandardDeviationsNotMedians() {
        // |Δy| = 0.25 every sample: σ = 0.25/(0.6745·√2) = 0.2621 (white Gaussian noise: median |Δy| =
        // 0.67449·√2·σ). The levels are in σ: 0.2621 lies above 0.25 and below 0.27 (a warning), and above
        // 0.25 with the alarm there; compared as medians (0.25 against the level) it would be neither
        assertThat(noiseStatus(0.25, 0.27)).isEqualTo(ConditionStatus.WARN);
        assertThat(noiseStatus(0.2, 0.25)).isEqualTo(ConditionStatus.ALARM);
    }

    private static ConditionStatus noiseStatus(double warn, double alarm) {
        LoopMonitor monitor = new LoopMonitor(settings(0.01).noiseLevels(warn, alarm).build());
        for (int k = 0; k < 300; k++) {
            monitor.sample(1.0, k % 2 == 0 ? 1.0 : 1.25, 50.0, true);
        }
        return monitor.status(LoopCondition.NOISE);
    }

    @Test
    void theNoiseEstimateFollowsAStepInTheSpreadAtTheConfiguredRate() {
        // after a long run at |Δy| = 0.25 the spread becomes 1: the median estimate grows by the factor
        // (1 + h/window) per sample (the Robbins–Monro sign step in log scale), here 1.01 with a 1 s window
        LoopMonitor monitor = new LoopMonitor(settings(0.01).noiseWindowSeconds(1.0).build());
        for (int k = 0; k < 1000; k++) {
            monitor.sample(1.0, k % 2 == 0 ? 1.0 : 1.25, 50.0, true);
        }
        double before = summary(monitor).noiseStdDev();
        for (int k = 0; k < 10; k++) {
            // from the last 1.25: 2.25, 1.25, 2.25, ...: |Δy| = 1 every sample
            monitor.sample(1.0, k % 2 == 0 ? 2.25 : 1.25, 50.0, true);
        }
        assertThat(summary(monitor).noiseStdDev()).isCloseTo(before * Math.pow(1.01, 10), within(1e-12));
    }

    @Test
    void aMeasurementWithinTheQuantisationStepCountsAsUnchanged() {
        // step 0.5: moving by exactly 0.5 from the reference is unchanged, by a hair more is a change
        LoopMonitor still = new LoopMonitor(settings(0.01).quantisationStep(0.5).build());
        LoopMonitor moving = new LoopMonitor(settings(0.01).quantisationStep(0.5).build());
        for (int k = 0; k < 10; k++) {
            still.sample(1.0, k % 2 == 0 ? 1.0 : 1.5, 50.0, true);
            moving.sample(1.0, k % 2 == 0 ? 1.0 : Math.nextUp(1.5), 50.0, true);
        }
        assertThat(summary(still).unchangedSamples()).isEqualTo(9);
        assertThat(summary(moving).unchangedSamples()).isZero();
    }

    @Test
    void conditionsHaveLowerCaseHyphenatedLabels() {
        assertThat(LoopCondition.FROZEN_MEASUREMENT.label()).isEqualTo("frozen-measurement");
        assertThat(LoopCondition.NOISE.label()).isEqualTo("noise");
    }

    @Test
    void aFrozenMeasurementNeedsTheOutputToMoveByMoreThanTheThreshold() {
        // output moving by exactly the threshold (1) is not enough; by 1.5 it is (common practice:
        // a frozen sensor is told from a quiet loop by an output that works while nothing changes)
        LoopMonitor quiet = new LoopMonitor(settings(0.01).frozenSamples(4).frozenOutputMove(1.0).build());
        LoopMonitor working = new LoopMonitor(settings(0.01).frozenSamples(4).frozenOutputMove(1.0).build());
        for (int k = 0; k < 10; k++) {
            quiet.sample(1.0, 1.0, k % 2 == 0 ? 40.0 : 41.0, true);
            working.sample(1.0, 1.0, k % 2 == 0 ? 40.0 : 41.5, true);
        }
        assertThat(quiet.status(LoopCondition.FROZEN_MEASUREMENT)).isEqualTo(ConditionStatus.OK);
        assertThat(working.status(LoopCondition.FROZEN_MEASUREMENT)).isEqualTo(ConditionStatus.ALARM);
    }
}
