package org.loopwright.sim.study;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.plant.TankModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

class DiscretisationStudyTest {

    /** Demo: a water bath heater, 2 K per unit of heater power, 5 s lag, 1 s transport delay (invented, demo only). */
    private static final TransferFunction BATH = TransferFunction.fopdt(2.0, 5.0, 1.0);

    private static Scenario scenario(ControllerSettings settings) {
        return Scenario.builder().plant(BATH).controller(settings).setpoint(SetpointChange.step(0.0, 1.0))
                .durationSeconds(60.0).build();
    }

    private static ControllerSettings pi() {
        return ControllerSettings.builder().gains(IdealGains.pi(1.0, 5.0)).samplePeriodSeconds(0.1).build();
    }

    @Test
    void piStudyHasTheContinuousRowThenOneRowPerIntegralMethodAndPeriod() {
        StudyResult result = DiscretisationStudy.run(scenario(pi()), List.of(0.05, 0.2));
        assertThat(result.rows()).hasSize(1 + 2 * 3);
        StudyRow reference = result.rows().get(0);
        assertThat(reference.kind()).isEqualTo(StudyRow.Kind.CONTINUOUS);
        assertThat(reference.samplePeriodSeconds()).isNaN();
        assertThat(reference.phaseMarginDegrees()).isEqualTo(
                LoopAnalysis.continuous(BATH, pi()).gainCrossover().orElseThrow().phaseMarginDegrees());
        assertThat(result.rows().subList(1, 7)).allSatisfy(row -> {
            assertThat(row.kind()).isEqualTo(StudyRow.Kind.SAMPLED);
            assertThat(row.derivativeMethod()).isNull();
            assertThat(row.stable()).isTrue();
        });
    }

    @Test
    void integralMethodsErrAtCrossoverAsTheirFormulasSay() {
        // Åström & Wittenmark, Computer-Controlled Systems, §8.2: at z = e^{jωh} the forward-Euler integral
        // Ki·h/(z − 1) lags Ki/(jω) by ωh/2, backward Euler Ki·h·z/(z − 1) leads it by ωh/2, and Tustin
        // Ki·(h/2)(z + 1)/(z − 1) = −j·Ki·(h/2)·cot(ωh/2) has no phase error. The PI errors follow exactly:
        ControllerSettings pi = pi();
        StudyResult result = DiscretisationStudy.run(scenario(pi), List.of(0.2));
        double w = result.crossoverRadPerSecond();
        double h = 0.2;
        double kp = 1.0;
        double ki = 0.2;
        Complex continuous = new Complex(kp, -ki / w);
        double half = w * h / 2;
        Complex integral = new Complex(0, -ki * h / 2 / Math.sin(half)); // magnitude of FE/BE integral terms
        for (StudyRow row : result.rows().subList(1, result.rows().size())) {
            Complex expected = switch (row.integralMethod()) {
                case FORWARD_EULER -> integral.multiply(new Complex(Math.cos(-half), Math.sin(-half))).add(kp);
                case BACKWARD_EULER -> integral.multiply(new Complex(Math.cos(half), Math.sin(half))).add(kp);
                case TUSTIN -> new Complex(kp, -ki * h / 2 / Math.tan(half));
            };
            Complex ratio = expected.divide(continuous);
            assertThat(row.magnitudeErrorDb()).isCloseTo(20 * Math.log10(ratio.norm()), within(1e-9));
            assertThat(row.phaseErrorDegrees()).isCloseTo(Math.toDegrees(ratio.getArgument()), within(1e-9));
        }
        StudyRow forward = rowFor(result, IntegralMethod.FORWARD_EULER, null, h);
        StudyRow tustin = rowFor(result, IntegralMethod.TUSTIN, null, h);
        StudyRow backward = rowFor(result, IntegralMethod.BACKWARD_EULER, null, h);
        assertThat(forward.phaseErrorDegrees()).isNegative();
        assertThat(backward.phaseErrorDegrees()).isPositive();
        assertThat(forward.phaseMarginDegrees()).isLessThan(tustin.phaseMarginDegrees())
                .isLessThan(backward.phaseMarginDegrees());
    }

    @Test
    void forwardEulerDerivativeAtTooLongAPeriodIsReportedNotApplicable() {
        // DESIGN.md / DerivativeMethod: forward Euler for the derivative needs h < 2·Tf.
        ControllerSettings pid = ControllerSettings.builder().gains(new ParallelGains(1.2, 0.25, 0.6))
                .derivativeFilterTimeSeconds(0.1).samplePeriodSeconds(0.05).build();
        StudyResult result = DiscretisationStudy.run(scenario(pid), List.of(0.05, 0.3));
        assertThat(result.rows()).hasSize(1 + 2 * 15);
        StudyRow invalid = rowFor(result, IntegralMethod.TUSTIN, DerivativeMethod.FORWARD_EULER, 0.3);
        assertThat(invalid.kind()).isEqualTo(StudyRow.Kind.NOT_APPLICABLE);
        assertThat(invalid.note()).isEqualTo("a forward-Euler derivative needs h < 2·Tf: h=0.3 s, Tf=0.1 s");
        assertThat(invalid.phaseMarginDegrees()).isNaN();
        assertThat(rowFor(result, IntegralMethod.TUSTIN, DerivativeMethod.FORWARD_EULER, 0.05).kind())
                .isEqualTo(StudyRow.Kind.SAMPLED);
        assertThat(result.rows().stream().filter(r -> r.kind() == StudyRow.Kind.NOT_APPLICABLE)).hasSize(3);
    }

    @Test
    void shortPeriodsApproachTheContinuousDesignInMarginsAndResponses() {
        // Åström & Wittenmark, §8.1–8.2: as h → 0 every discretisation tends to the continuous design.
        StudyResult result = DiscretisationStudy.run(scenario(pi()), List.of(0.01, 0.1));
        StudyRow reference = result.rows().get(0);
        for (IntegralMethod method : IntegralMethod.values()) {
            StudyRow fine = rowFor(result, method, null, 0.01);
            StudyRow coarse = rowFor(result, method, null, 0.1);
            assertThat(Math.abs(fine.phaseMarginDegrees() - reference.phaseMarginDegrees()))
                    .isLessThan(Math.abs(coarse.phaseMarginDegrees() - reference.phaseMarginDegrees()));
            assertThat(fine.iae()).isCloseTo(reference.iae(), within(0.02 * reference.iae()));
            assertThat(fine.loadIae()).isCloseTo(reference.loadIae(), within(0.02 * reference.loadIae()));
            assertThat(fine.overshootPercent()).isCloseTo(reference.overshootPercent(), within(1.0));
        }
    }

    @Test
    void defaultPeriodsSpanTheRuleOfThumbAroundTheCrossoverAndIncludeTheScenariosOwn() {
        // common practice (SamplingVerdict): ω_c·h ≈ 0.05–0.3; the defaults sit at 0.02, 0.1, 0.3, 1.
        double crossover = 0.37;
        List<Double> periods = DiscretisationStudy.defaultPeriods(crossover, 0.27);
        double[] expected = {0.02, 0.1, 0.3, 1.0};
        assertThat(periods).hasSize(4);
        // issue 10, item 15: the scenario's own period is among the defaults (and is not repeated)
        assertThat(DiscretisationStudy.defaultPeriods(crossover, 0.5)).containsExactly(0.054, 0.27, 0.5, 0.81, 2.7);
        for (int i = 0; i < 4; i++) {
            assertThat(periods.get(i) * crossover).isCloseTo(expected[i], within(0.05 * expected[i]));
        }
        assertThat(SamplingVerdict.of(0.02)).isEqualTo(SamplingVerdict.FINE);
        assertThat(SamplingVerdict.of(0.05)).isEqualTo(SamplingVerdict.TYPICAL);
        assertThat(SamplingVerdict.of(0.3)).isEqualTo(SamplingVerdict.TYPICAL);
        assertThat(SamplingVerdict.of(0.31)).isEqualTo(SamplingVerdict.COARSE);
    }

    @Test
    void nonlinearPlantIsRefusedWithAClearMessage() {
        Scenario tank = Scenario.builder().plant(new TankModel(0.5, 0.01, 0.2, 0.05)).controller(pi())
                .durationSeconds(10).build();
        assertThatThrownBy(() -> DiscretisationStudy.run(tank, List.of(0.1)))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageStartingWith("the discretisation study needs a linear plant (a transfer function): plant=");
    }

    private static StudyRow rowFor(StudyResult result, IntegralMethod integral, DerivativeMethod derivative, double h) {
        return result.rows().stream().filter(r -> r.kind() != StudyRow.Kind.CONTINUOUS
                && r.integralMethod() == integral && r.derivativeMethod() == derivative && r.samplePeriodSeconds() == h)
                .findFirst().orElseThrow();
    }
}
