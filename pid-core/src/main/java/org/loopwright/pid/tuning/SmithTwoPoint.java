package org.loopwright.pid.tuning;

import java.util.Locale;

import org.loopwright.pid.InvalidSettingException;

/**
 * Smith's two-point estimate of a first-order-plus-dead-time model from a step test, with no
 * optimiser: with t28 and t63 the times (after the step) at which the output has made 28.3 % and
 * 63.2 % of its change, T = 1.5·(t63 − t28) and L = t63 − T (C.L. Smith, <i>Digital Computer Process
 * Control</i>, Intext, 1972; recalled from memory). The two fractions are where e^(−t/T) curves of
 * one time constant pass 1/3 and 1 time constant after the dead time: 1 − e^(−1/3) = 0.283 and
 * 1 − e^(−1) = 0.632.
 *
 * <p>The initial level is the mean of the samples before the step (the first sample if there are
 * none); the final level is the mean of the last tenth of the samples, so the record must end
 * settled. Crossing times are interpolated linearly between samples. A negative L, which noise
 * can produce, is reported as 0.
 *
 * <p>Example: the step response of 2·e^(−s)/(5s + 1) to a unit step at t = 0 gives K = 2, T = 5 s,
 * L = 1 s.
 *
 * <p>Thread-safe: stateless.
 */
public final class SmithTwoPoint {

    /** Fraction of the change at the first time point: 1 − e^(−1/3). */
    public static final double FIRST_FRACTION = 0.283;
    /** Fraction of the change at the second time point: 1 − e^(−1). */
    public static final double SECOND_FRACTION = 0.632;

    private SmithTwoPoint() {
    }

    /**
     * Estimates a model from one step test.
     *
     * @param timesSeconds     sample times, finite and strictly increasing, at least 3
     * @param outputs          the process variable at those times, finite
     * @param stepTimeSeconds  when the input stepped
     * @param inputChange      the size of the input step, finite and non-zero
     * @return the first-order-plus-dead-time model the step response fits
     * @throws InvalidSettingException for arrays of different lengths, too few samples, times not
     *                                 increasing, non-finite values or no change in the output
     */
    public static FopdtModel estimate(double[] timesSeconds, double[] outputs, double stepTimeSeconds,
                                      double inputChange) {
        checkSamples(timesSeconds, outputs);
        if (!Double.isFinite(inputChange) || inputChange == 0.0) {
            throw new InvalidSettingException("inputChange", inputChange, "must be finite and non-zero");
        }
        if (!Double.isFinite(stepTimeSeconds)) {
            throw new InvalidSettingException("stepTimeSeconds", stepTimeSeconds, "must be finite");
        }
        int n = timesSeconds.length;
        double initial = 0.0;
        int before = 0;
        while (before < n && timesSeconds[before] < stepTimeSeconds) {
            initial += outputs[before];
            before++;
        }
        initial = before == 0 ? outputs[0] : initial / before;
        int tail = Math.max(1, n / 10);
        double last = 0.0;
        for (int i = n - tail; i < n; i++) {
            last += outputs[i];
        }
        double change = last / tail - initial;
        if (change == 0.0) {
            throw new InvalidSettingException("outputs", "constant " + initial,
                    "must change after the step to estimate a model");
        }
        double t28 = crossingTime(timesSeconds, outputs, before, initial, change, FIRST_FRACTION);
        double t63 = crossingTime(timesSeconds, outputs, before, initial, change, SECOND_FRACTION);
        double timeConstant = 1.5 * (t63 - t28); // > 0: the 63.2 % point is interpolated after the 28.3 % one
        double deadTime = Math.max(0.0, t63 - stepTimeSeconds - timeConstant);
        return new FopdtModel(change / inputChange, timeConstant, deadTime);
    }

    private static double crossingTime(double[] t, double[] y, int from, double initial, double change,
                                       double fraction) {
        for (int i = Math.max(from, 1); i < t.length; i++) {
            double previous = (y[i - 1] - initial) / change;
            double current = (y[i] - initial) / change;
            if (current >= fraction && previous < fraction) {
                return t[i - 1] + (fraction - previous) / (current - previous) * (t[i] - t[i - 1]);
            }
        }
        throw new InvalidSettingException("outputs", "last=" + y[y.length - 1],
                "must reach " + String.format(Locale.ROOT, "%.1f", fraction * 100.0) + " % of the change after the step");
    }

    private static void checkSamples(double[] t, double[] y) {
        if (t.length != y.length) {
            throw new InvalidSettingException("outputs", y.length + " samples",
                    "must have as many samples as timesSeconds (" + t.length + ")");
        }
        if (t.length < 3) {
            throw new InvalidSettingException("timesSeconds", t.length + " samples", "must have at least 3 samples");
        }
        for (int i = 0; i < t.length; i++) {
            if (!Double.isFinite(t[i]) || (i > 0 && t[i] <= t[i - 1])) {
                throw new InvalidSettingException("timesSeconds[" + i + "]", t[i], "must be finite and increasing");
            }
            if (!Double.isFinite(y[i])) {
                throw new InvalidSettingException("outputs[" + i + "]", y[i], "must be finite");
            }
        }
    }
}
