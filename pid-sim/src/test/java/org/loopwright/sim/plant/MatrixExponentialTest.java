package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.withinPercentage;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class MatrixExponentialTest {

    /** Relative 1e-15, as a percentage. */
    private static final double RELATIVE = 1e-13;

    /**
     * Analytic (Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i>, 3rd ed., §2.3): K/(Ts+1) as
     * ẋ = −x/T + (K/T)·u sampled with a zero-order hold over h has Φ = e^(−h/T) and
     * Γ = K·(1 − e^(−h/T)), read from e^([[−h/T, K·h/T], [0, 0]]) = [[Φ, Γ], [0, 1]]; h/T chosen so the
     * 1-norm 2.5·h/T falls in each Padé degree's range (3, 5, 7, 9, 13 unscaled). Past h/T ≈ 2 (periods
     * of several time constants) Φ = e^(−h/T) is small and its relative error grows, 1.8e-15 at h/T = 3 and
     * 3.7e-15 at 6: the same bits as Hipparchus gives.
     */
    @ParameterizedTest
    @ValueSource(doubles = {1e-3, 0.05, 0.2, 0.5, 1.5})
    void firstOrderPlantSampledWithAHold(double periodOverTimeConstant) {
        double gain = 2.5;
        double[] exponential = MatrixExponential.of(
                new double[] {-periodOverTimeConstant, gain * periodOverTimeConstant, 0.0, 0.0}, 2);
        assertThat(exponential[0]).isCloseTo(Math.exp(-periodOverTimeConstant), withinPercentage(RELATIVE));
        // 1 − e^(−h/T) written as −expm1(−h/T), which keeps its digits for small h/T
        assertThat(exponential[1]).isCloseTo(-gain * Math.expm1(-periodOverTimeConstant),
                withinPercentage(RELATIVE));
        assertThat(exponential[2]).isZero();
        assertThat(exponential[3]).isCloseTo(1.0, withinPercentage(RELATIVE));
    }

    @Test
    void rejectsAnArrayThatIsNotSquareOfTheDimension() {
        assertThatThrownBy(() -> MatrixExponential.of(new double[3], 2))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("a square matrix of dimension 1..52 is needed: dimension=2, entries=3");
    }
}
