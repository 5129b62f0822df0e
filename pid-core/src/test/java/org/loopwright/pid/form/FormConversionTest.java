package org.loopwright.pid.form;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * The form conversions against Åström &amp; Hägglund, <i>Advanced PID Control</i> (ISA, 2006), ch. 3
 * (§3.4, "Different parameterizations"), and against the product of the series factors expanded by
 * hand. The formulas of the book are quoted from memory; the hand expansions check them.
 */
class FormConversionTest {

    private static final double EXACT = 1e-12;

    @Test
    void seriesToIdealMatchesTheExpandedProduct() {
        // Series Kc' = 1, Ti' = 4 s, Td' = 1 s. By hand: (1 + 1/(4s))·(1 + s) = 1.25 + 1/(4s) + s,
        // so Kc = 1.25, Kc/Ti = 0.25 (Ti = 5 s), Kc·Td = 1 (Td = 0.8 s).
        // A&H 2006 §3.4: Kc = Kc'(Ti' + Td')/Ti', Ti = Ti' + Td', Td = Ti'Td'/(Ti' + Td').
        IdealGains ideal = new SeriesGains(1.0, 4.0, 1.0).toIdeal();
        assertThat(ideal.gain()).isCloseTo(1.25, within(EXACT));
        assertThat(ideal.integralTime()).isCloseTo(5.0, within(EXACT));
        assertThat(ideal.derivativeTime()).isCloseTo(0.8, within(EXACT));
    }

    @Test
    void idealToSeriesInvertsTheWorkedCase() {
        // A&H 2006 §3.4: Kc' = Kc(1 + √(1 − 4Td/Ti))/2, Ti' = Ti(1 + √…)/2, Td' = Ti(1 − √…)/2.
        // Kc = 1.25, Ti = 5, Td = 0.8: √(1 − 3.2/5) = 0.6, so Kc' = 1, Ti' = 4, Td' = 1 (the case above).
        SeriesGains series = new IdealGains(1.25, 5.0, 0.8).toSeries();
        assertThat(series.gain()).isCloseTo(1.0, within(EXACT));
        assertThat(series.integralTime()).isCloseTo(4.0, within(EXACT));
        assertThat(series.derivativeTime()).isCloseTo(1.0, within(EXACT));
    }

    @Test
    void idealToSeriesAtTheBoundaryTiEqualsFourTd() {
        // Ti = 4·Td: the square root is 0, so Kc' = Kc/2, Ti' = Td' = Ti/2. By hand:
        // 1.5·(1 + 1/(2s))·(1 + 2s) = 1.5·(2 + 2s + 1/(2s)) = 3·(1 + s + 1/(4s)): Kc 3, Ti 4, Td 1.
        SeriesGains series = new IdealGains(3.0, 4.0, 1.0).toSeries();
        assertThat(series.gain()).isCloseTo(1.5, within(EXACT));
        assertThat(series.integralTime()).isCloseTo(2.0, within(EXACT));
        assertThat(series.derivativeTime()).isCloseTo(2.0, within(EXACT));
    }

    @Test
    void idealAndParallelAreRelatedByKcTiTd() {
        // A&H 2006 §3.4: Kp = Kc, Ki = Kc/Ti, Kd = Kc·Td. Kc = 2, Ti = 20 s, Td = 2 s: Kp 2, Ki 0.1, Kd 4.
        ParallelGains parallel = new IdealGains(2.0, 20.0, 2.0).toParallel();
        assertThat(parallel.proportionalGain()).isEqualTo(2.0);
        assertThat(parallel.integralGain()).isCloseTo(0.1, within(EXACT));
        assertThat(parallel.derivativeGain()).isEqualTo(4.0);
        IdealGains back = new ParallelGains(2.0, 0.1, 4.0).toIdeal();
        assertThat(back.integralTime()).isCloseTo(20.0, within(EXACT));
        assertThat(back.derivativeTime()).isEqualTo(2.0);
    }

    @Test
    void noIntegralActionIsAnInfiniteIntegralTimeOrAZeroIntegralGain() {
        assertThat(IdealGains.pi(2.0, Double.POSITIVE_INFINITY).toParallel().integralGain()).isZero();
        assertThat(new ParallelGains(2.0, 0.0, 1.0).toIdeal().integralTime()).isEqualTo(Double.POSITIVE_INFINITY);
        assertThat(new SeriesGains(2.0, Double.POSITIVE_INFINITY, 1.0).toIdeal())
                .isEqualTo(new IdealGains(2.0, Double.POSITIVE_INFINITY, 1.0));
        assertThat(new IdealGains(2.0, Double.POSITIVE_INFINITY, 1.0).hasIntegralAction()).isFalse();
    }

    @Test
    void seriesWithEqualTimesConvertsBackDespiteRounding() {
        // Ti' = Td' gives Ti = 4·Td exactly in theory; in doubles 4·Td may exceed Ti by an ulp
        SeriesGains series = new SeriesGains(1.0, 0.0013910, 0.0013910);
        IdealGains ideal = series.toIdeal();
        assertThat(ideal.integralTime()).isLessThan(4.0 * ideal.derivativeTime());
        SeriesGains back = ideal.toSeries();
        assertThat(back.integralTime()).isCloseTo(0.0013910, within(1e-9));
        assertThat(back.derivativeTime()).isCloseTo(0.0013910, within(1e-9));
    }
}
