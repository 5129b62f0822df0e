package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import net.jqwik.api.constraints.DoubleRange;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.testing.Draws;

/**
 * The properties of issue 2: equivalent forms agree, the law is linear while no limit acts, the
 * output is never NaN nor out of range, and c = 0 means no derivative kick. Settings and input
 * sequences are drawn through jqwik arbitraries, so a failure shrinks to a small case.
 */
class ControllerProperties {

    private static final int STEPS = 40;

    /** Ideal gains and linear settings that use them in the ideal form. */
    @Provide
    Arbitrary<ControllerSettings> idealLinear() {
        return SettingsArbitraries.linear(SettingsArbitraries.idealGains());
    }

    @Provide
    Arbitrary<ControllerSettings> linear() {
        return SettingsArbitraries.linear();
    }

    @Provide
    Arbitrary<ControllerSettings> industrial() {
        return SettingsArbitraries.industrial();
    }

    /** STEPS pairs of ordinary inputs, each within ±scale. */
    private static Arbitrary<List<double[]>> inputs(int width, double scale) {
        return Draws.between(-scale, scale).array(double[].class).ofSize(width).list().ofSize(STEPS);
    }

    @Provide
    Arbitrary<List<double[]>> setpointsAndMeasurements() {
        return inputs(2, 30.0);
    }

    @Provide
    Arbitrary<List<double[]>> twoInputPairs() {
        return inputs(4, 3.0);
    }

    @Provide
    Arbitrary<Double> weights() {
        return Draws.between(-2.0, 2.0);
    }

    @Property
    void equivalentFormsGiveEqualOutputs(@ForAll("idealLinear") ControllerSettings idealSettings,
            @ForAll("setpointsAndMeasurements") List<double[]> samples) {
        IdealGains ideal = (IdealGains) idealSettings.gains();
        PidController byIdeal = new PidController(idealSettings);
        PidController byParallel = new PidController(idealSettings.toBuilder().gains(ideal.toParallel()).build());
        PidController bySeries = new PidController(idealSettings.toBuilder().gains(ideal.toSeries()).build());
        for (double[] sample : samples) {
            double r = sample[0];
            double y = sample[1];
            double u = byIdeal.update(r, y);
            double scale = 1.0 + Math.abs(byIdeal.proportionalTerm()) + Math.abs(byIdeal.integralTerm())
                    + Math.abs(byIdeal.derivativeTerm());
            assertThat(byParallel.update(r, y)).isCloseTo(u, within(1e-9 * scale));
            assertThat(bySeries.update(r, y)).isCloseTo(u, within(1e-9 * scale));
        }
    }

    @Property
    void superpositionHoldsWhileNoLimitActs(@ForAll("linear") ControllerSettings s,
            @ForAll("weights") double alpha, @ForAll("weights") double beta,
            @ForAll("twoInputPairs") List<double[]> samples) {
        PidController first = new PidController(s);
        PidController second = new PidController(s);
        PidController combined = new PidController(s);
        for (double[] sample : samples) {
            double r1 = sample[0];
            double y1 = sample[1];
            double r2 = sample[2];
            double y2 = sample[3];
            double expected = alpha * first.update(r1, y1) + beta * second.update(r2, y2);
            double scale = 1.0 + Math.abs(alpha) * termSize(first) + Math.abs(beta) * termSize(second);
            assertThat(combined.update(alpha * r1 + beta * r2, alpha * y1 + beta * y2))
                    .isCloseTo(expected, within(1e-10 * scale));
        }
    }

    private static double termSize(PidController c) {
        return Math.abs(c.proportionalTerm()) + Math.abs(c.integralTerm()) + Math.abs(c.derivativeTerm());
    }

    /** Any finite double: ordinary, huge, tiny, or an extreme of the type. */
    static Arbitrary<Double> anyFinite() {
        return Arbitraries.frequencyOf(
                Tuple.of(1, Arbitraries.of(Double.MAX_VALUE, -Double.MAX_VALUE)),
                Tuple.of(1, Combinators.combine(Draws.between(-300.0, 300.0), Arbitraries.of(1.0, -1.0))
                        .as((exponent, sign) -> sign * Math.pow(10.0, exponent))),
                Tuple.of(1, Arbitraries.just(0.0)),
                Tuple.of(3, Draws.between(-300.0, 300.0)));
    }

    /** STEPS samples of any finite setpoint and measurement with a period of 1 ns to 1,000 s. */
    @Provide
    Arbitrary<List<double[]>> anyFiniteSamples() {
        return Combinators.combine(anyFinite(), anyFinite(), Draws.logUniform(1e-9, 1e3))
                .as((r, y, h) -> new double[] {r, y, h}).list().ofSize(STEPS);
    }

    @Property
    void outputIsNeverNanAndNeverOutOfRangeForFiniteInputs(@ForAll("industrial") ControllerSettings s,
            @ForAll boolean variablePeriod, @ForAll("anyFiniteSamples") List<double[]> samples) {
        PidController c = new PidController(s);
        for (double[] sample : samples) {
            double r = sample[0];
            double y = sample[1];
            double u = variablePeriod ? c.update(r, y, sample[2]) : c.update(r, y);
            assertThat(u).isNotNaN();
            assertThat(c.position()).isBetween(s.outputMin(), s.outputMax());
            if (s.outputKind() == OutputKind.POSITION) {
                assertThat(u).isEqualTo(c.position());
            }
        }
    }

    /** STEPS setpoints: null (the last one stays) or, one time in four, a step to a new value within ±150. */
    @Provide
    Arbitrary<List<Double>> setpointSteps() {
        return Draws.between(-150.0, 150.0).injectNull(0.75).list().ofSize(STEPS);
    }

    @Property
    void derivativeStaysZeroOnSetpointStepsWhenItsWeightIsZero(@ForAll("industrial") ControllerSettings base,
            @ForAll @DoubleRange(min = 0.0, max = 1.0) double b, @ForAll @DoubleRange(min = -30.0, max = 30.0) double y,
            @ForAll("setpointSteps") List<Double> steps) {
        // b = 1 on a circular process variable, any b otherwise; c = 0 is the point of this property
        ControllerSettings s = base.toBuilder().setpointWeights(base.wrapSpan() > 0.0 ? 1.0 : b, 0.0).build();
        PidController c = new PidController(s);
        double r = 0.0;
        for (Double step : steps) {
            r = step == null ? r : step;
            c.update(r, y);
            assertThat(c.derivativeTerm()).isZero();
        }
    }
}
