package org.loopwright.sim.frequency;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import net.jqwik.api.statistics.Statistics;
import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.linear.ArrayRealVector;
import org.hipparchus.linear.MatrixUtils;
import org.hipparchus.linear.RealMatrix;
import org.hipparchus.linear.RealVector;
import org.loopwright.sim.plant.DescendingPolynomials;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The zero-order-hold equivalent on plain arrays gives the pulse-transfer function of the previous
 * Hipparchus-object implementation to the bit (raw bits of every coefficient), for random stable and
 * unstable plants of order 1 to 4, with dead times that are and are not whole numbers of periods
 * (method: Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i>, 3rd ed., §2.3).
 */
class ZeroOrderHoldEquivalentProperties {

    /** A plant: poles, numerator, period and dead time, drawn together. */
    record Case(double[] poles, double lead, double[] numerator, double periodSeconds, int wholePeriods,
            double fraction) {

        TransferFunction plant() {
            double[] denominator = {lead};
            for (double pole : poles) {
                denominator = DescendingPolynomials.timesLinear(denominator, pole);
            }
            return new TransferFunction(numerator, denominator, (wholePeriods + fraction) * periodSeconds);
        }
    }

    private static Arbitrary<Double> uniform(double low, double high) {
        return Arbitraries.randomValue(random -> low + (high - low) * random.nextDouble());
    }

    @Provide
    Arbitrary<Case> plants() {
        Arbitrary<double[]> poles = uniform(-3.0, 1.0).array(double[].class).ofMinSize(1).ofMaxSize(4);
        Arbitrary<double[]> numerator = uniform(-5.0, 5.0).array(double[].class).ofMinSize(1).ofMaxSize(5);
        Arbitrary<Double> lead = uniform(0.2, 5.0);
        Arbitrary<Double> period = Arbitraries.randomValue(random -> Math.pow(10.0, -2.0 + 2.5 * random.nextDouble()));
        Arbitrary<Integer> whole = Arbitraries.integers().between(0, 4);
        Arbitrary<Double> fraction = Arbitraries.frequencyOf(
                Tuple.of(1, Arbitraries.just(0.0)),
                Tuple.of(1, uniform(0.02, 0.98)));
        return Combinators.combine(poles, lead, numerator, period, whole, fraction)
                .as((p, l, num, h, d, f) -> new Case(p, l,
                        num.length > p.length + 1 ? Arrays.copyOf(num, p.length + 1) : num, h, d, f));
    }

    @Property(tries = 1000)
    void equalsThePreviousImplementationToTheBit(@ForAll("plants") Case drawn) {
        TransferFunction plant = drawn.plant();
        Statistics.label("order").collect(drawn.poles().length);
        Statistics.label("stable").collect(Arrays.stream(drawn.poles()).allMatch(p -> p < 0.0));
        Statistics.label("dead time").collect(drawn.fraction() == 0.0 ? "whole periods" : "fractional");
        Statistics.label("stable").coverage(check -> {
            check.check(true).count(count -> count >= 100);
            check.check(false).count(count -> count >= 100);
        });
        Statistics.label("dead time").coverage(check -> {
            check.check("whole periods").count(count -> count >= 100);
            check.check("fractional").count(count -> count >= 100);
        });

        PulseTransferFunction arrays = ZeroOrderHoldEquivalent.of(plant, drawn.periodSeconds());
        PulseTransferFunction objects = PreviousImplementation.of(plant, drawn.periodSeconds());

        assertThat(rawBits(arrays.numerator())).containsExactly(rawBits(objects.numerator()));
        assertThat(rawBits(arrays.denominator())).containsExactly(rawBits(objects.denominator()));
        assertThat(arrays.delaySamples()).isEqualTo(objects.delaySamples());
        assertThat(arrays.periodSeconds()).isEqualTo(objects.periodSeconds());
    }

    private static long[] rawBits(PolynomialFunction polynomial) {
        double[] coefficients = polynomial.getCoefficients();
        long[] bits = new long[coefficients.length];
        for (int i = 0; i < coefficients.length; i++) {
            bits[i] = Double.doubleToRawLongBits(coefficients[i]);
        }
        return bits;
    }

    /**
     * The test oracle: the previous implementation of {@link ZeroOrderHoldEquivalent#of} and of its
     * controllable canonical realisation, on Hipparchus matrix and vector objects, kept here unchanged
     * (static-gain branch left out, as the plants drawn have order &ge; 1).
     */
    private static final class PreviousImplementation {

        private static final double WHOLE_PERIOD_TOLERANCE = 1e-9;

        private record StateSpace(RealMatrix dynamics, RealVector input, RealVector output, double feedthrough) {

            static StateSpace of(TransferFunction plant) {
                double[] den = plant.denominator();
                double[] num = plant.numerator();
                int n = den.length - 1;
                double lead = den[0];
                double[] b = new double[n + 1];
                System.arraycopy(num, 0, b, n + 1 - num.length, num.length);
                double b0 = b[0] / lead;
                RealMatrix a = MatrixUtils.createRealMatrix(n, n);
                RealVector c = new ArrayRealVector(n);
                for (int i = 1; i <= n; i++) {
                    double ai = den[i] / lead;
                    a.setEntry(0, i - 1, -ai);
                    c.setEntry(i - 1, b[i] / lead - ai * b0);
                    if (i < n) {
                        a.setEntry(i, i - 1, 1.0);
                    }
                }
                RealVector bVector = new ArrayRealVector(n);
                bVector.setEntry(0, 1.0);
                return new StateSpace(a, bVector, c, b0);
            }

            int order() {
                return dynamics.getRowDimension();
            }
        }

        static PulseTransferFunction of(TransferFunction plant, double periodSeconds) {
            double periods = plant.deadTimeSeconds() / periodSeconds;
            int wholeDelay = (int) Math.floor(periods);
            double fraction = periods - wholeDelay;
            if (fraction > 1.0 - WHOLE_PERIOD_TOLERANCE) {
                wholeDelay++;
                fraction = 0.0;
            } else if (fraction < WHOLE_PERIOD_TOLERANCE) {
                fraction = 0.0;
            }
            double tau = fraction * periodSeconds;

            StateSpace model = StateSpace.of(plant);
            int n = model.order();
            RealMatrix afterSwitch = holdIntegral(model, periodSeconds - tau);
            RealMatrix beforeSwitch = holdIntegral(model, tau);
            RealMatrix phiLate = afterSwitch.getSubMatrix(0, n - 1, 0, n - 1);
            RealVector gammaNow = afterSwitch.getColumnVector(n).getSubVector(0, n);
            RealMatrix phi = phiLate.multiply(beforeSwitch.getSubMatrix(0, n - 1, 0, n - 1));
            RealVector gammaPrevious = phiLate.operate(beforeSwitch.getColumnVector(n).getSubVector(0, n));

            double[] characteristic = new double[n + 1];
            double[] nowTerms = new double[n];
            double[] previousTerms = new double[n];
            RealMatrix m = MatrixUtils.createRealIdentityMatrix(n);
            characteristic[n] = 1.0;
            for (int k = 1; k <= n; k++) {
                nowTerms[n - k] = model.output().dotProduct(m.operate(gammaNow));
                previousTerms[n - k] = model.output().dotProduct(m.operate(gammaPrevious));
                RealMatrix phiM = phi.multiply(m);
                double c = -phiM.getTrace() / k;
                characteristic[n - k] = c;
                m = phiM.add(MatrixUtils.createRealIdentityMatrix(n).scalarMultiply(c));
            }
            PolynomialFunction det = new PolynomialFunction(characteristic);
            PolynomialFunction now = new PolynomialFunction(nowTerms);
            PolynomialFunction previous = new PolynomialFunction(previousTerms);
            PolynomialFunction feedthrough = det.multiply(PulseTransferFunction.constant(model.feedthrough()));
            PolynomialFunction z = new PolynomialFunction(0.0, 1.0);
            if (tau == 0.0) {
                return new PulseTransferFunction(now.add(feedthrough), det, wholeDelay, periodSeconds);
            }
            return new PulseTransferFunction(now.multiply(z).add(previous).add(feedthrough), det.multiply(z),
                    wholeDelay, periodSeconds);
        }

        private static RealMatrix holdIntegral(StateSpace model, double seconds) {
            int n = model.order();
            RealMatrix augmented = MatrixUtils.createRealMatrix(n + 1, n + 1);
            augmented.setSubMatrix(model.dynamics().scalarMultiply(seconds).getData(), 0, 0);
            augmented.setColumnVector(n, model.input().mapMultiply(seconds).append(0.0));
            return MatrixUtils.matrixExponential(augmented);
        }
    }
}
