package org.loopwright.sim.tuning;

import static org.assertj.core.api.Assertions.assertThat;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.Scale;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.ModelRule;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.pid.tuning.TuningResult;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.SampledMargins;

/**
 * A loop tuned by any rule that applies is stable on its own model: every pole of the sampled
 * closed loop (controller at the evaluation's sample period, plant by its exact zero-order-hold
 * equivalent with the dead time) lies inside the unit circle (Åström &amp; Wittenmark 1997, §3.2).
 * Models: K in [0.1, 10], T in [1, 100] s, L/T in [0.05, 1] (the range where every model rule
 * applies; lambda and AMIGO also beyond it, checked up to L/T = 3).
 */
class TunedLoopStabilityProperties {

    @Property(tries = 200)
    void everyApplicableRuleGivesAStableLoopOnItsModel(@ForAll @DoubleRange(min = 0.1, max = 10) double k,
                                                       @ForAll @DoubleRange(min = 1, max = 100) double t,
                                                       @ForAll @DoubleRange(min = 0.05, max = 3) @Scale(3) double ratio,
                                                       @ForAll ControllerType type) {
        FopdtModel model = new FopdtModel(k, t, ratio * t);
        for (ModelRule rule : ModelRule.values()) {
            TuningResult result = rule.tune(model, type);
            if (result instanceof TunedGains tuned) {
                ControllerSettings settings = TuningEvaluation.settings(tuned,
                        TuningEvaluation.samplePeriodSeconds(model), org.loopwright.pid.Action.REVERSE);
                SampledMargins sampled = LoopAnalysis.sampled(SampledLoop.of(TuningEvaluation.transferFunction(model), settings));
                assertThat(sampled.stable()).as("%s %s on %s: largest pole %s", rule, type, model,
                        sampled.largestPoleMagnitude()).isTrue();
            }
        }
    }
}
