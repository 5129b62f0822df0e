package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class DistributionTest {

    /**
     * Reference values from NumPy's percentile with its default linear method (Hyndman &amp; Fan definition
     * 7), computed when this test was written:
     * {@code numpy.percentile([3.5, -1, 7, 2, 10, 4.25, 0], [50, 90])} gives 3.5 and 8.2.
     */
    @Test
    void percentilesMatchNumpysLinearMethod() {
        Distribution d = Distribution.of(new double[] {3.5, -1.0, Double.NaN, 7.0, 2.0, 10.0, 4.25, 0.0});
        assertThat(d.count()).isEqualTo(7);
        assertThat(d.min()).isEqualTo(-1.0);
        assertThat(d.median()).isCloseTo(3.5, within(1e-12));
        assertThat(d.p90()).isCloseTo(8.2, within(1e-12));
        assertThat(d.max()).isEqualTo(10.0);
    }

    /** numpy.percentile([1, 2, 3, 4], [50, 90]) gives 2.5 and 3.7: the median of an even count is interpolated. */
    @Test
    void evenCountInterpolates() {
        Distribution d = Distribution.of(new double[] {4.0, 1.0, 3.0, 2.0});
        assertThat(d.median()).isCloseTo(2.5, within(1e-12));
        assertThat(d.p90()).isCloseTo(3.7, within(1e-12));
    }

    @Test
    void noValuesGiveNaN() {
        Distribution d = Distribution.of(new double[] {Double.NaN});
        assertThat(d.count()).isZero();
        assertThat(d.median()).isNaN();
    }
}
