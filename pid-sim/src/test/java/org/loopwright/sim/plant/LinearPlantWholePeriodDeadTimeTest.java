package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * A dead time of n periods written as n·h in floating point: consuming it a period at a time leaves
 * a rounding sliver either side of the period's end (0.1 s × 30 ends 1.2e-15 s early, 0.3 s × 7 ends
 * 5.6e-17 s late), which the plant puts at the period's end. The response must still be the delayed
 * one, to the period, over a long run.
 */
class LinearPlantWholePeriodDeadTimeTest {

    /**
     * Analytic: K·e^(−Ls)/(Ts+1) driven by 1 from t = 0 and by 2 from t = 50·h (two steps, superposed)
     * gives K·(1 − e^(−(t−L)/T)) after L plus K·(1 − e^(−(t−50h−L)/T)) after 50·h + L; the input is
     * piecewise constant on the sample grid, so the zero-order-hold step is exact at every sample.
     */
    @ParameterizedTest(name = "h = {0} s, L = {1} periods")
    @CsvSource({"0.1, 30", "0.3, 7", "0.7, 3", "0.01, 123", "0.2, 15"})
    void responseIsDelayedByTheWholeNumberOfPeriods(double h, int periods) {
        double gain = 0.5;
        double tau = 60.0 * h;
        double deadTime = periods * h;
        int secondStep = 50;
        Plant plant = new LinearPlant(TransferFunction.fopdt(gain, tau, deadTime));
        for (int k = 1; k <= 3000; k++) {
            plant.advance(k <= secondStep ? 1.0 : 2.0, h);
            int sinceFirst = k - periods;
            int sinceSecond = k - secondStep - periods;
            double expected = (sinceFirst > 0 ? gain * (1 - Math.exp(-sinceFirst * h / tau)) : 0.0)
                    + (sinceSecond > 0 ? gain * (1 - Math.exp(-sinceSecond * h / tau)) : 0.0);
            assertThat(plant.output()).as("k=%s", k).isCloseTo(expected, within(1e-11));
        }
    }
}
