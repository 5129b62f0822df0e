package org.loopwright.pid.form;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.Scale;

/** Round trips between the forms, and equal frequency responses for equivalent forms. */
class FormProperties {

    private static void assertRelative(double actual, double expected) {
        assertThat(actual).isCloseTo(expected, within(1e-10 * Math.max(1.0, Math.abs(expected))));
    }

    @Property(tries = 1000)
    void idealToParallelAndBackIsTheIdentity(@ForAll @DoubleRange(min = 1e-3, max = 1e3) @Scale(6) double gain,
            @ForAll @DoubleRange(min = 1e-3, max = 1e4) @Scale(6) double integralTime,
            @ForAll @DoubleRange(min = 0.0, max = 1e3) @Scale(6) double derivativeTime) {
        IdealGains ideal = new IdealGains(gain, integralTime, derivativeTime);
        IdealGains back = ideal.toParallel().toIdeal();
        assertRelative(back.gain(), gain);
        assertRelative(back.integralTime(), integralTime);
        assertRelative(back.derivativeTime(), derivativeTime);
    }

    @Property(tries = 1000)
    void parallelToIdealAndBackIsTheIdentity(@ForAll @DoubleRange(min = 1e-3, max = 1e3) @Scale(6) double kp,
            @ForAll @DoubleRange(min = 0.0, max = 1e3) @Scale(6) double ki, @ForAll @DoubleRange(min = 0.0, max = 1e3) @Scale(6) double kd) {
        ParallelGains back = new ParallelGains(kp, ki, kd).toIdeal().toParallel();
        assertRelative(back.proportionalGain(), kp);
        assertRelative(back.integralGain(), ki);
        assertRelative(back.derivativeGain(), kd);
    }

    @Property(tries = 1000)
    void idealToSeriesAndBackIsTheIdentity(@ForAll @DoubleRange(min = 1e-3, max = 1e3) @Scale(6) double gain,
            @ForAll @DoubleRange(min = 1e-3, max = 1e4) @Scale(6) double integralTime,
            @ForAll @DoubleRange(min = 0.0, max = 0.25) @Scale(6) double derivativeFraction) {
        IdealGains ideal = new IdealGains(gain, integralTime, derivativeFraction * integralTime);
        IdealGains back = ideal.toSeries().toIdeal();
        assertRelative(back.gain(), gain);
        assertRelative(back.integralTime(), integralTime);
        assertThat(back.derivativeTime()).isCloseTo(ideal.derivativeTime(), within(1e-10 * integralTime));
    }

    @Property(tries = 1000)
    void seriesToIdealAndBackIsTheIdentityWhenTiIsAtLeastTd(@ForAll @DoubleRange(min = 1e-3, max = 1e3) @Scale(6) double gain,
            @ForAll @DoubleRange(min = 1e-3, max = 1e4) @Scale(6) double integralTime,
            @ForAll @DoubleRange(min = 0.0, max = 1.0) @Scale(6) double derivativeFraction) {
        // The series form with Ti' < Td' is the same controller as the one with Ti' and Td' swapped;
        // the conversion back picks the root with Ti' >= Td'.
        SeriesGains series = new SeriesGains(gain, integralTime, derivativeFraction * integralTime);
        SeriesGains back = series.toIdeal().toSeries();
        assertRelative(back.gain(), gain);
        assertRelative(back.integralTime(), integralTime);
        // Td' comes from Ti·(1 − √(1 − 4Td/Ti))/2, a difference that loses digits near Ti = 4Td
        assertThat(back.derivativeTime()).isCloseTo(series.derivativeTime(), within(1e-6 * integralTime));
    }

    @Property(tries = 1000)
    void equivalentFormsHaveTheSameFrequencyResponse(@ForAll @DoubleRange(min = 1e-2, max = 1e2) @Scale(6) double gain,
            @ForAll @DoubleRange(min = 1e-2, max = 1e3) @Scale(6) double integralTime,
            @ForAll @DoubleRange(min = 0.0, max = 1e2) @Scale(6) double derivativeTime,
            @ForAll @DoubleRange(min = 1e-3, max = 1e2) @Scale(6) double omega) {
        // series C(jω) = Kc'·(1 + 1/(jωTi'))·(1 + jωTd'), multiplied out with complex numbers by hand
        SeriesGains series = new SeriesGains(gain, integralTime, derivativeTime);
        double aRe = 1.0;
        double aIm = -1.0 / (omega * integralTime);
        double bRe = 1.0;
        double bIm = omega * derivativeTime;
        double seriesRe = gain * (aRe * bRe - aIm * bIm);
        double seriesIm = gain * (aRe * bIm + aIm * bRe);
        // parallel C(jω) = Kp + Ki/(jω) + Kd·jω
        ParallelGains parallel = series.toParallel();
        double parallelRe = parallel.proportionalGain();
        double parallelIm = -parallel.integralGain() / omega + parallel.derivativeGain() * omega;
        double scale = Math.max(1.0, Math.hypot(seriesRe, seriesIm));
        assertThat(parallelRe).isCloseTo(seriesRe, within(1e-10 * scale));
        assertThat(parallelIm).isCloseTo(seriesIm, within(1e-10 * scale));
    }
}
