package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.Scale;
import org.loopwright.pid.form.IdealGains;

/**
 * Every rule gives finite, positive settings over its whole valid range, and says "not applicable"
 * exactly outside it. Ranges: K of either sign, |K| in [0.01, 100]; T in [0.01, 1000] s; L as a
 * multiple of T (from the ranges each rule states in {@link TuningRule}).
 */
class TuningRuleProperties {

    private static FopdtModel model(double gainMagnitude, boolean negative, double timeConstant, double ratio) {
        return new FopdtModel(negative ? -gainMagnitude : gainMagnitude, timeConstant, ratio * timeConstant);
    }

    private static void assertFinitePositive(TuningResult result, ControllerType type) {
        assertThat(result).isInstanceOf(TunedGains.class);
        IdealGains gains = ((TunedGains) result).gains();
        assertThat(gains.gain()).isFinite().isPositive();
        assertThat(gains.integralTime()).isFinite().isPositive();
        if (type == ControllerType.PI) {
            assertThat(gains.derivativeTime()).isZero();
        } else {
            assertThat(gains.derivativeTime()).isFinite().isPositive();
        }
        assertThat(result.citation()).isNotBlank();
    }

    @Property
    void simcPiIsFinitePositiveForAnyDeadTime(@ForAll @DoubleRange(min = 0.01, max = 100) double k,
                                              @ForAll boolean negative,
                                              @ForAll @DoubleRange(min = 0.01, max = 1000) double t,
                                              @ForAll @DoubleRange(min = 0.001, max = 20) @Scale(4) double ratio) {
        assertFinitePositive(ModelRule.SIMC.tune(model(k, negative, t, ratio), ControllerType.PI), ControllerType.PI);
    }

    @Property
    void amigoIsFinitePositiveForAnyPositiveDeadTime(@ForAll @DoubleRange(min = 0.01, max = 100) double k,
                                                     @ForAll boolean negative,
                                                     @ForAll @DoubleRange(min = 0.01, max = 1000) double t,
                                                     @ForAll @DoubleRange(min = 0.001, max = 100) @Scale(4) double ratio,
                                                     @ForAll ControllerType type) {
        assertFinitePositive(ModelRule.AMIGO.tune(model(k, negative, t, ratio), type), type);
    }

    @Property
    void lambdaIsFinitePositiveWithItsDefault(@ForAll @DoubleRange(min = 0.01, max = 100) double k,
                                              @ForAll boolean negative,
                                              @ForAll @DoubleRange(min = 0.01, max = 1000) double t,
                                              @ForAll @DoubleRange(min = 0.001, max = 100) @Scale(4) double ratio,
                                              @ForAll ControllerType type) {
        assertFinitePositive(ModelRule.LAMBDA.tune(model(k, negative, t, ratio), type), type);
    }

    @Property
    void stepRulesAreFinitePositiveUpToLEqualsTAndInapplicableBeyond(
            @ForAll @DoubleRange(min = 0.01, max = 100) double k, @ForAll boolean negative,
            @ForAll @DoubleRange(min = 0.01, max = 1000) double t,
            @ForAll @DoubleRange(min = 0.001, max = 5) @Scale(4) double ratio, @ForAll ControllerType type) {
        FopdtModel m = model(k, negative, t, ratio);
        for (ModelRule rule : new ModelRule[] {ModelRule.ZIEGLER_NICHOLS_STEP, ModelRule.COHEN_COON}) {
            TuningResult result = rule.tune(m, type);
            if (m.deadTimeSeconds() / m.timeConstantSeconds() <= ModelRule.MAX_DEAD_TIME_RATIO) {
                assertFinitePositive(result, type);
            } else {
                assertThat(result).isInstanceOf(RuleNotApplicable.class);
            }
        }
    }

    @Property
    void ultimateRulesAreFinitePositive(@ForAll @DoubleRange(min = 0.001, max = 1000) @Scale(4) double ku,
                                        @ForAll @DoubleRange(min = 0.001, max = 10000) @Scale(4) double pu,
                                        @ForAll ControllerType type) {
        UltimatePoint point = new UltimatePoint(ku, pu);
        assertFinitePositive(UltimatePointRule.ZIEGLER_NICHOLS.tune(point, type), type);
        assertFinitePositive(UltimatePointRule.TYREUS_LUYBEN.tune(point, type), type);
    }
}
