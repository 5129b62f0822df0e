package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;

import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Every kind of linear plant against a reference outside this project: Hipparchus's Dormand–Prince
 * 8(5,3) integrator on the observable canonical form (a different realisation from the plant's
 * controllable one), with the delayed held input integrated piece by piece between its
 * discontinuities. Agreement to 1e-8 of the largest output, at every sample.
 */
class LinearPlantReferenceTest {

    static Stream<Arguments> plants() {
        return Stream.of(
                Arguments.of("first order", TransferFunction.firstOrder(2.0, 3.0)),
                Arguments.of("fopdt, fractional dead time", TransferFunction.fopdt(2.0, 3.0, 1.23)),
                Arguments.of("sopdt, two time constants", TransferFunction.sopdt(1.5, 4.0, 1.5, 0.7)),
                Arguments.of("sopdt, underdamped", TransferFunction.sopdtOscillatory(1.0, 1.2, 0.3, 0.45)),
                Arguments.of("integrating plus dead time", TransferFunction.integrating(0.4, 0.25)),
                Arguments.of("third order with a zero", new TransferFunction(new double[] {1.0, 2.0},
                        new double[] {1.0, 3.0, 3.0, 1.0}, 0.4)),
                Arguments.of("biproper lead", new TransferFunction(new double[] {2.0, 1.0},
                        new double[] {1.0, 3.0}, 0.9)));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("plants")
    void sampledResponseMatchesDormandPrince(String name, TransferFunction model) {
        SplittableRandom random = new SplittableRandom(42);
        double[] lengths = {0.5, 0.3, 0.5, 0.5, 0.2};
        int samples = 120;
        double[] inputs = new double[samples];
        double[] durations = new double[samples];
        for (int k = 0; k < samples; k++) {
            inputs[k] = random.nextDouble(-2.0, 2.0);
            durations[k] = lengths[k % lengths.length];
        }

        Plant plant = new LinearPlant(model);
        double[] exact = new double[samples];
        for (int k = 0; k < samples; k++) {
            plant.advance(inputs[k], durations[k]);
            exact[k] = plant.output();
        }

        double[] reference = reference(model, inputs, durations);
        double largest = 0.0;
        for (double y : reference) {
            largest = Math.max(largest, Math.abs(y));
        }
        for (int k = 0; k < samples; k++) {
            assertThat(Math.abs(exact[k] - reference[k])).as("%s, sample %d", name, k)
                    .isLessThanOrEqualTo(1e-8 * largest);
        }
    }

    /** y at the end of each interval, by integrating x' = Ax + B·u(t − L) across every discontinuity. */
    private static double[] reference(TransferFunction model, double[] inputs, double[] durations) {
        double[] den = model.denominator();
        double[] num = model.numerator();
        int n = den.length - 1;
        double[] a = new double[n + 1];
        double[] beta = new double[n + 1];
        for (int i = 0; i <= n; i++) {
            a[i] = den[i] / den[0];
        }
        for (int i = 0; i < num.length; i++) {
            beta[n + 1 - num.length + i] = num[i] / den[0];
        }
        double direct = beta[0];
        double[] c = new double[n + 1];
        for (int i = 1; i <= n; i++) {
            c[i] = beta[i] - direct * a[i];
        }
        // breakpoints of the delayed input: every interval boundary shifted by L
        double delay = model.deadTimeSeconds();
        List<double[]> pieces = new ArrayList<>(); // {start, end, value} of u(t − L)
        double t = 0.0;
        if (delay > 0.0) {
            pieces.add(new double[] {0.0, delay, 0.0});
        }
        for (int k = 0; k < inputs.length; k++) {
            pieces.add(new double[] {t + delay, t + durations[k] + delay, inputs[k]});
            t += durations[k];
        }
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-9, 1.0, 1e-14, 1e-13);
        double[] x = new double[n];
        double[] y = new double[inputs.length];
        double now = 0.0;
        int piece = 0;
        double sampleEnd = 0.0;
        for (int k = 0; k < inputs.length; k++) {
            sampleEnd += durations[k];
            double lastValue = 0.0;
            while (now < sampleEnd - 1e-12) {
                double[] p = pieces.get(piece);
                double until = Math.min(p[1], sampleEnd);
                double u = p[2];
                lastValue = u;
                if (n > 0 && until > now) {
                    OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
                        @Override
                        public int getDimension() {
                            return n;
                        }

                        @Override
                        public double[] computeDerivatives(double time, double[] state) {
                            double[] d = new double[n];
                            for (int i = 0; i < n; i++) {
                                d[i] = -a[i + 1] * state[0] + (i + 1 < n ? state[i + 1] : 0.0) + c[i + 1] * u;
                            }
                            return d;
                        }
                    };
                    x = integrator.integrate(ode, new ODEState(now, x), until).getPrimaryState();
                }
                now = until;
                if (until >= p[1] - 1e-12) {
                    piece++;
                }
            }
            y[k] = (n > 0 ? x[0] : 0.0) + direct * lastValue;
        }
        return y;
    }
}
