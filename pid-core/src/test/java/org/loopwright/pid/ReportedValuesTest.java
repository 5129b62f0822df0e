package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.ControllerForm;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.SeriesGains;
import org.loopwright.pid.onoff.OnOffController;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.pid.tuning.ModelRule;
import org.loopwright.pid.tuning.UltimatePointRule;

/**
 * What the library reports about itself gives back what it was given: forms, rule names, the
 * on-off state, setting accessors (issue 11: the mutation run found these read by no test, so a
 * wrong value would have reached the harness's files and reports unnoticed). A one-value output
 * range is pinned by {@code ControllerBoundaryTest}.
 */
class ReportedValuesTest {

    @Test
    void eachGainsRecordNamesItsOwnForm() {
        assertThat(IdealGains.pi(2.0, 10.0).form()).isEqualTo(ControllerForm.IDEAL);
        assertThat(new SeriesGains(2.0, 10.0, 1.0).form()).isEqualTo(ControllerForm.SERIES);
    }

    @Test
    void tuningRulesCarryTheNamesUsersSelectThemBy() {
        assertThat(UltimatePointRule.ZIEGLER_NICHOLS.label()).isEqualTo("ziegler-nichols");
        assertThat(UltimatePointRule.TYREUS_LUYBEN.label()).isEqualTo("tyreus-luyben");
        assertThat(ModelRule.SIMC.label()).isEqualTo("simc");
        assertThat(ModelRule.AMIGO.label()).isEqualTo("amigo");
        assertThat(ModelRule.LAMBDA.label()).isEqualTo("lambda");
        assertThat(ModelRule.COHEN_COON.label()).isEqualTo("cohen-coon");
    }

    @Test
    void anOnOffControllerSaysWhenItIsOn() {
        // reverse action, 10 below the setpoint with a hysteresis of 1: on (the definition of on-off control)
        OnOffSettings heater = new OnOffSettings(0.0, 2000.0, 1.0, 0.0, 0.0, Action.REVERSE);
        OnOffController c = new OnOffController(heater);
        assertThat(c.update(60.0, 50.0, 0.0)).isEqualTo(2000.0);
        assertThat(c.on()).isTrue();
        assertThat(c.settings()).isSameAs(heater);
    }

    @Test
    void settingsReportTheWeightAndRatioTheyWereGivenAndTheirOwnCoefficients() {
        ControllerSettings s = ControllerSettings.builder().gains(new IdealGains(2.0, 10.0, 1.0))
                .samplePeriodSeconds(0.1).setpointWeights(0.4, 0.0).derivativeFilterRatio(8.0).build();
        assertThat(s.proportionalSetpointWeight()).isEqualTo(0.4);
        assertThat(s.derivativeFilterRatio()).isEqualTo(8.0);
        // the fixed-period coefficients are those of the configured period (the accessors' contract)
        assertThat(s.discretePid()).isEqualTo(s.discretePid(0.1));
    }
}
