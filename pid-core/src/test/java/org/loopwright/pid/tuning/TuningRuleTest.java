package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.IdealGains;

/**
 * Every rule against values worked by hand from its paper's formulas (as recalled from memory;
 * see {@link TuningRule}), on two models each. Model A: K = 2, T = 10 s, L = 1 s (L/T = 0.1).
 * Model B: K = 0.5, T = 4 s, L = 2 s (L/T = 0.5). Ultimate points U1: Ku = 8, Pu = 2π/√3 = 3.6275987 s
 * (1/(s+1)³, analytic phase crossover) and U2: Ku = 2.5, Pu = 20 s.
 */
class TuningRuleTest {

    private static final FopdtModel A = new FopdtModel(2.0, 10.0, 1.0);
    private static final FopdtModel B = new FopdtModel(0.5, 4.0, 2.0);
    private static final FopdtModel DELAY_DOMINANT = new FopdtModel(1.0, 1.0, 2.0);
    private static final UltimatePoint U1 = new UltimatePoint(8.0, 2.0 * Math.PI / Math.sqrt(3.0));
    private static final UltimatePoint U2 = new UltimatePoint(2.5, 20.0);
    private static final double NO_PARAMETER = Double.NaN;

    static Stream<Arguments> modelCases() {
        return Stream.of(
                // SIMC (Skogestad 2003): Kc = T/(K(τc+L)), Ti = min(T, 4(τc+L)).
                // A, τc = L = 1: Kc = 10/(2·2) = 2.5; Ti = min(10, 8) = 8.
                Arguments.of(ModelRule.SIMC, A, ControllerType.PI, NO_PARAMETER, 2.5, 8.0, 0.0),
                // B, τc = L = 2: Kc = 4/(0.5·4) = 2.0; Ti = min(4, 16) = 4.
                Arguments.of(ModelRule.SIMC, B, ControllerType.PI, NO_PARAMETER, 2.0, 4.0, 0.0),
                // A, τc = 3: Kc = 10/(2·4) = 1.25; Ti = min(10, 16) = 10.
                Arguments.of(ModelRule.SIMC, A, ControllerType.PI, 3.0, 1.25, 10.0, 0.0),
                // AMIGO PI (Åström & Hägglund 2004): Kc = 0.15/K + (0.35 − LT/(L+T)²)·T/(KL),
                // Ti = 0.35L + 13LT²/(T² + 12LT + 7L²).
                // A: LT/(L+T)² = 10/121 = 0.0826446; Kc = 0.075 + 0.2673554·5 = 1.4117769;
                //    Ti = 0.35 + 1300/227 = 6.0768722.
                Arguments.of(ModelRule.AMIGO, A, ControllerType.PI, NO_PARAMETER, 1.4117769, 6.0768722, 0.0),
                // B: LT/(L+T)² = 8/36 = 0.2222222; Kc = 0.3 + 0.1277778·4 = 0.8111111;
                //    Ti = 0.7 + 416/140 = 3.6714286.
                Arguments.of(ModelRule.AMIGO, B, ControllerType.PI, NO_PARAMETER, 0.8111111, 3.6714286, 0.0),
                // AMIGO PID: Kc = (0.2 + 0.45T/L)/K, Ti = (0.4L + 0.8T)/(L + 0.1T)·L, Td = 0.5LT/(0.3L + T).
                // A: Kc = 4.7/2 = 2.35; Ti = 8.4/2 = 4.2; Td = 5/10.3 = 0.4854369.
                Arguments.of(ModelRule.AMIGO, A, ControllerType.PID, NO_PARAMETER, 2.35, 4.2, 0.4854369),
                // B: Kc = 1.1/0.5 = 2.2; Ti = 4/2.4·2 = 3.3333333; Td = 4/4.6 = 0.8695652.
                Arguments.of(ModelRule.AMIGO, B, ControllerType.PID, NO_PARAMETER, 2.2, 3.3333333, 0.8695652),
                // Lambda PI (Rivera, Morari & Skogestad 1986): Kc = (2T + L)/(2Kλ), Ti = T + L/2.
                // A, default λ = max(T, 1.7L) = 10: Kc = 21/40 = 0.525; Ti = 10.5.
                Arguments.of(ModelRule.LAMBDA, A, ControllerType.PI, NO_PARAMETER, 0.525, 10.5, 0.0),
                // B, default λ = max(4, 3.4) = 4: Kc = 10/4 = 2.5; Ti = 5.
                Arguments.of(ModelRule.LAMBDA, B, ControllerType.PI, NO_PARAMETER, 2.5, 5.0, 0.0),
                // delay-dominant, default λ = max(1, 3.4) = 3.4: Kc = 4/6.8 = 0.5882353; Ti = 2.
                Arguments.of(ModelRule.LAMBDA, DELAY_DOMINANT, ControllerType.PI, NO_PARAMETER, 0.5882353, 2.0, 0.0),
                // Lambda PID: Kc = (2T + L)/(2K(λ + L)), Ti = T + L/2, Td = TL/(2T + L).
                // A, default λ = max(10, 0.8) = 10: Kc = 21/44 = 0.4772727; Ti = 10.5; Td = 10/21 = 0.4761905.
                Arguments.of(ModelRule.LAMBDA, A, ControllerType.PID, NO_PARAMETER, 0.4772727, 10.5, 0.4761905),
                // B, λ = 4: Kc = 10/6 = 1.6666667; Ti = 5; Td = 8/10 = 0.8.
                Arguments.of(ModelRule.LAMBDA, B, ControllerType.PID, 4.0, 1.6666667, 5.0, 0.8),
                // Ziegler–Nichols step response (1942), a = KL/T: PI 0.9/a, 3L; PID 1.2/a, 2L, L/2.
                // A: a = 0.2: PI Kc = 4.5, Ti = 3; PID Kc = 6, Ti = 2, Td = 0.5.
                Arguments.of(ModelRule.ZIEGLER_NICHOLS_STEP, A, ControllerType.PI, NO_PARAMETER, 4.5, 3.0, 0.0),
                Arguments.of(ModelRule.ZIEGLER_NICHOLS_STEP, A, ControllerType.PID, NO_PARAMETER, 6.0, 2.0, 0.5),
                // B: a = 0.25: PI Kc = 3.6, Ti = 6; PID Kc = 4.8, Ti = 4, Td = 1.
                Arguments.of(ModelRule.ZIEGLER_NICHOLS_STEP, B, ControllerType.PI, NO_PARAMETER, 3.6, 6.0, 0.0),
                Arguments.of(ModelRule.ZIEGLER_NICHOLS_STEP, B, ControllerType.PID, NO_PARAMETER, 4.8, 4.0, 1.0),
                // Cohen–Coon (1953), r = L/T: PI Kc = (T/KL)(0.9 + r/12), Ti = L(30 + 3r)/(9 + 20r);
                // PID Kc = (T/KL)(4/3 + r/4), Ti = L(32 + 6r)/(13 + 8r), Td = 4L/(11 + 2r).
                // A: r = 0.1, T/KL = 5: PI Kc = 5·0.9083333 = 4.5416667, Ti = 30.3/11 = 2.7545455;
                //    PID Kc = 5·1.3583333 = 6.7916667, Ti = 32.6/13.8 = 2.3623188, Td = 4/11.2 = 0.3571429.
                Arguments.of(ModelRule.COHEN_COON, A, ControllerType.PI, NO_PARAMETER, 4.5416667, 2.7545455, 0.0),
                Arguments.of(ModelRule.COHEN_COON, A, ControllerType.PID, NO_PARAMETER, 6.7916667, 2.3623188, 0.3571429),
                // B: r = 0.5, T/KL = 4: PI Kc = 4·0.9416667 = 3.7666667, Ti = 63/19 = 3.3157895;
                //    PID Kc = 4·1.4583333 = 5.8333333, Ti = 70/17 = 4.1176471, Td = 8/12 = 0.6666667.
                Arguments.of(ModelRule.COHEN_COON, B, ControllerType.PI, NO_PARAMETER, 3.7666667, 3.3157895, 0.0),
                Arguments.of(ModelRule.COHEN_COON, B, ControllerType.PID, NO_PARAMETER, 5.8333333, 4.1176471, 0.6666667));
    }

    @ParameterizedTest(name = "{0} {2} on {1}")
    @MethodSource("modelCases")
    void modelRuleGivesHandWorkedSettings(ModelRule rule, FopdtModel model, ControllerType type,
                                          double closedLoopTime, double gain, double integralTime,
                                          double derivativeTime) {
        TuningResult result = rule.tune(model, type, closedLoopTime);

        assertThat(result).isInstanceOf(TunedGains.class);
        IdealGains gains = ((TunedGains) result).gains();
        assertThat(gains.gain()).isCloseTo(gain, within(1e-6));
        assertThat(gains.integralTime()).isCloseTo(integralTime, within(1e-6));
        assertThat(gains.derivativeTime()).isCloseTo(derivativeTime, within(1e-6));
        assertThat(result.citation()).isEqualTo(rule.citation()).isNotBlank();
    }

    static Stream<Arguments> ultimateCases() {
        double pu = 2.0 * Math.PI / Math.sqrt(3.0);
        return Stream.of(
                // Ziegler–Nichols ultimate (1942): PI 0.45Ku, Pu/1.2; PID 0.6Ku, Pu/2, Pu/8.
                // U1: PI Kc = 3.6, Ti = 3.6275987/1.2 = 3.0229989; PID Kc = 4.8, Ti = 1.8137994, Td = 0.4534498.
                Arguments.of(UltimatePointRule.ZIEGLER_NICHOLS, U1, ControllerType.PI, 3.6, 3.0229989, 0.0),
                Arguments.of(UltimatePointRule.ZIEGLER_NICHOLS, U1, ControllerType.PID, 4.8, 1.8137994, 0.4534498),
                // U2: PI Kc = 1.125, Ti = 16.6666667; PID Kc = 1.5, Ti = 10, Td = 2.5.
                Arguments.of(UltimatePointRule.ZIEGLER_NICHOLS, U2, ControllerType.PI, 1.125, 16.6666667, 0.0),
                Arguments.of(UltimatePointRule.ZIEGLER_NICHOLS, U2, ControllerType.PID, 1.5, 10.0, 2.5),
                // Tyreus–Luyben (1992): PI Ku/3.2, 2.2Pu; PID Ku/2.2, 2.2Pu, Pu/6.3.
                // U1: PI Kc = 2.5, Ti = 7.9807172; PID Kc = 3.6363636, Ti = 7.9807172, Td = 0.5758093.
                Arguments.of(UltimatePointRule.TYREUS_LUYBEN, U1, ControllerType.PI, 2.5, 2.2 * pu, 0.0),
                Arguments.of(UltimatePointRule.TYREUS_LUYBEN, U1, ControllerType.PID, 3.6363636, 7.9807172, 0.5758093),
                // U2: PI Kc = 0.78125, Ti = 44; PID Kc = 1.1363636, Ti = 44, Td = 3.1746032.
                Arguments.of(UltimatePointRule.TYREUS_LUYBEN, U2, ControllerType.PI, 0.78125, 44.0, 0.0),
                Arguments.of(UltimatePointRule.TYREUS_LUYBEN, U2, ControllerType.PID, 1.1363636, 44.0, 3.1746032));
    }

    @ParameterizedTest(name = "{0} {2} on {1}")
    @MethodSource("ultimateCases")
    void ultimateRuleGivesHandWorkedSettings(UltimatePointRule rule, UltimatePoint point, ControllerType type,
                                             double gain, double integralTime, double derivativeTime) {
        TuningResult result = rule.tune(point, type);

        assertThat(result).isInstanceOf(TunedGains.class);
        IdealGains gains = ((TunedGains) result).gains();
        assertThat(gains.gain()).isCloseTo(gain, within(1e-6));
        assertThat(gains.integralTime()).isCloseTo(integralTime, within(1e-6));
        assertThat(gains.derivativeTime()).isCloseTo(derivativeTime, within(1e-6));
    }

    static Stream<Arguments> notApplicableCases() {
        FopdtModel noDelay = new FopdtModel(1.0, 5.0, 0.0);
        return Stream.of(
                Arguments.of(ModelRule.SIMC, A, ControllerType.PID, NO_PARAMETER,
                        "SIMC gives derivative action only for a second-order model (Td = tau2); a first-order"
                                + " model has no second time constant: use PI"),
                Arguments.of(ModelRule.SIMC, noDelay, ControllerType.PI, NO_PARAMETER,
                        "the default closed-loop time constant tau_c = L is 0 because the dead time is 0:"
                                + " give a closed-loop time constant"),
                Arguments.of(ModelRule.AMIGO, noDelay, ControllerType.PI, NO_PARAMETER,
                        "AMIGO needs a dead time L > 0: L=0.0"),
                Arguments.of(ModelRule.LAMBDA, B, ControllerType.PI, 3.0,
                        "lambda must be >= 1.700 * L for the PI rule: lambda=3.000, L=2.000"),
                Arguments.of(ModelRule.LAMBDA, B, ControllerType.PID, 1.5,
                        "lambda must be >= 0.8000 * L for the PID rule: lambda=1.500, L=2.000"),
                Arguments.of(ModelRule.ZIEGLER_NICHOLS_STEP, DELAY_DOMINANT, ControllerType.PI, NO_PARAMETER,
                        "the process is delay-dominant, outside ziegler-nichols's range L/T <= 1.000: L/T=2.000"),
                Arguments.of(ModelRule.COHEN_COON, DELAY_DOMINANT, ControllerType.PID, NO_PARAMETER,
                        "the process is delay-dominant, outside cohen-coon's range L/T <= 1.000: L/T=2.000"),
                Arguments.of(ModelRule.COHEN_COON, noDelay, ControllerType.PI, NO_PARAMETER,
                        "cohen-coon needs a dead time L > 0: L=0.0"));
    }

    @ParameterizedTest(name = "{0} {2} on {1}")
    @MethodSource("notApplicableCases")
    void ruleOutsideItsRangeSaysWhy(ModelRule rule, FopdtModel model, ControllerType type, double closedLoopTime,
                                    String reason) {
        TuningResult result = rule.tune(model, type, closedLoopTime);

        assertThat(result).isEqualTo(new RuleNotApplicable(rule, type, reason));
        assertThat(result.citation()).isEqualTo(rule.citation());
    }

    @Test
    void zieglerNicholsStepPiSaysWhichIntegralTimeItUses() {
        // the 1942 paper's reset rate gives Ti ≈ 3.33·L, later tables print 3·L (from memory): the setting
        // must say that it uses 3·L
        TunedGains pi = (TunedGains) ModelRule.ZIEGLER_NICHOLS_STEP.tune(A, ControllerType.PI);
        assertThat(pi.gains().integralTime()).isEqualTo(3.0 * A.deadTimeSeconds());
        assertThat(pi.note()).contains("Ti = 3L").contains("1942").contains("3.33L");
    }

    @Test
    void negativeProcessGainTunesOnItsMagnitude() {
        // a cooler: the same magnitude gives the same gains; the controller takes direct action
        TuningResult cooling = ModelRule.SIMC.tune(new FopdtModel(-2.0, 10.0, 1.0), ControllerType.PI);
        assertThat(((TunedGains) cooling).gains()).isEqualTo(IdealGains.pi(2.5, 8.0));
    }

    static Stream<Arguments> invalidModels() {
        return Stream.of(
                Arguments.of(0.0, 1.0, 1.0, "processGain must be finite and non-zero: processGain=0.0"),
                Arguments.of(Double.NaN, 1.0, 1.0, "processGain must be finite and non-zero: processGain=NaN"),
                Arguments.of(1.0, 0.0, 1.0, "timeConstantSeconds must be finite and > 0: timeConstantSeconds=0.0"),
                Arguments.of(1.0, 1.0, -1.0, "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=-1.0"),
                Arguments.of(1.0, 1.0, Double.POSITIVE_INFINITY,
                        "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=Infinity"));
    }

    @ParameterizedTest
    @MethodSource("invalidModels")
    void invalidModelIsRejectedWithItsField(double k, double t, double l, String message) {
        assertThatThrownBy(() -> new FopdtModel(k, t, l)).isInstanceOf(InvalidSettingException.class)
                .hasMessage(message);
    }

    @Test
    void invalidUltimatePointAndClosedLoopTimeAreRejected() {
        assertThatThrownBy(() -> new UltimatePoint(-1.0, 2.0)).hasMessage(
                "ultimateGain must be finite and > 0: ultimateGain=-1.0");
        assertThatThrownBy(() -> new UltimatePoint(1.0, 0.0)).hasMessage(
                "ultimatePeriodSeconds must be finite and > 0: ultimatePeriodSeconds=0.0");
        assertThatThrownBy(() -> ModelRule.SIMC.tune(A, ControllerType.PI, -1.0)).hasMessage(
                "closedLoopTimeSeconds must be finite and > 0 (NaN for the rule's default): closedLoopTimeSeconds=-1.0");
    }
}
