package org.loopwright.pid.form;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.loopwright.pid.testing.Draws.logUniform;
import static org.loopwright.pid.testing.Draws.zeroOrLogUniform;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.loopwright.pid.testing.Draws;

/**
 * Round trips between the forms, and equal frequency responses for equivalent forms. Values are
 * drawn log-uniformly over several decades through jqwik arbitraries, so a failure shrinks.
 */
class FormProperties {

    private static void assertRelative(double actual, double expected) {
        assertThat(actual).isCloseTo(expected, within(1e-10 * Math.max(1.0, Math.abs(expected))));
    }

    @Provide
    Arbitrary<Double> gains() {
        return logUniform(1e-3, 1e3);
    }

    @Provide
    Arbitrary<Double> integralTimes() {
        return logUniform(1e-3, 1e4);
    }

    @Provide
    Arbitrary<Double> zeroOrGains() {
        return zeroOrLogUniform(1e-3, 1e3);
    }

    /** Td/Ti up to the limit where the series form exists, the limit itself one time in eight. */
    @Provide
    Arbitrary<Double> seriesDerivativeFractions() {
        return Arbitraries.frequencyOf(Tuple.of(1, Arbitraries.just(0.25)),
                Tuple.of(7, Draws.between(0.0, 0.25)));
    }

    /** Td'/Ti' up to 1, 1 itself one time in eight. */
    @Provide
    Arbitrary<Double> idealDerivativeFractions() {
        return Arbitraries.frequencyOf(Tuple.of(1, Arbitraries.just(1.0)),
                Tuple.of(7, Draws.between(0.0, 1.0)));
    }

    @Property
    void idealToParallelAndBackIsTheIdentity(@ForAll("gains") double gain,
            @ForAll("integralTimes") double integralTime, @ForAll("zeroOrGains") double derivativeTime) {
        IdealGains ideal = new IdealGains(gain, integralTime, derivativeTime);
        IdealGains back = ideal.toParallel().toIdeal();
        assertRelative(back.gain(), gain);
        assertRelative(back.integralTime(), integralTime);
        assertRelative(back.derivativeTime(), derivativeTime);
    }

    @Property
    void parallelToIdealAndBackIsTheIdentity(@ForAll("gains") double kp, @ForAll("zeroOrGains") double ki,
            @ForAll("zeroOrGains") double kd) {
        ParallelGains back = new ParallelGains(kp, ki, kd).toIdeal().toParallel();
        assertRelative(back.proportionalGain(), kp);
        assertRelative(back.integralGain(), ki);
        assertRelative(back.derivativeGain(), kd);
    }

    @Property
    void idealToSeriesAndBackIsTheIdentity(@ForAll("gains") double gain, @ForAll("integralTimes") double integralTime,
            @ForAll("seriesDerivativeFractions") double derivativeFraction) {
        IdealGains ideal = new IdealGains(gain, integralTime, derivativeFraction * integralTime);
        IdealGains back = ideal.toSeries().toIdeal();
        assertRelative(back.gain(), gain);
        assertRelative(back.integralTime(), integralTime);
        assertThat(back.derivativeTime()).isCloseTo(ideal.derivativeTime(), within(1e-10 * integralTime));
    }

    @Property
    void seriesToIdealAndBackIsTheIdentityWhenTiIsAtLeastTd(@ForAll("gains") double gain,
            @ForAll("integralTimes") double integralTime, @ForAll("idealDerivativeFractions") double derivativeFraction) {
        // The series form with Ti' < Td' is the same controller as the one with Ti' and Td' swapped;
        // the conversion back picks the root with Ti' >= Td'.
        SeriesGains series = new SeriesGains(gain, integralTime, derivativeFraction * integralTime);
        SeriesGains back = series.toIdeal().toSeries();
        // near Ti' = Td' the root √(1 − 4Td/Ti) is close to 0: a rounding error δ in the ideal values
        // becomes √δ in the series ones (about 1e-8), the conditioning of the problem itself
        assertThat(back.gain()).isCloseTo(gain, within(1e-6 * gain));
        assertThat(back.integralTime()).isCloseTo(integralTime, within(1e-6 * integralTime));
        assertThat(back.derivativeTime()).isCloseTo(series.derivativeTime(), within(1e-6 * integralTime));
        if (derivativeFraction < 0.9) {
            assertRelative(back.gain(), gain);
            assertRelative(back.integralTime(), integralTime);
        }
    }

    /** Gain, Ti, Td and ω of the frequency-response check: four decades of gain, five of time. */
    @Provide
    Arbitrary<double[]> responseCases() {
        return Combinators.combine(logUniform(1e-2, 1e2), logUniform(1e-2, 1e3), zeroOrLogUniform(1e-3, 1e2),
                logUniform(1e-3, 1e2)).as((k, ti, td, w) -> new double[] {k, ti, td, w});
    }

    @Property
    void equivalentFormsHaveTheSameFrequencyResponse(@ForAll("responseCases") double[] c) {
        double gain = c[0];
        double integralTime = c[1];
        double derivativeTime = c[2];
        double omega = c[3];
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
