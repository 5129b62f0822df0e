package org.loopwright.sim.design;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.stream.Stream;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The optimised design against an independent brute-force search, as the issue asks: on a grid of
 * (Kp, Ki) the largest Ki whose sampled loop is stable with Ms within the limit; the optimiser must
 * come within 1 % of it, and its own loop must have Ms &le; limit + 1e-3. The grid knows nothing of
 * the optimiser: a coarse grid over a box three times a rule-of-thumb PI (SIMC, Skogestad 2003,
 * from memory) finds the best cell, a fine grid (steps of 0.1 % of the box in Ki) around it the
 * answer. Each evaluation is the same sampled-loop analysis {@code margins} uses.
 */
class MaxIntegralGainTest {

    private static final double LIMIT = 1.4;
    private static final int COARSE = 30;
    private static final int FINE_KP = 25;
    private static final double FINE_KI_STEP = 1e-3;

    /**
     * Each loop with its search box: three times the SIMC PI gains (Skogestad 2003, from memory,
     * tau_c = L): for K·e^(−Ls)/(Ts + 1), Kc = T/(K·2L), Ti = min(T, 8L); for K·e^(−Ls)/s,
     * Kc = 1/(K·2L), Ti = 8L.
     */
    static Stream<Arguments> loops() {
        return Stream.of(
                // K = 2, T = 5, L = 1, h = L/4: SIMC Kc = 1.25, Ti = 5, Ki = 0.25
                Arguments.of(TransferFunction.fopdt(2.0, 5.0, 1.0), 0.25, 0, 1.25, 0.25),
                // the same with one sample of sensor delay
                Arguments.of(TransferFunction.fopdt(2.0, 5.0, 1.0), 0.25, 1, 1.25, 0.25),
                // K = 0.1 per s, L = 2 s, h = 0.5 s: SIMC Kc = 2.5, Ti = 16, Ki = 0.15625
                Arguments.of(TransferFunction.integrating(0.1, 2.0), 0.5, 0, 2.5, 0.15625));
    }

    @ParameterizedTest(name = "{0}, h = {1}, sensor delay {2}")
    @MethodSource("loops")
    void optimiserFindsTheLargestIntegralGainTheGridFinds(TransferFunction plant, double h, int sensorDelay,
            double simcKp, double simcKi) {
        ControllerSettings base = ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0)).samplePeriodSeconds(h)
                .build();
        MaxIntegralGain problem = new MaxIntegralGain(plant, base, sensorDelay, LIMIT, 0.0);
        double kpBox = 3.0 * simcKp;
        double kiBox = 3.0 * simcKi;

        ParallelGains optimum = problem.solve(simcKp).orElseThrow();
        double grid = bruteForce(problem, kpBox, kiBox);

        assertThat(optimum.integralGain()).isCloseTo(grid, org.assertj.core.api.Assertions.withinPercentage(1.0));
        SampledMargins atOptimum = problem.margins(optimum.proportionalGain(), optimum.integralGain());
        assertThat(atOptimum.stable()).isTrue();
        assertThat(atOptimum.margins().sensitivityPeak().value()).isLessThanOrEqualTo(LIMIT + 1e-3);
    }

    /** The largest feasible Ki on the grid: coarse over the box, then fine around the best coarse cell. */
    private static double bruteForce(MaxIntegralGain problem, double kpBox, double kiBox) {
        double kpStep = kpBox / COARSE;
        double kiStep = kiBox / COARSE;
        double bestKp = 0.0;
        double bestKi = 0.0;
        for (int i = 1; i <= COARSE; i++) {
            for (int j = 1; j <= COARSE; j++) {
                if (j * kiStep > bestKi && problem.excess(i * kpStep, j * kiStep) <= 0.0) {
                    bestKp = i * kpStep;
                    bestKi = j * kiStep;
                }
            }
        }
        assertThat(bestKi).as("the box must hold feasible gains").isPositive();
        assertThat(bestKi).as("the box must be large enough").isLessThan(kiBox);
        double best = bestKi;
        double fineKi = FINE_KI_STEP * kiBox;
        for (int i = -FINE_KP; i <= FINE_KP; i++) {
            double kp = bestKp + i * kpStep / FINE_KP;
            if (kp <= 0.0) {
                continue;
            }
            // every Ki from the coarse best upwards, in fine steps, until the loop fails the constraints
            for (double ki = bestKi; ki <= bestKi + 2.0 * kiStep; ki += fineKi) {
                if (problem.excess(kp, ki) > 0.0) {
                    break;
                }
                best = Math.max(best, ki);
            }
        }
        return best;
    }
}
