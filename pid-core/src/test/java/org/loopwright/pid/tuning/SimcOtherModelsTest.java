package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.form.IdealGains;

/**
 * SIMC's second-order and integrating rules against values worked by hand from the formulas of
 * Skogestad, "Simple analytic rules for model reduction and PID controller tuning", J. Process
 * Control 13 (2003), as recalled from memory (see {@link ModelRule#SIMC}); the PID rules are in
 * series form there and are compared here after the exact series-to-ideal conversion
 * Kc = Kc'(1 + Td'/Ti'), Ti = Ti' + Td', Td = Ti'·Td'/(Ti' + Td') (Åström &amp; Hägglund 2006, eq. 3.9).
 */
class SimcOtherModelsTest {

    private static final SopdtModel SECOND_ORDER = new SopdtModel(2.0, 10.0, 3.0, 1.0);
    private static final IntegratingModel LEVEL = new IntegratingModel(0.1, 0.0, 2.0);
    private static final IntegratingModel LEVEL_WITH_LAG = new IntegratingModel(0.1, 4.0, 2.0);
    private static final double DEFAULT = Double.NaN;

    static Stream<Arguments> cases() {
        return Stream.of(
                // SOPDT PID, tau_c = L = 1: Kc' = 10/(2*2) = 2.5, Ti' = min(10, 8) = 8, Td' = T2 = 3;
                // ideal: Kc = 2.5*(1 + 3/8) = 3.4375, Ti = 11, Td = 24/11 = 2.1818182.
                Arguments.of(SECOND_ORDER, ControllerType.PID, DEFAULT, 3.4375, 11.0, 24.0 / 11.0),
                // SOPDT PI, half rule T = 10 + 1.5 = 11.5, L = 1 + 1.5 = 2.5, tau_c = 2.5:
                // Kc = 11.5/(2*5) = 1.15, Ti = min(11.5, 20) = 11.5.
                Arguments.of(SECOND_ORDER, ControllerType.PI, DEFAULT, 1.15, 11.5, 0.0),
                // SOPDT PID with tau_c = 3: Kc' = 10/(2*4) = 1.25, Ti' = min(10, 16) = 10, Td' = 3;
                // ideal: Kc = 1.25*1.3 = 1.625, Ti = 13, Td = 30/13.
                Arguments.of(SECOND_ORDER, ControllerType.PID, 3.0, 1.625, 13.0, 30.0 / 13.0),
                // integrating PI, K = 0.1, L = 2, tau_c = 2: Kc = 1/(0.1*4) = 2.5, Ti = 4*4 = 16.
                Arguments.of(LEVEL, ControllerType.PI, DEFAULT, 2.5, 16.0, 0.0),
                // integrating with lag T = 4, PID, tau_c = L = 2: Kc' = 2.5, Ti' = 16, Td' = 4;
                // ideal: Kc = 2.5*(1 + 4/16) = 3.125, Ti = 20, Td = 64/20 = 3.2.
                Arguments.of(LEVEL_WITH_LAG, ControllerType.PID, DEFAULT, 3.125, 20.0, 3.2),
                // integrating with lag, PI on L = 2 + 4/2 = 4 (half rule), tau_c = 4:
                // Kc = 1/(0.1*8) = 1.25, Ti = 32.
                Arguments.of(LEVEL_WITH_LAG, ControllerType.PI, DEFAULT, 1.25, 32.0, 0.0));
    }

    @ParameterizedTest(name = "{1} on {0}, tau_c {2}")
    @MethodSource("cases")
    void simcGivesHandWorkedSettings(ProcessModel model, ControllerType type, double tauC, double gain,
            double integralTime, double derivativeTime) {
        TuningResult result = ModelRule.SIMC.tune(model, type, tauC);

        assertThat(result).isInstanceOf(TunedGains.class);
        IdealGains gains = ((TunedGains) result).gains();
        assertThat(gains.gain()).isCloseTo(gain, within(1e-9));
        assertThat(gains.integralTime()).isCloseTo(integralTime, within(1e-9));
        assertThat(gains.derivativeTime()).isCloseTo(derivativeTime, within(1e-9));
    }

    @ParameterizedTest
    @EnumSource(ControllerType.class)
    void simcTunesACoolerOnTheMagnitudeOfItsGain(ControllerType type) {
        TunedGains heater = (TunedGains) ModelRule.SIMC.tune(LEVEL_WITH_LAG, type);
        TunedGains cooler = (TunedGains) ModelRule.SIMC.tune(new IntegratingModel(-0.1, 4.0, 2.0), type);
        assertThat(cooler.gains()).isEqualTo(heater.gains());
    }

    @org.junit.jupiter.api.Test
    void simcGivesNoDerivativeForAPureIntegrator() {
        assertThat(ModelRule.SIMC.tune(LEVEL, ControllerType.PID)).isEqualTo(new RuleNotApplicable(ModelRule.SIMC,
                ControllerType.PID, "SIMC gives derivative action for an integrating process only with a lag"
                        + " (Td = T); a pure integrator has none: use PI"));
    }

    @ParameterizedTest
    @EnumSource(value = ModelRule.class, names = {"AMIGO", "LAMBDA", "ZIEGLER_NICHOLS_STEP", "COHEN_COON"})
    void otherRulesSayTheirPaperHasNoSuchModel(ModelRule rule) {
        assertThat(rule.tune(SECOND_ORDER, ControllerType.PI)).isEqualTo(new RuleNotApplicable(rule,
                ControllerType.PI, rule.name() + "'s paper gives a rule for a first-order model with dead time,"
                        + " not a second-order one: reduce the model (Skogestad's half rule) or use simc"));
        assertThat(rule.tune(LEVEL, ControllerType.PI)).isEqualTo(new RuleNotApplicable(rule, ControllerType.PI,
                rule.name() + "'s rule here is for a self-regulating first-order model with dead time, not an"
                        + " integrating process: use simc"));
    }
}
