package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.InvalidSettingException;

/**
 * Smith's two-point rule on short, coarsely sampled records, every figure worked by hand from the
 * rule as the class states it: t28 and t63 interpolated linearly between the two samples that
 * bracket 28.3 % and 63.2 % of the change, T = 1.5·(t63 − t28), L = t63 − step time − T (issue 11:
 * the mutation run found the bracketing, the initial level and the smallest record unpinned; a
 * straight ramp cannot tell interpolation from extrapolation, a curved record can).
 */
class SmithTwoPointSamplesTest {

    private static final double[] TIMES = {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11};

    @Test
    void eachCrossingIsInterpolatedBetweenTheTwoSamplesThatBracketIt() {
        double[] outputs = {0, 0, 0.2, 0.5, 0.9, 1, 1, 1, 1, 1, 1, 1};
        FopdtModel model = SmithTwoPoint.estimate(TIMES, outputs, 0.5, 1.0);
        // 28.3 % between (2 s, 0.2) and (3 s, 0.5): 2 + 0.083/0.3; 63.2 % between (3 s, 0.5) and (4 s, 0.9): 3 + 0.132/0.4
        double t28 = 2.0 + 0.083 / 0.3;
        double t63 = 3.33;
        assertThat(model.processGain()).isCloseTo(1.0, within(1e-12));
        assertThat(model.timeConstantSeconds()).isCloseTo(1.5 * (t63 - t28), within(1e-12)); // 1.58
        assertThat(model.deadTimeSeconds()).isCloseTo(t63 - 0.5 - 1.5 * (t63 - t28), within(1e-12)); // 1.25
    }

    @Test
    void aSampleExactlyAtAFractionIsThatCrossing() {
        // 283/1000 and 632/1000 are the fractions themselves: the crossings are the sample times 2 s and 3 s
        double[] outputs = {0, 0, 283, 632, 1000, 1000, 1000, 1000, 1000, 1000, 1000, 1000};
        FopdtModel model = SmithTwoPoint.estimate(TIMES, outputs, 0.5, 1000.0);
        assertThat(model.processGain()).isEqualTo(1.0);
        assertThat(model.timeConstantSeconds()).isCloseTo(1.5, within(1e-12)); // 1.5·(3 − 2)
        assertThat(model.deadTimeSeconds()).isCloseTo(1.0, within(1e-12)); // 3 − 0.5 − 1.5
    }

    @Test
    void theInitialLevelIsTheMeanOfTheSamplesBeforeTheStep() {
        // noise of ±0.05 before the step averages to 0, so the change is exactly 1 (the first sample alone would say 0.95)
        double[] outputs = {0.05, -0.05, 0.05, -0.05, 0.5, 1, 1, 1, 1, 1, 1, 1};
        FopdtModel model = SmithTwoPoint.estimate(TIMES, outputs, 3.5, 2.0);
        assertThat(model.processGain()).isCloseTo(0.5, within(1e-12));
    }

    @Test
    void aSampleTakenAtTheStepTimeBelongsToTheResponse() {
        // the initial level is the mean of the samples *before* the step: the one at 2 s, already 0.1
        // above it (a small direct path), is not part of it, so the change is 1 − 0 and K = 1/Δu
        double[] outputs = {0, 0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1};
        FopdtModel model = SmithTwoPoint.estimate(TIMES, outputs, 2.0, 4.0);
        assertThat(model.processGain()).isCloseTo(0.25, within(1e-12));
        // the line y = (t − 1)/10 crosses 28.3 % at 3.83 s and 63.2 % at 7.32 s
        assertThat(model.timeConstantSeconds()).isCloseTo(1.5 * (7.32 - 3.83), within(1e-9));
    }

    @Test
    void threeSamplesAreEnough() {
        // the smallest record the rule needs: one before the step, two after (the last is the final level);
        // 28.3 % at 0 + 0.283/0.5 = 0.566 s, 63.2 % at 1 + 0.132/0.5 = 1.264 s, L = 1.264 − 0.5 − 1.047 < 0 → 0
        FopdtModel model = SmithTwoPoint.estimate(new double[] {0, 1, 2}, new double[] {0, 0.5, 1}, 0.5, 1.0);
        assertThat(model.timeConstantSeconds()).isCloseTo(1.5 * (1.264 - 0.566), within(1e-12));
        assertThat(model.deadTimeSeconds()).isZero();
    }

    @Test
    void twoSamplesAtTheSameTimeAreRefused() {
        assertThatThrownBy(() -> SmithTwoPoint.estimate(new double[] {0, 1, 1, 2}, new double[] {0, 0, 1, 1}, 0.5, 1.0))
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage("timesSeconds[2] must be finite and increasing: timesSeconds[2]=1.0");
    }
}
