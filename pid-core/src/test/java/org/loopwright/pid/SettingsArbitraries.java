package org.loopwright.pid;

import static org.loopwright.pid.testing.Draws.logUniform;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Builders;
import net.jqwik.api.Builders.BuilderCombinator;
import net.jqwik.api.Combinators;
import net.jqwik.api.Tuple;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.PidGains;
import org.loopwright.pid.testing.Draws;

/**
 * Valid controller settings drawn through jqwik arbitraries, so that a failing property shrinks to
 * a small case and jqwik's edge values are tried. Every draw is valid by construction: no
 * {@link InvalidSettingException} is caught and replaced, so a validation regression fails loudly.
 */
final class SettingsArbitraries {

    private SettingsArbitraries() {
    }

    /** Ideal gains with Ti ≥ 4·Td, so that every form exists; sometimes no I or no D. */
    static Arbitrary<IdealGains> idealGains() {
        Arbitrary<Double> gain = logUniform(0.01, 100.0);
        Arbitrary<Double> integralTime = Arbitraries.frequencyOf(
                Tuple.of(9, logUniform(0.01, 1000.0)),
                Tuple.of(1, Arbitraries.just(Double.POSITIVE_INFINITY)));
        Arbitrary<Double> derivativeShare = Arbitraries.frequencyOf(
                Tuple.of(1, Arbitraries.just(0.0)),
                Tuple.of(2, Draws.between(0.0, 0.25)));
        return Combinators.combine(gain, integralTime, derivativeShare)
                .as((k, ti, share) -> new IdealGains(k, ti, share * Math.min(ti, 100.0)));
    }

    /** The same gains in any of the three forms. */
    static Arbitrary<PidGains> inAnyForm(IdealGains g) {
        return Arbitraries.of(g, g.toParallel(), g.toSeries());
    }

    /** Gains in any of the three forms. */
    static Arbitrary<PidGains> gains() {
        return idealGains().flatMap(SettingsArbitraries::inAnyForm);
    }

    /** An ordinary range: lower end within −100..0, width 0.1..200. */
    private static Arbitrary<double[]> ordinaryRanges() {
        return Combinators.combine(Draws.between(-100.0, 0.0), logUniform(0.1, 200.0))
                .as((lo, width) -> new double[] {lo, lo + width});
    }

    /** A range that may also be unbounded, one-sided or reach the ends of the double range. */
    private static Arbitrary<double[]> extremeRanges() {
        return Arbitraries.frequencyOf(
                Tuple.of(6, ordinaryRanges()),
                Tuple.of(1, Arbitraries.just(new double[] {Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY})),
                Tuple.of(1, Arbitraries.just(new double[] {-1e308, 1e308})),
                Tuple.of(1, Arbitraries.just(new double[] {0.0, Double.POSITIVE_INFINITY})));
    }

    /** The linear part of a configuration: the gains, period, filter, weights, integral method and action. */
    private static BuilderCombinator<ControllerSettings.Builder> linearParts(Arbitrary<? extends PidGains> gains) {
        return Builders.withBuilder(ControllerSettings::builder)
                .use(gains).in(ControllerSettings.Builder::gains)
                .use(logUniform(1e-3, 1.0)).in(ControllerSettings.Builder::samplePeriodSeconds)
                .use(Draws.between(2.0, 20.0)).in(ControllerSettings.Builder::derivativeFilterRatio)
                .use(Combinators.combine(Draws.between(0.0, 1.0), Draws.between(0.0, 1.0))
                        .as((b, c) -> new double[] {b, c})).in((b, w) -> b.setpointWeights(w[0], w[1]))
                .use(Arbitraries.of(IntegralMethod.values())).in(ControllerSettings.Builder::integralMethod)
                .use(Arbitraries.of(Action.values())).in(ControllerSettings.Builder::action);
    }

    /** Linear settings (no limit, no windup case arises) with these gains, in the form given. */
    static Arbitrary<ControllerSettings> linear(Arbitrary<? extends PidGains> gains) {
        return linearParts(gains).build().flatMap(b -> withDerivativeMethod(b.build()));
    }

    /** Linear settings with gains in any form. */
    static Arbitrary<ControllerSettings> linear() {
        return linear(gains());
    }

    /** Everything an industrial configuration may switch on, within an ordinary output range. */
    static Arbitrary<ControllerSettings> industrial() {
        return full(ordinaryRanges());
    }

    /** Everything an industrial configuration may switch on; the range may reach the ends of the double range. */
    static Arbitrary<ControllerSettings> settings() {
        return full(extremeRanges());
    }

    private static Arbitrary<ControllerSettings> full(Arbitrary<double[]> ranges) {
        Arbitrary<ControllerSettings.Builder> built = linearParts(gains())
                .use(ranges).in((b, r) -> b.outputRange(r[0], r[1]))
                .use(Arbitraries.of(WindupProtection.values())).in(ControllerSettings.Builder::windupProtection)
                .use(Arbitraries.of(OutputKind.values())).in(ControllerSettings.Builder::outputKind)
                .use(logUniform(0.1, 1000.0)).withProbability(0.5).in(ControllerSettings.Builder::outputSlewPerSecond)
                .use(logUniform(0.1, 100.0)).withProbability(0.25).in(ControllerSettings.Builder::setpointSlewPerSecond)
                .use(Draws.between(0.0, 0.5)).withProbability(0.25)
                .in(ControllerSettings.Builder::errorDeadband)
                .use(logUniform(0.01, 100.0)).withProbability(0.5).in(ControllerSettings.Builder::trackingTimeSeconds)
                // a circular process variable takes b = 1 (b·r has no meaning on a circle)
                .use(Draws.between(0.0, 1.0)).withProbability(1.0 / 6.0)
                .in((b, c) -> b.wrapSpan(360.0).setpointWeights(1.0, c))
                .build();
        return built.flatMap(b -> {
            ControllerSettings s = b.build();
            return Combinators.combine(Arbitraries.of(FaultPolicy.values()), Draws.between(0.0, 1.0))
                    .as((policy, at) -> s.toBuilder().faultPolicy(policy, safeOutput(s, at)).build())
                    .flatMap(SettingsArbitraries::withDerivativeMethod);
        });
    }

    /**
     * The settings with any derivative method that can run at their period: forward Euler only
     * where h &lt; 2·Tf. Decided from the settings' own filter time, not by catching the validation
     * error, so that a validation regression fails the property instead of being replaced quietly.
     */
    static Arbitrary<ControllerSettings> withDerivativeMethod(ControllerSettings s) {
        return Arbitraries.of(DerivativeMethod.values())
                .filter(m -> m.isStable(s.samplePeriodSeconds(), s.derivativeFilterTimeSeconds()))
                .map(m -> s.toBuilder().derivativeMethod(m).build());
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
