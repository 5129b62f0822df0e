package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.InvalidSettingException;

/**
 * The notes and reasons a tuning rule gives beside its gains, which users read: which closed-loop
 * time it used and whether by default, the half-rule model it tuned on, and why a rule does not
 * apply (issue 11: the mutation run found these unpinned). Figures are the rules' own, worked by
 * hand: SIMC's default τc = L and the half rule T1 + T2/2, L + T2/2 (Skogestad 2003), lambda
 * tuning's default λ = max(T, 1.7·L) for PI (this project's documented default). Numbers print
 * with four significant digits.
 */
class TuningNotesTest {

    @Test
    void simcSaysWhetherTauCIsTheDefault() {
        FopdtModel model = new FopdtModel(2.0, 10.0, 1.0);
        assertThat(((TunedGains) ModelRule.SIMC.tune(model, ControllerType.PI)).note())
                .isEqualTo("tau_c = 1.000 s (= L)");
        assertThat(((TunedGains) ModelRule.SIMC.tune(model, ControllerType.PI, 3.0)).note())
                .isEqualTo("tau_c = 3.000 s");
    }

    @Test
    void simcPiOnASecondOrderModelNamesTheHalfRuleModel() {
        // 0.8·e^(−4s)/((90s + 1)(12s + 1)): T = 90 + 6 = 96 s, L = 4 + 6 = 10 s, τc = L = 10 s
        TunedGains pi = (TunedGains) ModelRule.SIMC.tune(new SopdtModel(0.8, 90.0, 12.0, 4.0), ControllerType.PI);
        assertThat(pi.note()).isEqualTo("tau_c = 10.00 s (= L); half rule: T = 96.00 s, L = 10.00 s");
    }

    @Test
    void simcWithoutDeadTimeAsksForAClosedLoopTime() {
        String reason = "the default closed-loop time constant tau_c = L is 0 because the dead time is 0:"
                + " give a closed-loop time constant";
        assertThat(ModelRule.SIMC.tune(new SopdtModel(1.0, 10.0, 2.0, 0.0), ControllerType.PID))
                .isEqualTo(new RuleNotApplicable(ModelRule.SIMC, ControllerType.PID, reason));
        assertThat(ModelRule.SIMC.tune(new IntegratingModel(1.0, 0.0, 0.0), ControllerType.PI))
                .isEqualTo(new RuleNotApplicable(ModelRule.SIMC, ControllerType.PI, reason));
    }

    @Test
    void simcPiOnAnIntegratingProcessMentionsTheHalfRuleOnlyWithALag() {
        // no lag: the dead time itself, 2 s; a lag of 4 s adds half of it, L = 2 + 2 = 4 s
        assertThat(((TunedGains) ModelRule.SIMC.tune(new IntegratingModel(0.5, 0.0, 2.0), ControllerType.PI)).note())
                .isEqualTo("tau_c = 2.000 s (= L)");
        assertThat(((TunedGains) ModelRule.SIMC.tune(new IntegratingModel(0.5, 4.0, 2.0), ControllerType.PI)).note())
                .isEqualTo("tau_c = 4.000 s (= L); half rule: L = 4.000 s");
    }

    @Test
    void lambdaTuningSaysWhetherLambdaIsTheDefault() {
        FopdtModel model = new FopdtModel(2.0, 10.0, 1.0);
        assertThat(((TunedGains) ModelRule.LAMBDA.tune(model, ControllerType.PI)).note())
                .isEqualTo("lambda = 10.00 s (default)");
        assertThat(((TunedGains) ModelRule.LAMBDA.tune(model, ControllerType.PI, 20.0)).note())
                .isEqualTo("lambda = 20.00 s");
    }

    @Test
    void aDelayDominantProcessIsReportedWithItsRatio() {
        // L = 6 s, T = 4 s: L/T = 1.5, beyond the lag-dominant range L/T <= 1
        assertThat(ModelRule.ZIEGLER_NICHOLS_STEP.tune(new FopdtModel(1.0, 4.0, 6.0), ControllerType.PI))
                .isEqualTo(new RuleNotApplicable(ModelRule.ZIEGLER_NICHOLS_STEP, ControllerType.PI,
                        "the process is delay-dominant, outside ziegler-nichols's range L/T <= 1.000: L/T=1.500"));
    }

    @Test
    void aClosedLoopTimeOfZeroIsRefused() {
        assertThatThrownBy(() -> ModelRule.SIMC.tune(new FopdtModel(2.0, 10.0, 1.0), ControllerType.PI, 0.0))
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage("closedLoopTimeSeconds must be finite and > 0 (NaN for the rule's default):"
                        + " closedLoopTimeSeconds=0.0");
    }
}
