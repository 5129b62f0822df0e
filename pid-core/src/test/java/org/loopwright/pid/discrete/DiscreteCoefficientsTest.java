package org.loopwright.pid.discrete;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The coefficients of every method against Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i>
 * (3rd ed., 1997), ch. 8, §8.6 "Digital PID-controllers", worked by hand for K = 2, Ti = 30 s,
 * Td = 5 s, N = 10 (Tf = 0.5 s), h = 0.1 s. The book writes the derivative as
 * D(k) = ad·D(k−1) − bd·(y(k) − y(k−1)) and the integral step as bi·e; its table of ad, bd and bi
 * for forward differences, backward differences, Tustin and ramp invariance is quoted from memory.
 * The step-invariant (zero-order-hold) row is not in that table; it is derived here by hand from
 * H(z) = (1 − z⁻¹)·Z{step response} (A&amp;W 1997, §2.3 and §8.2).
 */
class DiscreteCoefficientsTest {

    private static final double K = 2.0;
    private static final double TI = 30.0;
    private static final double TD = 5.0;
    private static final double N = 10.0;
    private static final double H = 0.1;
    private static final double KD = K * TD;
    private static final double TF = TD / N;

    static Stream<Arguments> derivativeTable() {
        double nhOverTd = N * H / TD; // 0.2
        return Stream.of(
                // forward differences: ad = 1 − Nh/Td = 0.8, bd = K·N = 20
                Arguments.of(DerivativeMethod.FORWARD_EULER, 1.0 - nhOverTd, K * N),
                // backward differences: ad = Td/(Td + Nh) = 5/6, bd = K·Td·N/(Td + Nh) = 100/6
                Arguments.of(DerivativeMethod.BACKWARD_EULER, 5.0 / 6.0, 100.0 / 6.0),
                // Tustin: ad = (2Td − Nh)/(2Td + Nh) = 9/11, bd = 2K·Td·N/(2Td + Nh) = 200/11
                Arguments.of(DerivativeMethod.TUSTIN, 9.0 / 11.0, 200.0 / 11.0),
                // ramp invariance: ad = e^(−Nh/Td) = e^(−0.2), bd = K·Td·(1 − ad)/h = 100·(1 − e^(−0.2))
                Arguments.of(DerivativeMethod.RAMP_INVARIANT, Math.exp(-0.2), 100.0 * (1.0 - Math.exp(-0.2))),
                // step invariance, by hand: the step response of K·Td·s/(1 + s·Tf) is K·N·e^(−t/Tf), so
                // H(z) = K·N·(1 − z⁻¹)/(1 − e^(−h/Tf)·z⁻¹): ad = e^(−0.2), bd = K·N = 20
                Arguments.of(DerivativeMethod.STEP_INVARIANT, Math.exp(-0.2), K * N));
    }

    @ParameterizedTest
    @MethodSource("derivativeTable")
    void derivativeCoefficientsMatchTheBook(DerivativeMethod method, double ad, double bd) {
        assertThat(method.pole(H, TF)).isCloseTo(ad, within(1e-14));
        assertThat(method.gain(KD, H, TF)).isCloseTo(bd, within(1e-12));
        DiscretePid d = DiscretePid.of(K, K / TI, KD, TF, IntegralMethod.TUSTIN, method, H);
        assertThat(d.derivativePole()).isEqualTo(method.pole(H, TF));
        assertThat(d.derivativeGain()).isEqualTo(method.gain(KD, H, TF));
        assertThat(d.proportionalGain()).isEqualTo(K);
        assertThat(d.periodSeconds()).isEqualTo(H);
    }

    @Test
    void integralWeightsMatchTheBook() {
        // A&W 1997 §8.6: forward differences bi = K·h/Ti on e(k−1) (the book updates I after the output),
        // backward differences K·h/Ti on e(k), Tustin K·h/(2Ti) on each.
        double khOverTi = K * H / TI;
        assertThat(IntegralMethod.FORWARD_EULER.weightOnPrevious(K / TI, H)).isCloseTo(khOverTi, within(1e-16));
        assertThat(IntegralMethod.FORWARD_EULER.weightOnCurrent(K / TI, H)).isZero();
        assertThat(IntegralMethod.BACKWARD_EULER.weightOnCurrent(K / TI, H)).isCloseTo(khOverTi, within(1e-16));
        assertThat(IntegralMethod.BACKWARD_EULER.weightOnPrevious(K / TI, H)).isZero();
        assertThat(IntegralMethod.TUSTIN.weightOnCurrent(K / TI, H)).isCloseTo(khOverTi / 2.0, within(1e-16));
        assertThat(IntegralMethod.TUSTIN.weightOnPrevious(K / TI, H)).isCloseTo(khOverTi / 2.0, within(1e-16));
    }

    @ParameterizedTest
    @EnumSource(DerivativeMethod.class)
    void noDerivativeActionGivesZeroCoefficients(DerivativeMethod method) {
        DiscretePid d = DiscretePid.of(K, K / TI, 0.0, 0.0, IntegralMethod.BACKWARD_EULER, method, H);
        assertThat(d.derivativePole()).isZero();
        assertThat(d.derivativeGain()).isZero();
    }

    @Test
    void forwardEulerDerivativeIsStableOnlyBelowTwiceTheFilterTime() {
        // |1 − h/Tf| < 1 exactly when 0 < h < 2·Tf (A&W 1997 §8.6)
        assertThat(DerivativeMethod.FORWARD_EULER.isStable(0.99, 0.5)).isTrue();
        assertThat(DerivativeMethod.FORWARD_EULER.isStable(1.0, 0.5)).isFalse();
        for (DerivativeMethod m : DerivativeMethod.values()) {
            if (m != DerivativeMethod.FORWARD_EULER) {
                assertThat(m.isStable(100.0, 0.5)).isTrue();
                assertThat(Math.abs(m.pole(100.0, 0.5))).isLessThan(1.0);
            }
        }
    }
}
