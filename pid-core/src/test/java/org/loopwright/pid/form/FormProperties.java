package org.loopwright.pid.form;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;

/**
 * Round trips between the forms, and equal frequency responses for equivalent forms. Values are
 * drawn log-uniformly over several decades from one seed per try.
 */
class FormProperties {

    private static double logUniform(Random rnd, double min, double max) {
        return min * Math.pow(max / min, rnd.nextDouble());
    }

    /** Zero a quarter of the time, else log-uniform. */
    private static double zeroOr(Random rnd, double min, double max) {
        return rnd.nextInt(4) == 0 ? 0.0 : logUniform(rnd, min, max);
    }

    private static void assertRelative(double actual, double expected) {
        assertThat(actual).isCloseTo(expected, within(1e-10 * Math.max(1.0, Math.abs(expected))));
    }

    @Property(tries = 1000)
    void idealToParallelAndBackIsTheIdentity(@ForAll long seed) {
        Random rnd = new Random(seed);
        double gain = logUniform(rnd, 1e-3, 1e3);
        double integralTime = logUniform(rnd, 1e-3, 1e4);
        double derivativeTime = zeroOr(rnd, 1e-3, 1e3);
        IdealGains ideal = new IdealGains(gain, integralTime, derivativeTime);
        IdealGains back = ideal.toParallel().toIdeal();
        assertRelative(back.gain(), gain);
        assertRelative(back.integralTime(), integralTime);
        assertRelative(back.derivativeTime(), derivativeTime);
    }

    @Property(tries = 1000)
    void parallelToIdealAndBackIsTheIdentity(@ForAll long seed) {
        Random rnd = new Random(seed);
        double kp = logUniform(rnd, 1e-3, 1e3);
        double ki = zeroOr(rnd, 1e-3, 1e3);
        double kd = zeroOr(rnd, 1e-3, 1e3);
        ParallelGains back = new ParallelGains(kp, ki, kd).toIdeal().toParallel();
        assertRelative(back.proportionalGain(), kp);
        assertRelative(back.integralGain(), ki);
        assertRelative(back.derivativeGain(), kd);
    }

    @Property(tries = 1000)
    void idealToSeriesAndBackIsTheIdentity(@ForAll long seed) {
        Random rnd = new Random(seed);
        double gain = logUniform(rnd, 1e-3, 1e3);
        double integralTime = logUniform(rnd, 1e-3, 1e4);
        double derivativeFraction = rnd.nextInt(8) == 0 ? 0.25 : 0.25 * rnd.nextDouble();
        IdealGains ideal = new IdealGains(gain, integralTime, derivativeFraction * integralTime);
        IdealGains back = ideal.toSeries().toIdeal();
        assertRelative(back.gain(), gain);
        assertRelative(back.integralTime(), integralTime);
        assertThat(back.derivativeTime()).isCloseTo(ideal.derivativeTime(), within(1e-10 * integralTime));
    }

    @Property(tries = 1000)
    void seriesToIdealAndBackIsTheIdentityWhenTiIsAtLeastTd(@ForAll long seed) {
        Random rnd = new Random(seed);
        double gain = logUniform(rnd, 1e-3, 1e3);
        double integralTime = logUniform(rnd, 1e-3, 1e4);
        double derivativeFraction = rnd.nextInt(8) == 0 ? 1.0 : rnd.nextDouble();
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

    @Property(tries = 1000)
    void equivalentFormsHaveTheSameFrequencyResponse(@ForAll long seed) {
        Random rnd = new Random(seed);
        double gain = logUniform(rnd, 1e-2, 1e2);
        double integralTime = logUniform(rnd, 1e-2, 1e3);
        double derivativeTime = zeroOr(rnd, 1e-3, 1e2);
        double omega = logUniform(rnd, 1e-3, 1e2);
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
