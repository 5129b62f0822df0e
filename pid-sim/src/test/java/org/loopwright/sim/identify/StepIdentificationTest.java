package org.loopwright.sim.identify;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.sim.config.InputFileException;

/**
 * Identification of simulated step tests. The plants, steps and noise levels are INVENTED test
 * data; the responses are the analytic step responses of the stated models (closed forms in
 * {@link IdentifiedModel}), with seeded Gaussian noise added.
 */
class StepIdentificationTest {

    /** An invented step test: the analytic response of K·e^(−sL)/((T1 s+1)(T2 s+1)) plus noise. */
    static StepTest simulated(double k, double[] lags, double l, double noise, long seed) {
        double dt = 0.5;
        int n = 801;
        double stepAt = 20.0;
        double u0 = 40.0;
        double u1 = 50.0;
        double y0 = 15.0;
        Random random = new Random(seed);
        double[] t = new double[n];
        double[] u = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * dt;
            u[i] = t[i] >= stepAt ? u1 : u0;
            y[i] = y0 + k * (u1 - u0) * IdentifiedModel.unitStep(lags, t[i] - stepAt - l) + noise * random.nextGaussian();
        }
        return new StepTest("invented.csv", t, u, y);
    }

    @Test
    void recoversAFirstOrderModelFromANoisyStep() {
        // invented: K = 2.5, T = 30 s, L = 8 s, output change 25, noise σ = 0.5 (2 % of the change)
        StepTest test = simulated(2.5, new double[] {30.0}, 8.0, 0.5, 1L);

        IdentifiedModel model = StepIdentification.identify(test, ModelKind.FOPDT);

        assertThat(model.gain()).isCloseTo(2.5, within(0.02 * 2.5));
        assertThat(model.timeConstants()[0]).isCloseTo(30.0, within(0.05 * 30.0));
        assertThat(model.deadTimeSeconds()).isCloseTo(8.0, within(0.05 * 30.0));
        assertThat(model.baseline()).isCloseTo(15.0, within(0.2));
        assertThat(model.rmse()).isCloseTo(0.5, within(0.05)); // the residual is the noise itself
        assertThat(model.rSquared()).isGreaterThan(0.99);
        assertThat(model.step().timeSeconds()).isEqualTo(20.0);
        assertThat(model.step().change()).isEqualTo(10.0);
    }

    @Test
    void recoversASecondOrderModelFromANoisyStep() {
        // invented: K = 1.5, T1 = 20 s, T2 = 6 s, L = 3 s, output change 15, noise σ = 0.15 (1 %)
        StepTest test = simulated(1.5, new double[] {20.0, 6.0}, 3.0, 0.15, 2L);

        IdentifiedModel model = StepIdentification.identify(test, ModelKind.SOPDT);

        assertThat(model.gain()).isCloseTo(1.5, within(0.02 * 1.5));
        assertThat(model.timeConstants()[0]).isCloseTo(20.0, within(0.1 * 20.0));
        assertThat(model.timeConstants()[1]).isCloseTo(6.0, within(0.2 * 6.0));
        assertThat(model.deadTimeSeconds()).isCloseTo(3.0, within(1.0));
        assertThat(model.rmse()).isCloseTo(0.15, within(0.02));
    }

    /**
     * A long record with a short response (a day's log around one bump): the two-point start's
     * smoothing (1 % of the record, here 100 s) once averaged across the step, moved the response
     * ahead of it and refused the record as showing no response. Analytic response of
     * 2·e^(−5s)/(20s + 1) to a unit step at t = 5000 s, 1 s samples, no noise.
     */
    @Test
    void aResponseShorterThanTheSmoothingWindowIsStillFound() {
        int n = 20_001;
        double[] t = new double[n];
        double[] u = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i;
            u[i] = t[i] >= 5000.0 ? 1.0 : 0.0;
            y[i] = 2.0 * IdentifiedModel.unitStep(new double[] {20.0}, t[i] - 5000.0 - 5.0);
        }

        IdentifiedModel model = StepIdentification.identify(new StepTest("day.csv", t, u, y), ModelKind.FOPDT);

        assertThat(model.gain()).isCloseTo(2.0, within(1e-3));
        assertThat(model.timeConstants()[0]).isCloseTo(20.0, within(0.05));
        assertThat(model.deadTimeSeconds()).isCloseTo(5.0, within(0.05));
    }

    @Test
    void secondOrderPlantFittedAsFirstOrderAgreesWithTheHalfRule() {
        // Skogestad (2003) half rule: 1·e^(−s)/((10s+1)(4s+1)) ≈ e^(−3s)/(12s+1), i.e. T = T1 + T2/2 = 12,
        // L = L + T2/2 = 3 (from memory). The half rule is a reduction for tuning, not a least-squares
        // fit, so we allow 10 % of T on both; invented noise-free data.
        StepTest test = simulated(1.0, new double[] {10.0, 4.0}, 1.0, 0.0, 3L);

        IdentifiedModel model = StepIdentification.identify(test, ModelKind.FOPDT);
        FopdtModel halfRule = new IdentifiedModel(ModelKind.SOPDT, 1.0, new double[] {10.0, 4.0}, 1.0, 0.0,
                model.step(), 0.0, 1.0).toFopdt();

        assertThat(halfRule).isEqualTo(new FopdtModel(1.0, 12.0, 3.0));
        assertThat(model.gain()).isCloseTo(1.0, within(0.01));
        assertThat(model.timeConstants()[0]).isCloseTo(12.0, within(1.2));
        assertThat(model.deadTimeSeconds()).isCloseTo(3.0, within(1.2));
    }

    static Stream<Arguments> badFiles() {
        StringBuilder flat = new StringBuilder("time,input,output\n");
        StringBuilder twoSteps = new StringBuilder("time,input,output\n");
        StringBuilder noResponse = new StringBuilder("time,input,output\n");
        for (int i = 0; i < 20; i++) {
            flat.append(i).append(",5,1\n");
            twoSteps.append(i).append(',').append(i < 5 ? 0 : i < 12 ? 1 : 2).append(",0\n");
            noResponse.append(i).append(',').append(i < 5 ? 0 : 1).append(",3\n");
        }
        return Stream.of(
                Arguments.of("time,in,output\n0,1,2\n",
                        "bad.csv: row 1, column 'input': required column is missing; the header has time, in, output;"
                                + " required columns: time, input, output"),
                Arguments.of("time,input,output\n0,1,2\n1,1,2\n",
                        "bad.csv: has 2 data rows; a step test needs at least 10"),
                Arguments.of(flat.toString().replace("\n3,5,1\n", "\n3,five,1\n"),
                        "bad.csv: row 5, column 'input': must be a finite number: input=five"),
                // read by the harness's one CSV reader (CsvRows): broken quoting names line and character
                Arguments.of(flat.toString().replace("\n3,5,1\n", "\n3,\"5\"x,1\n"),
                        "bad.csv:5:6: not valid CSV: only a comma may follow a quoted cell's closing quote"),
                Arguments.of(flat.toString().replace("\n3,5,1\n", "\n# a comment\n\n3 , 5 ,\"1\"\n4,5,x\n"),
                        "bad.csv: row 6, column 'output': must be a finite number: output=x"),
                Arguments.of(flat.toString().replace("\n3,5,1\n", "\n1,5,1\n"),
                        "bad.csv: row 5, column 'time': must increase from row to row: time=1 after 2"),
                Arguments.of(flat.toString(),
                        "bad.csv: holds no step: column 'input' starts and ends at 5.00000 (a step test needs one step"
                                + " in the input)"),
                Arguments.of(twoSteps.toString(),
                        "bad.csv: row 7, column 'input': must hold one step from 0.00000 to 2.00000 (at row 7),"
                                + " within 0.100000: input=1.00000"),
                Arguments.of(noResponse.toString(),
                        "bad.csv: column 'output' shows no response to the step at time=5.0 (outputs must change after"
                                + " the step to estimate a model: outputs=constant 3.0)"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("badFiles")
    void badDataIsRejectedNamingFileRowAndColumn(String text, String message) {
        assertThatThrownBy(() -> StepIdentification.identify(StepTestFile.parse("bad.csv", text), ModelKind.FOPDT))
                .isInstanceOf(InputFileException.class).hasMessage(message);
    }
}
