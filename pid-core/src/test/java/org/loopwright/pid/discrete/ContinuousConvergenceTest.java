package org.loopwright.pid.discrete;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.form.ParallelGains;

/**
 * The discrete terms converge to the analytic continuous response as h shrinks, at the order of
 * their method. Input e(t) = sin t from t = 0 (setpoint r = sin t, measurement 0, c = 1 so the
 * derivative acts on e). The continuous terms, solved by hand:
 * <pre>
 *   I(t) = Ki·∫₀ᵗ sin τ dτ = Ki·(1 − cos t)
 *   Tf·D' + D = Kd·cos t, D(0) = 0  ⇒  D(t) = Kd/(1 + Tf²)·(cos t + Tf·sin t − e^(−t/Tf))
 * </pre>
 * (check: D + Tf·D' = Kd/(1 + Tf²)·(cos t + Tf² cos t) = Kd·cos t). The starting rule (every state 0
 * at t = 0) matches these initial conditions. The order is measured from the largest error over
 * t ∈ [0, 4] at h, h/2 and h/4: log₂(err(h)/err(h/2)). Expected (Åström &amp; Wittenmark 1997, §8.2,
 * from memory, and the Taylor expansion of each rule): 1 for the Euler rules and for step invariance,
 * 2 for Tustin and for ramp invariance (exact for inputs linear between samples).
 */
class ContinuousConvergenceTest {

    private static final double KI = 0.7;
    private static final double KD = 1.3;
    private static final double TF = 0.5;
    private static final double END = 4.0;

    private static double integral(double t) {
        return KI * (1.0 - Math.cos(t));
    }

    private static double derivative(double t) {
        return KD / (1.0 + TF * TF) * (Math.cos(t) + TF * Math.sin(t) - Math.exp(-t / TF));
    }

    private interface Term {
        double of(PidController c);
    }

    private static double maxError(ControllerSettings s, double h, Term term,
            java.util.function.DoubleUnaryOperator exact) {
        PidController c = new PidController(s);
        double worst = 0.0;
        int steps = (int) Math.round(END / h);
        for (int k = 0; k <= steps; k++) {
            double t = k * h;
            c.update(Math.sin(t), 0.0);
            worst = Math.max(worst, Math.abs(term.of(c) - exact.applyAsDouble(t)));
        }
        return worst;
    }

    private static double[] orders(java.util.function.DoubleFunction<ControllerSettings> settingsAtPeriod, Term term,
            java.util.function.DoubleUnaryOperator exact) {
        double h = 0.04;
        double e1 = maxError(settingsAtPeriod.apply(h), h, term, exact);
        double e2 = maxError(settingsAtPeriod.apply(h / 2), h / 2, term, exact);
        double e4 = maxError(settingsAtPeriod.apply(h / 4), h / 4, term, exact);
        return new double[] {Math.log(e1 / e2) / Math.log(2.0), Math.log(e2 / e4) / Math.log(2.0)};
    }

    private static void assertOrder(double[] measured, double expected) {
        for (double order : measured) {
            assertThat(order).isBetween(expected - 0.1, expected + 0.1);
        }
    }

    @ParameterizedTest
    @EnumSource(IntegralMethod.class)
    void integralConvergesAtTheOrderOfItsMethod(IntegralMethod method) {
        double[] measured = orders(h -> ControllerSettings.builder().gains(new ParallelGains(0.0, KI, 0.0))
                .samplePeriodSeconds(h).integralMethod(method).build(), PidController::integralTerm,
                ContinuousConvergenceTest::integral);
        assertOrder(measured, method == IntegralMethod.TUSTIN ? 2.0 : 1.0);
    }

    @ParameterizedTest
    @EnumSource(DerivativeMethod.class)
    void derivativeConvergesAtTheOrderOfItsMethod(DerivativeMethod method) {
        double[] measured = orders(h -> ControllerSettings.builder().gains(new ParallelGains(0.0, 0.0, KD))
                .derivativeFilterTimeSeconds(TF).setpointWeights(1.0, 1.0).samplePeriodSeconds(h)
                .derivativeMethod(method).build(), PidController::derivativeTerm, ContinuousConvergenceTest::derivative);
        boolean secondOrder = method == DerivativeMethod.TUSTIN || method == DerivativeMethod.RAMP_INVARIANT;
        assertOrder(measured, secondOrder ? 2.0 : 1.0);
    }

    @ParameterizedTest
    @EnumSource(IntegralMethod.class)
    void wholeOutputConvergesToTheContinuousPid(IntegralMethod integral) {
        // the same method for both terms where it exists; proportional part Kp·sin t is exact
        DerivativeMethod derivative = switch (integral) {
            case FORWARD_EULER -> DerivativeMethod.FORWARD_EULER;
            case BACKWARD_EULER -> DerivativeMethod.BACKWARD_EULER;
            case TUSTIN -> DerivativeMethod.TUSTIN;
        };
        double kp = 2.0;
        double[] measured = orders(h -> ControllerSettings.builder().gains(new ParallelGains(kp, KI, KD))
                .derivativeFilterTimeSeconds(TF).setpointWeights(1.0, 1.0).samplePeriodSeconds(h)
                .integralMethod(integral).derivativeMethod(derivative).build(), PidController::output,
                t -> kp * Math.sin(t) + integral(t) + derivative(t));
        assertOrder(measured, integral == IntegralMethod.TUSTIN ? 2.0 : 1.0);
    }
}
