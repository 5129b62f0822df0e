package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;
import org.loopwright.pid.InvalidSettingException;

/**
 * The relay settings keep every value as given, apply the documented defaults, and draw each
 * validation line exactly where its rule says (issue 11: the mutation run found the boundaries and
 * the accessors unpinned). Message shape: {@code "<field> <rule>: <field>=<value>"}.
 */
class RelaySettingsTest {

    private static RelaySettings.Builder bath() {
        return RelaySettings.builder().setpoint(40.0).bias(30.0).relayAmplitude(10.0).hysteresis(0.1)
                .excursionLimit(2.0).timeoutSeconds(7200.0).maxHalfPeriodSeconds(1200.0);
    }

    @Test
    void keepsEveryValueAsGiven() {
        RelaySettings s = bath().measuredCycles(4).settlingCycles(1).cycleTolerance(0.05).action(Action.DIRECT).build();
        assertThat(s.setpoint()).isEqualTo(40.0);
        assertThat(s.bias()).isEqualTo(30.0);
        assertThat(s.relayAmplitude()).isEqualTo(10.0);
        assertThat(s.hysteresis()).isEqualTo(0.1);
        assertThat(s.excursionLimit()).isEqualTo(2.0);
        assertThat(s.timeoutSeconds()).isEqualTo(7200.0);
        assertThat(s.maxHalfPeriodSeconds()).isEqualTo(1200.0);
        assertThat(s.measuredCycles()).isEqualTo(4);
        assertThat(s.settlingCycles()).isEqualTo(1);
        assertThat(s.cycleTolerance()).isEqualTo(0.05);
        assertThat(s.action()).isEqualTo(Action.DIRECT);
    }

    @Test
    void appliesTheDocumentedDefaults() {
        RelaySettings s = bath().build();
        assertThat(s.measuredCycles()).isEqualTo(RelaySettings.DEFAULT_MEASURED_CYCLES).isEqualTo(3);
        assertThat(s.settlingCycles()).isEqualTo(RelaySettings.DEFAULT_SETTLING_CYCLES).isEqualTo(2);
        assertThat(s.cycleTolerance()).isEqualTo(RelaySettings.DEFAULT_CYCLE_TOLERANCE).isEqualTo(0.02);
        assertThat(s.action()).isEqualTo(Action.REVERSE);
        assertThat(RelaySettings.builder().setpoint(0.0).bias(0.0).relayAmplitude(1.0).excursionLimit(1.0)
                .timeoutSeconds(10.0).maxHalfPeriodSeconds(5.0).build().hysteresis()).isZero();
    }

    @Test
    void theLimitsOfEachRuleAreWhereTheRuleSays() {
        // accepted exactly at the edge: hysteresis 0, a half period as long as the timeout, two
        // measured cycles, no settling cycles, a tolerance just under 1
        RelaySettings edge = bath().hysteresis(0.0).maxHalfPeriodSeconds(7200.0).measuredCycles(2).settlingCycles(0)
                .cycleTolerance(Math.nextDown(1.0)).build();
        assertThat(edge.maxHalfPeriodSeconds()).isEqualTo(7200.0);
        assertThat(edge.measuredCycles()).isEqualTo(2);
        assertThat(edge.settlingCycles()).isZero();
        // refused exactly at the edge: a band no wider than the hysteresis, a zero tolerance
        assertThatThrownBy(() -> bath().hysteresis(2.0).build()).isInstanceOf(InvalidSettingException.class)
                .hasMessage("excursionLimit must be > hysteresis (2.0): excursionLimit=2.0");
        assertThatThrownBy(() -> bath().cycleTolerance(0.0).build()).isInstanceOf(InvalidSettingException.class)
                .hasMessage("cycleTolerance must be > 0 and < 1: cycleTolerance=0.0");
        assertThatThrownBy(() -> bath().cycleTolerance(Double.NaN).build()).isInstanceOf(InvalidSettingException.class)
                .hasMessage("cycleTolerance must be > 0 and < 1: cycleTolerance=NaN");
        assertThatThrownBy(() -> bath().maxHalfPeriodSeconds(Math.nextUp(7200.0)).build())
                .isInstanceOf(InvalidSettingException.class)
                .hasMessageStartingWith("maxHalfPeriodSeconds must be <= timeoutSeconds (7200.0)");
        assertThatThrownBy(() -> bath().action(null).build()).isInstanceOf(NullPointerException.class)
                .hasMessage("action");
    }
}
