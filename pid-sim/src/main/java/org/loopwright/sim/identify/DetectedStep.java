package org.loopwright.sim.identify;

import java.util.Locale;

import org.loopwright.sim.config.InputFileException;

/**
 * The one step found in a step test's input: the input holds {@code initialInput} up to the sample
 * before {@code index} and {@code finalInput} from it on.
 *
 * <p>Detection: the initial and final levels are the first and last input samples; the step is at
 * the first sample whose input is past the middle between them. The change must exceed
 * {@link #MIN_RELATIVE_CHANGE} of the larger level (or an absolute 1e-9 near zero), and every
 * input before the step must stay within {@link #HOLD_TOLERANCE} of the change around the initial
 * level, and every one after it around the final level: one clean step, as a bump test is made.
 *
 * @param index        the first sample at the new level
 * @param timeSeconds  the time of that sample
 * @param initialInput the input before the step
 * @param finalInput   the input after the step
 */
public record DetectedStep(int index, double timeSeconds, double initialInput, double finalInput) {

    /** Smallest step, relative to the larger input level, that counts as one. */
    public static final double MIN_RELATIVE_CHANGE = 1e-6;
    /** How far, as a fraction of the step, the input may wander before and after it. */
    public static final double HOLD_TOLERANCE = 0.05;

    /** finalInput − initialInput. */
    public double change() {
        return finalInput - initialInput;
    }

    /**
     * Finds the step in a step test's input.
     *
     * @throws InputFileException naming the file, and the row and column where the data is not one
     *                            clean step, or saying that the input holds no step
     */
    public static DetectedStep find(StepTest test) {
        double[] u = test.inputs();
        int n = u.length;
        double initial = u[0];
        double last = u[n - 1];
        double change = last - initial;
        double scale = Math.max(Math.abs(initial), Math.abs(last));
        if (Math.abs(change) <= Math.max(1e-9, MIN_RELATIVE_CHANGE * scale)) {
            throw InputFileException.whole(test.fileName(), "holds no step: column 'input' starts and ends at "
                    + format(initial) + " (a step test needs one step in the input)");
        }
        int index = 1;
        while ((u[index] - initial) / change < 0.5) {
            index++;
        }
        double tolerance = HOLD_TOLERANCE * Math.abs(change);
        for (int i = 0; i < n; i++) {
            double level = i < index ? initial : last;
            if (Math.abs(u[i] - level) > tolerance) {
                throw InputFileException.inRow(test.fileName(), i + 2, "input", "must hold one step from "
                        + format(initial) + " to " + format(last) + " (at row " + (index + 2) + "), within "
                        + format(tolerance) + ": input=" + format(u[i]));
            }
        }
        return new DetectedStep(index, test.timesSeconds()[index], initial, last);
    }

    private static String format(double value) {
        return String.format(Locale.ROOT, "%.6g", value);
    }
}
