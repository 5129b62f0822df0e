package org.loopwright.pid;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Builders;
import net.jqwik.api.Combinators;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.PidGains;

/**
 * Valid controller settings drawn through jqwik arbitraries, so that a failing property shrinks to
 * a small case and jqwik's edge values are tried. Every draw is valid by construction: no
 * {@link InvalidSettingException} is caught and replaced, so a validation regression fails loudly.
 */
final class SettingsArbitraries {

    private SettingsArbitraries() {
    }

    /** A value log-uniform between two positive bounds. */
    static Arbitrary<Double> logUniform(double min, double max) {
        return Arbitraries.doubles().between(0.0, 1.0).ofScale(6).map(u -> min * Math.pow(max / min, u));
    }

    /** Ideal gains with Ti ≥ 4·Td, so that every form exists; sometimes no I or no D. */
    static Arbitrary<IdealGains> idealGains() {
        Arbitrary<Double> gain = logUniform(0.01, 100.0);
        Arbitrary<Double> integralTime = Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(9, logUniform(0.01, 1000.0)),
                net.jqwik.api.Tuple.of(1, Arbitraries.just(Double.POSITIVE_INFINITY)));
        Arbitrary<Double> derivativeShare = Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(1, Arbitraries.just(0.0)),
                net.jqwik.api.Tuple.of(2, Arbitraries.doubles().between(0.0, 0.25)));
        return Combinators.combine(gain, integralTime, derivativeShare)
                .as((k, ti, share) -> new IdealGains(k, ti, share * Math.min(ti, 100.0)));
    }

    /** The same gains in any of the three forms. */
    static Arbitrary<PidGains> gains() {
        return idealGains().flatMap(g -> Arbitraries.of(g, g.toParallel(), g.toSeries()));
    }

    /** A range that may be wide, one-sided or reach the ends of the double range. */
    private static Arbitrary<double[]> ranges() {
        return Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(6, Combinators.combine(Arbitraries.doubles().between(-100.0, 0.0),
                        logUniform(0.1, 200.0)).as((lo, width) -> new double[] {lo, lo + width})),
                net.jqwik.api.Tuple.of(1, Arbitraries.just(new double[] {Double.NEGATIVE_INFINITY,
                        Double.POSITIVE_INFINITY})),
                net.jqwik.api.Tuple.of(1, Arbitraries.just(new double[] {-1e308, 1e308})),
                net.jqwik.api.Tuple.of(1, Arbitraries.just(new double[] {0.0, Double.POSITIVE_INFINITY})));
    }

    /** Everything an industrial configuration may switch on. */
    static Arbitrary<ControllerSettings> settings() {
        Arbitrary<ControllerSettings.Builder> built = Builders.withBuilder(ControllerSettings::builder)
                .use(gains()).in(ControllerSettings.Builder::gains)
                .use(logUniform(1e-3, 1.0)).in(ControllerSettings.Builder::samplePeriodSeconds)
                .use(Arbitraries.doubles().between(2.0, 20.0)).in(ControllerSettings.Builder::derivativeFilterRatio)
                .use(Combinators.combine(Arbitraries.doubles().between(0.0, 1.0), Arbitraries.doubles().between(0.0, 1.0))
                        .as((b, c) -> new double[] {b, c})).in((b, w) -> b.setpointWeights(w[0], w[1]))
                .use(Arbitraries.of(IntegralMethod.values())).in(ControllerSettings.Builder::integralMethod)
                .use(Arbitraries.of(Action.values())).in(ControllerSettings.Builder::action)
                .use(ranges()).in((b, r) -> b.outputRange(r[0], r[1]))
                .use(Arbitraries.of(WindupProtection.values())).in(ControllerSettings.Builder::windupProtection)
                .use(Arbitraries.of(OutputKind.values())).in(ControllerSettings.Builder::outputKind)
                .use(logUniform(0.1, 1000.0)).withProbability(0.5).in(ControllerSettings.Builder::outputSlewPerSecond)
                .use(logUniform(0.1, 100.0)).withProbability(0.25).in(ControllerSettings.Builder::setpointSlewPerSecond)
                .use(Arbitraries.doubles().between(0.0, 0.5)).withProbability(0.25)
                .in(ControllerSettings.Builder::errorDeadband)
                .use(logUniform(0.01, 100.0)).withProbability(0.5).in(ControllerSettings.Builder::trackingTimeSeconds)
                // a circular process variable takes b = 1 (b·r has no meaning on a circle)
                .use(Arbitraries.doubles().between(0.0, 1.0)).withProbability(1.0 / 6.0)
                .in((b, c) -> b.wrapSpan(360.0).setpointWeights(1.0, c))
                .build();
        return built.flatMap(b -> {
            ControllerSettings s = b.build();
            return Combinators.combine(Arbitraries.of(FaultPolicy.values()), Arbitraries.doubles().between(0.0, 1.0),
                    Arbitraries.of(DerivativeMethod.values()).filter(
                            m -> m.isStable(s.samplePeriodSeconds(), s.derivativeFilterTimeSeconds())))
                    .as((policy, at, method) -> s.toBuilder().faultPolicy(policy, safeOutput(s, at))
                            .derivativeMethod(method).build());
        });
    }

    /** A safe output within the range, at a share of it (0 where the range is unbounded). */
    private static double safeOutput(ControllerSettings s, double share) {
        double lo = s.outputMin();
        double hi = s.outputMax();
        if (Double.isFinite(lo) && Double.isFinite(hi)) {
            return lo * (1.0 - share) + hi * share;
        }
        return Math.min(Math.max(0.0, lo), hi);
    }
}
