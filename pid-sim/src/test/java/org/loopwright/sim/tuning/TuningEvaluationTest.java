package org.loopwright.sim.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;
import org.loopwright.pid.tuning.ModelRule;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.sim.frequency.StabilityMargins;

class TuningEvaluationTest {

    @Test
    void simcWithIntegralTimeEqualToTheLagGivesTheAnalyticMargins() {
        // SIMC (Skogestad 2003) with τc = L and T ≤ 8L: Ti = T, Kc = T/(K·2L), so the loop is exactly
        // L(s) = e^(−Ls)/(2L·s) (analytic). Its phase crossover is at ω = π/(2L), gain margin
        // 2L·ω = π; its gain crossover at ω = 1/(2L), phase margin 90° − 0.5 rad = 61.35°. Skogestad
        // (2003) quotes GM = 3.14, PM = 61.4°, Ms = 1.59 for this case (from memory).
        FopdtModel model = new FopdtModel(2.0, 5.0, 1.0);
        TunedGains simc = (TunedGains) ModelRule.SIMC.tune(model, ControllerType.PI);

        TuningCandidate candidate = TuningEvaluation.onModel(simc, model);

        StabilityMargins margins = candidate.margins().orElseThrow();
        assertThat(margins.phaseCrossover().orElseThrow().gainMargin()).isCloseTo(Math.PI, within(1e-3));
        assertThat(margins.gainCrossover().orElseThrow().phaseMarginDegrees())
                .isCloseTo(90.0 - Math.toDegrees(0.5), within(1e-2));
        assertThat(margins.sensitivityPeak().value()).isCloseTo(1.59, within(0.01));
        // the step settles without drama: overshoot below 20 % (common practice for Ms ≈ 1.6)
        assertThat(candidate.setpointResponse().orElseThrow().overshootPercent()).isBetween(0.0, 20.0);
        assertThat(candidate.setpointResponse().orElseThrow().steadyStateError()).isCloseTo(0.0, within(1e-3));
    }

    @Test
    void negativeProcessGainGetsDirectAction() {
        FopdtModel cooler = new FopdtModel(-2.0, 5.0, 1.0);
        TunedGains simc = (TunedGains) ModelRule.SIMC.tune(cooler, ControllerType.PI);

        TuningCandidate candidate = TuningEvaluation.onModel(simc, cooler);

        assertThat(candidate.settings().action()).isEqualTo(Action.DIRECT);
        assertThat(candidate.margins().orElseThrow().phaseCrossover().orElseThrow().gainMargin())
                .isCloseTo(Math.PI, within(1e-3));
        assertThat(candidate.setpointResponse().orElseThrow().steadyStateError()).isCloseTo(0.0, within(1e-3));
    }

    @Test
    void samplePeriodIsATwentiethOfTheFasterOfDeadTimeAndLag() {
        assertThat(TuningEvaluation.samplePeriodSeconds(new FopdtModel(1.0, 10.0, 2.0))).isEqualTo(0.1);
        assertThat(TuningEvaluation.samplePeriodSeconds(new FopdtModel(1.0, 1.0, 4.0))).isEqualTo(0.05);
        assertThat(TuningEvaluation.samplePeriodSeconds(new FopdtModel(1.0, 6.0, 0.0))).isEqualTo(0.3);
    }
}
