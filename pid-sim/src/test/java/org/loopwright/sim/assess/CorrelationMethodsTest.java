package org.loopwright.sim.assess;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;

import org.junit.jupiter.api.Test;

/** The correlation-based methods on signals whose answer is known in closed form. */
class CorrelationMethodsTest {

    private static final double H = 0.1;

    /**
     * A sine of period 12 s in white noise: its autocorrelation is a cosine of the same period (the noise
     * adds only at lag 0), so the crossings are 6 s apart and the regularity is large
     * (Thornhill, Huang &amp; Zhang 2003). White noise alone crosses at random: not regular.
     */
    @Test
    void theAutocorrelationFindsTheSinesPeriodAndCallsNoiseIrregular() {
        Random random = new Random(5);
        double[] sine = new double[6000];
        double[] noise = new double[6000];
        for (int k = 0; k < sine.length; k++) {
            noise[k] = random.nextGaussian();
            sine[k] = Math.sin(2.0 * Math.PI * k * H / 12.0) + 0.3 * noise[k];
        }
        ErrorAutocorrelation oscillating = ErrorAutocorrelation.of(sine, 0, sine.length, H);
        assertThat(oscillating.periodSeconds()).isCloseTo(12.0, within(0.12));
        assertThat(oscillating.regular()).isTrue();
        assertThat(ErrorAutocorrelation.of(noise, 0, noise.length, H).regular()).isFalse();
    }

    /**
     * Horch 1999: with u and y a quarter period apart (u a triangle, the integral of a square y) the
     * cross-correlation is odd, φ = 90°; with u = −y·gain it is even, φ = 0°; u lagging −y by 30°
     * gives 30° (the crossings of cos(ωτ + φ) are at (±π/2 − φ)/ω).
     */
    @Test
    void theCrossCorrelationPhaseSeparatesOddFromEven() {
        int period = 200;
        int n = 20 * period;
        double[] square = new double[n];
        double[] triangle = new double[n];
        double[] antiPhase = new double[n];
        double[] lagging = new double[n];
        double[] sine = new double[n];
        double integral = 0.0;
        for (int k = 0; k < n; k++) {
            double w = 2.0 * Math.PI * k / period;
            square[k] = Math.sin(w) >= 0.0 ? 1.0 : -1.0;
            integral -= square[k];
            triangle[k] = integral;
            sine[k] = Math.sin(w);
            antiPhase[k] = -2.0 * Math.sin(w);
            lagging[k] = -Math.sin(w - Math.toRadians(30.0));
        }
        assertThat(HorchStiction.phaseDegrees(triangle, square, 0, n, period)).isCloseTo(90.0, within(3.0));
        assertThat(HorchStiction.phaseDegrees(antiPhase, sine, 0, n, period)).isCloseTo(0.0, within(1.0));
        assertThat(HorchStiction.phaseDegrees(lagging, sine, 0, n, period)).isCloseTo(30.0, within(1.0));
    }
}
