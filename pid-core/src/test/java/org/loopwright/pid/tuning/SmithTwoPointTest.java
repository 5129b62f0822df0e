package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.InvalidSettingException;

class SmithTwoPointTest {

    /** Samples the analytic step response K·Δu·(1 − e^(−(t − t0 − L)/T)) for t &gt; t0 + L, plus an offset. */
    private static double[][] fopdtStep(double k, double t, double l, double stepTime, double inputChange,
                                        double offset, double dt, double end) {
        int n = (int) Math.round(end / dt) + 1;
        double[] times = new double[n];
        double[] outputs = new double[n];
        for (int i = 0; i < n; i++) {
            times[i] = i * dt;
            double since = times[i] - stepTime - l;
            outputs[i] = offset + (since > 0.0 ? k * inputChange * (1.0 - Math.exp(-since / t)) : 0.0);
        }
        return new double[][] {times, outputs};
    }

    static Stream<Arguments> models() {
        return Stream.of(
                Arguments.of(2.0, 5.0, 1.0, 3.0, 20.0),
                Arguments.of(-0.8, 30.0, 12.0, 10.0, 55.0),
                Arguments.of(1.5, 2.0, 0.0, -4.0, 0.0));
    }

    @ParameterizedTest(name = "K={0} T={1} L={2}")
    @MethodSource("models")
    void recoversAnExactFirstOrderStepResponse(double k, double t, double l, double inputChange, double offset) {
        // analytic FOPDT response; Smith's points 0.283 and 0.632 are 1 − e^(−1/3) and 1 − e^(−1)
        // rounded, so T comes out 1.5·(1 − 0.33268)·T = 1.001·T and L within 0.5 % of T
        double stepTime = 5.0;
        double[][] data = fopdtStep(k, t, l, stepTime, inputChange, offset, t / 500.0, stepTime + l + 12.0 * t);

        FopdtModel model = SmithTwoPoint.estimate(data[0], data[1], stepTime, inputChange);

        assertThat(model.processGain()).isCloseTo(k, within(1e-3 * Math.abs(k)));
        assertThat(model.timeConstantSeconds()).isCloseTo(t, within(0.005 * t));
        assertThat(model.deadTimeSeconds()).isCloseTo(l, within(0.005 * t));
    }

    @Test
    void crossingTimesAreInterpolatedBetweenSamples() {
        // a response that rises linearly from 0 at t = 1 s to 1 at t = 11 s, sampled each second:
        // linear interpolation finds the 28.3 % and 63.2 % crossings exactly, at 3.83 s and 7.32 s,
        // between samples; Smith's rule T = 1.5·(t63 − t28), L = t63 − T − step time (worked by hand)
        double[] times = new double[21];
        double[] outputs = new double[21];
        for (int i = 0; i < times.length; i++) {
            times[i] = i;
            outputs[i] = Math.min(1.0, Math.max(0.0, (i - 1.0) / 10.0));
        }
        FopdtModel model = SmithTwoPoint.estimate(times, outputs, 0.5, 2.0);
        assertThat(model.processGain()).isCloseTo(0.5, within(1e-12));
        assertThat(model.timeConstantSeconds()).isCloseTo(1.5 * (7.32 - 3.83), within(1e-9));
        assertThat(model.deadTimeSeconds()).isCloseTo(7.32 - 1.5 * (7.32 - 3.83) - 0.5, within(1e-9));
    }

    static Stream<Arguments> badData() {
        double[] t = {0.0, 1.0, 2.0, 3.0};
        return Stream.of(
                Arguments.of(t, new double[] {0, 0, 0}, 1.0, 1.0,
                        "outputs must have as many samples as timesSeconds (4): outputs=3 samples"),
                Arguments.of(new double[] {0, 1}, new double[] {0, 1}, 1.0, 1.0,
                        "timesSeconds must have at least 3 samples: timesSeconds=2 samples"),
                Arguments.of(new double[] {0, 2, 1, 3}, new double[] {0, 0, 1, 1}, 1.0, 1.0,
                        "timesSeconds[2] must be finite and increasing: timesSeconds[2]=1.0"),
                Arguments.of(t, new double[] {0, Double.NaN, 1, 1}, 1.0, 1.0,
                        "outputs[1] must be finite: outputs[1]=NaN"),
                Arguments.of(t, new double[] {0, 1, 1, 1}, 0.5, 0.0,
                        "inputChange must be finite and non-zero: inputChange=0.0"),
                Arguments.of(t, new double[] {4, 4, 4, 4}, 1.5, 1.0,
                        "outputs must change after the step to estimate a model: outputs=constant 4.0"),
                Arguments.of(t, new double[] {0, 0, 1, 1}, 5.0, 1.0,
                        "outputs must reach 28.3 % of the change after the step: outputs=last=1.0"));
    }

    @ParameterizedTest(name = "{4}")
    @MethodSource("badData")
    void badDataIsRejectedWithFieldAndValue(double[] times, double[] outputs, double stepTime, double inputChange,
                                            String message) {
        assertThatThrownBy(() -> SmithTwoPoint.estimate(times, outputs, stepTime, inputChange))
                .isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }
}
