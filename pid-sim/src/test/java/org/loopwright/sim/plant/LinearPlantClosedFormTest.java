package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class LinearPlantClosedFormTest {

    /** Analytic: the step response of K/(Ts+1) is K·(1 − e^(−t/T)). */
    @Test
    void firstOrderStepFollowsTheClosedForm() {
        double gain = 2.0;
        double tau = 30.0;
        double h = 0.7;
        Plant plant = new LinearPlant(TransferFunction.firstOrder(gain, tau));
        for (int k = 1; k <= 200; k++) {
            plant.advance(1.5, h);
            double t = k * h;
            assertThat(plant.output()).isCloseTo(1.5 * gain * (1 - Math.exp(-t / tau)), within(1e-12));
        }
    }

    /**
     * Analytic: the step response of K·e^(−Ls)/(Ts+1) is 0 before L and K·(1 − e^(−(t−L)/T)) after,
     * here with L = 2.35 periods, so the delay is not a whole number of samples.
     */
    @ParameterizedTest
    @ValueSource(doubles = {0.1, 0.47, 1.0, 2.35})
    void fopdtWithFractionalDeadTimeIsDelayedExactly(double deadTimeInPeriods) {
        double h = 1.0;
        double deadTime = deadTimeInPeriods * h;
        double gain = 2.0;
        double tau = 7.0;
        Plant plant = new LinearPlant(TransferFunction.fopdt(gain, tau, deadTime));
        for (int k = 1; k <= 60; k++) {
            plant.advance(1.0, h);
            double t = k * h;
            double expected = t <= deadTime ? 0.0 : gain * (1 - Math.exp(-(t - deadTime) / tau));
            assertThat(plant.output()).as("t=%s", t).isCloseTo(expected, within(1e-12));
        }
    }

    /** Analytic: K/s integrates: a held input u gives K·u·t after the dead time. */
    @Test
    void integratingPlantRampsAfterItsDeadTime() {
        Plant plant = new LinearPlant(TransferFunction.integrating(0.1, 2.5));
        for (int k = 1; k <= 20; k++) {
            plant.advance(3.0, 1.0);
            assertThat(plant.output()).isCloseTo(0.1 * 3.0 * Math.max(0.0, k - 2.5), within(1e-12));
        }
    }

    /** Analytic: a pure gain with dead time reproduces the input delayed, piece by piece. */
    @Test
    void staticGainWithDeadTimeDelaysHeldPieces() {
        Plant plant = new LinearPlant(new TransferFunction(new double[] {3.0}, new double[] {1.0}, 1.5));
        double[] inputs = {1, 2, 3, 4, 5};
        // just before t = k+1 the plant sees the input of time k−0.5, held over [k−1, k)
        double[] expected = {0, 3, 6, 9, 12};
        for (int k = 0; k < inputs.length; k++) {
            plant.advance(inputs[k], 1.0);
            assertThat(plant.output()).as("k=%s", k).isEqualTo(expected[k]);
        }
    }

    @Test
    void resetReturnsToRest() {
        Plant plant = new LinearPlant(TransferFunction.fopdt(1.0, 5.0, 1.3));
        for (int k = 0; k < 10; k++) {
            plant.advance(1.0, 1.0);
        }
        plant.reset();
        plant.advance(1.0, 1.0);
        assertThat(plant.output()).isZero();
    }
}
