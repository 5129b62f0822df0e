package org.loopwright.sim.assess;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;

import org.junit.jupiter.api.Test;

/**
 * The minimum-variance index against cases derived here in closed form. The process is
 * y(t) = b·u(t−d) + N(t) with the disturbance N(t) = φ·N(t−1) + a(t), a white with variance 1
 * (Harris 1989's setting; Åström 1970, ch. 6, for the minimum-variance controller; from memory).
 */
class HarrisIndexTest {

    private static final double PHI = 0.8;
    private static final int D = 3;
    private static final double B = 2.0;
    private static final int N = 20_000;

    /**
     * The minimum-variance controller predicts N d steps ahead, N̂(t+d|t) = φ^d·N(t), and cancels it:
     * b·u(t) = −φ^d·N(t), with N(t) = y(t) − b·u(t−d) known at t. Then
     * y(t+d) = N(t+d) − φ^d·N(t) = a(t+d) + φ·a(t+d−1) + … + φ^(d−1)·a(t+1), exactly the part no
     * controller can remove: the index is 1.
     */
    @Test
    void theMinimumVarianceControllerScoresOne() {
        Random random = new Random(11);
        double[] u = new double[N];
        double[] y = new double[N];
        double disturbance = 0.0;
        for (int t = 0; t < N; t++) {
            disturbance = PHI * disturbance + random.nextGaussian();
            y[t] = (t >= D ? B * u[t - D] : 0.0) + disturbance;
            double known = y[t] - (t >= D ? B * u[t - D] : 0.0);
            u[t] = -Math.pow(PHI, D) * known / B;
        }
        double[] error = negate(y);
        HarrisIndex index = HarrisIndex.of(error, 100, N, D);
        assertThat(index.stationary()).isTrue();
        assertThat(index.index()).isCloseTo(1.0, within(0.05));
    }

    /**
     * Open loop (u = 0): e = −N, an AR(1) with variance 1/(1 − φ²). The minimum variance is that of
     * its first d impulse-response terms 1, φ, …, φ^(d−1): (1 − φ^(2d))/(1 − φ²). The index is their
     * ratio, 1 − φ^(2d) = 0.7379 for φ = 0.8, d = 3.
     */
    @Test
    void anOpenLoopScoresOneMinusPhiToTheTwoD() {
        Random random = new Random(12);
        double[] y = new double[N];
        double disturbance = 0.0;
        for (int t = 0; t < N; t++) {
            disturbance = PHI * disturbance + random.nextGaussian();
            y[t] = disturbance;
        }
        HarrisIndex index = HarrisIndex.of(negate(y), 0, N, D);
        assertThat(index.index()).isCloseTo(1.0 - Math.pow(PHI, 2 * D), within(0.03));
        // a dead time of (d − 1)·h maps to d samples: the hold adds one
        assertThat(LoopAssessment.delaySamples((D - 1) * 0.5, 0.5)).isEqualTo(D);
    }

    /** Step-down recursion: (1 − 0.8q⁻¹)(1 − 0.7q⁻¹) is stationary; (1 − q⁻¹)(1 − 0.5q⁻¹) has a unit root. */
    @Test
    void stationarityFollowsTheRootsOfTheArPolynomial() {
        assertThat(HarrisIndex.stationary(new double[] {1.5, -0.56})).isTrue();
        assertThat(HarrisIndex.stationary(new double[] {1.5, -0.5})).isFalse();
        assertThat(HarrisIndex.stationary(new double[] {1.2})).isFalse();
        assertThat(HarrisIndex.stationary(new double[] {-0.9})).isTrue();
    }

    private static double[] negate(double[] x) {
        double[] out = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            out[i] = -x[i];
        }
        return out;
    }
}
