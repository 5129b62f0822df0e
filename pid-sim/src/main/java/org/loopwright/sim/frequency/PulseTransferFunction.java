package org.loopwright.sim.frequency;

import java.util.Objects;

import org.hipparchus.analysis.polynomials.PolynomialFunction;
import org.hipparchus.complex.Complex;
import org.loopwright.pid.discrete.DiscretePid;

/**
 * A sampled system H(z) = B(z)/A(z)·z^(−d): two polynomials in z (coefficients in ascending powers,
 * as {@link PolynomialFunction} holds them), a whole number d of samples of pure delay, kept apart so
 * a long delay costs no accuracy, and the sample period h.
 *
 * <p>Example: a Tustin PI controller, Kp = 2, Ki = 0.5, h = 0.1 s, is
 * (2 + 0.025·(z + 1)/(z − 1)), i.e. B = −1.975 + 2.025·z, A = −1 + z, d = 0.
 * Thread-safe: immutable.
 *
 * @param numerator     B(z), ascending powers
 * @param denominator   A(z), ascending powers, not identically zero
 * @param delaySamples  d &ge; 0
 * @param periodSeconds h &gt; 0
 */
public record PulseTransferFunction(PolynomialFunction numerator, PolynomialFunction denominator, int delaySamples,
        double periodSeconds) implements FrequencyResponse {

    /** Checks the parts. */
    public PulseTransferFunction {
        Objects.requireNonNull(numerator, "numerator");
        Objects.requireNonNull(denominator, "denominator");
        if (denominator.degree() == 0 && denominator.value(0.0) == 0.0) {
            throw new IllegalArgumentException("denominator must not be identically zero: denominator=0");
        }
        if (delaySamples < 0) {
            throw new IllegalArgumentException("delay must be >= 0 samples: delaySamples=" + delaySamples);
        }
        if (!Double.isFinite(periodSeconds) || periodSeconds <= 0.0) {
            throw new IllegalArgumentException("period must be finite and > 0: periodSeconds=" + periodSeconds);
        }
    }

    /**
     * The controller's pulse-transfer function from error to output, from the coefficients the running
     * controller uses: C(z) = Kp + (b0 + b1·z⁻¹)/(1 − z⁻¹) + bd·(1 − z⁻¹)/(1 − ad·z⁻¹). A term
     * whose coefficients are zero is left out, so a PI controller has no spurious pole at ad = 0 and a PD
     * controller none at z = 1.
     */
    public static PulseTransferFunction of(DiscretePid pid) {
        PolynomialFunction num = constant(pid.proportionalGain());
        PolynomialFunction den = constant(1.0);
        double b0 = pid.integralWeightOnCurrent();
        double b1 = pid.integralWeightOnPrevious();
        if (b0 != 0.0 || b1 != 0.0) {
            // (b0·z + b1)/(z − 1)
            PolynomialFunction termDen = new PolynomialFunction(-1.0, 1.0);
            num = num.multiply(termDen).add(new PolynomialFunction(b1, b0).multiply(den));
            den = den.multiply(termDen);
        }
        double bd = pid.derivativeGain();
        if (bd != 0.0) {
            // bd·(z − 1)/(z − ad)
            PolynomialFunction termDen = new PolynomialFunction(-pid.derivativePole(), 1.0);
            num = num.multiply(termDen).add(new PolynomialFunction(-bd, bd).multiply(den));
            den = den.multiply(termDen);
        }
        return new PulseTransferFunction(num, den, 0, pid.periodSeconds());
    }

    /** The Nyquist frequency π/h in rad/s: the response repeats (mirrored) beyond it. */
    public double nyquistRadPerSecond() {
        return Math.PI / periodSeconds;
    }

    @Override
    public Complex at(double omegaRadPerSecond) {
        double angle = omegaRadPerSecond * periodSeconds;
        double re = Math.cos(angle);
        double im = Math.sin(angle);
        Complex delay = new Complex(Math.cos(-angle * delaySamples), Math.sin(-angle * delaySamples));
        return horner(numerator.getCoefficients(), re, im).divide(horner(denominator.getCoefficients(), re, im))
                .multiply(delay);
    }

    /**
     * A polynomial (ascending coefficients) at z = re + j·im by Horner's rule in plain doubles: the
     * frequency analyses evaluate loops thousands of times, and Hipparchus' generic field evaluation
     * allocates a complex number per term.
     */
    private static Complex horner(double[] ascending, double re, double im) {
        double sumRe = 0.0;
        double sumIm = 0.0;
        for (int i = ascending.length - 1; i >= 0; i--) {
            double nextRe = sumRe * re - sumIm * im + ascending[i];
            sumIm = sumRe * im + sumIm * re;
            sumRe = nextRe;
        }
        return new Complex(sumRe, sumIm);
    }

    /** Two sampled blocks in series at the same period. */
    public PulseTransferFunction times(PulseTransferFunction other) {
        if (other.periodSeconds != periodSeconds) {
            throw new IllegalArgumentException("periods must match: periodSeconds=" + other.periodSeconds
                    + ", expected " + periodSeconds);
        }
        return new PulseTransferFunction(numerator.multiply(other.numerator), denominator.multiply(other.denominator),
                delaySamples + other.delaySamples, periodSeconds);
    }

    /** This system times a real constant. */
    @Override
    public PulseTransferFunction times(double factor) {
        return new PulseTransferFunction(numerator.multiply(constant(factor)), denominator, delaySamples,
                periodSeconds);
    }

    /**
     * The characteristic polynomial of the unity negative-feedback loop around this loop transfer
     * function: A(z)·z^d + B(z), whose roots are the closed-loop poles (pole–zero cancellations kept, so
     * a hidden unstable mode still shows).
     */
    public PolynomialFunction closedLoopCharacteristic() {
        double[] a = denominator.getCoefficients();
        double[] shifted = new double[a.length + delaySamples];
        System.arraycopy(a, 0, shifted, delaySamples, a.length);
        return new PolynomialFunction(shifted).add(numerator);
    }

    static PolynomialFunction constant(double value) {
        return new PolynomialFunction(value);
    }
}
