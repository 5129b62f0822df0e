package org.loopwright.pid.multiloop;

import java.util.Objects;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;

/**
 * One controller output spread over two actuators that act in opposite directions, such as the
 * cooling and the heating of a bath. Below the split the first actuator works, from full at the
 * bottom of the controller's output range to idle at the split; above it the second works, from
 * idle at the split to full at the top. An optional gap centred on the split leaves both idle, so
 * the two never fight around the balance point; each actuator maps linearly onto its own range.
 *
 * <pre>
 *   output:   outputMin ......... split − gap/2 | gap | split + gap/2 ......... outputMax
 *   first:    first.max  ↘        first.min       idle                          first.min
 *   second:   second.min                          idle   second.min  ↗          second.max
 * </pre>
 *
 * <p>The controller's output range is the combined range (common practice for split range), so
 * its windup protection sees the combined limits: it stops winding up when the first actuator is
 * full at the bottom or the second at the top, and nowhere between. Both mappings are continuous
 * in the output, across the split and the gap, and each stays within its actuator's range.
 *
 * <p>Example: output 0–100 %, split at 50, no gap, cooling 0–100 % and heating 0–2000 W:
 * an output of 25 % is cooling 50 %, heating 0 W; 75 % is cooling 0 %, heating 1000 W.
 *
 * <p>Thread-safe: immutable.
 */
public final class SplitRange {

    private final double outputMin;
    private final double outputMax;
    private final double splitAt;
    private final double gap;
    private final ActuatorRange first;
    private final ActuatorRange second;
    private final double firstEnd;
    private final double secondStart;

    /**
     * A split of the output range of the settings.
     *
     * @param settings the controller's settings, whose finite output range is the combined range
     * @param splitAt the controller output at which the split lies, inside the output range
     * @param gap the width of the band around the split where both actuators are idle, finite and &ge; 0
     * @param first the range of the actuator that works below the split
     * @param second the range of the actuator that works above the split
     * @throws InvalidSettingException naming the value, when the output range is not finite, the
     *         split and gap do not leave each actuator part of it, the gap is negative, or an
     *         actuator's range is not finite with min below max
     */
    public SplitRange(ControllerSettings settings, double splitAt, double gap, ActuatorRange first,
            ActuatorRange second) {
        outputMin = settings.outputMin();
        outputMax = settings.outputMax();
        if (!Double.isFinite(outputMin) || !Double.isFinite(outputMax)) {
            throw new InvalidSettingException("outputMax", outputMax,
                    "must be finite, and outputMin too, for a split range (outputMin=" + outputMin + ")");
        }
        if (!Double.isFinite(gap) || gap < 0.0) {
            throw new InvalidSettingException("gap", gap, "must be finite and >= 0");
        }
        if (!(splitAt - gap / 2.0 > outputMin && splitAt + gap / 2.0 < outputMax)) {
            throw new InvalidSettingException("splitAt", splitAt, "must leave each actuator part of the output range:"
                    + " outputMin < splitAt - gap/2 and splitAt + gap/2 < outputMax (outputMin=" + outputMin
                    + ", outputMax=" + outputMax + ", gap=" + gap + ")");
        }
        this.splitAt = splitAt;
        this.gap = gap;
        this.first = checked("first", Objects.requireNonNull(first, "first"));
        this.second = checked("second", Objects.requireNonNull(second, "second"));
        firstEnd = splitAt - gap / 2.0;
        secondStart = splitAt + gap / 2.0;
    }

    private static ActuatorRange checked(String name, ActuatorRange range) {
        if (!Double.isFinite(range.min())) {
            throw new InvalidSettingException(name + ".min", range.min(), "must be finite");
        }
        if (!Double.isFinite(range.max()) || !(range.max() > range.min())) {
            throw new InvalidSettingException(name + ".max", range.max(),
                    "must be finite and > " + name + ".min (" + name + ".min=" + range.min() + ")");
        }
        return range;
    }

    /**
     * The first actuator's value for a controller output (clamped to the output range first).
     *
     * @param output the controller output
     * @return the first actuator's value, within its range
     */
    public double first(double output) {
        double u = clampToRange(output);
        if (u >= firstEnd) {
            return first.min();
        }
        // rounding may carry a + (b − a)·1 past b: the range holds
        return Math.min(first.max(), first.min() + (first.max() - first.min()) * (firstEnd - u) / (firstEnd - outputMin));
    }

    /**
     * The second actuator's value for a controller output (clamped to the output range first).
     *
     * @param output the controller output
     * @return the second actuator's value, within its range
     */
    public double second(double output) {
        double u = clampToRange(output);
        if (u <= secondStart) {
            return second.min();
        }
        return Math.min(second.max(),
                second.min() + (second.max() - second.min()) * (u - secondStart) / (outputMax - secondStart));
    }

    /**
     * The controller output that the two actuators' measured values stand for, for
     * {@code windup: actuator-tracking}: the working actuator decides (the first if both work), and
     * both idle is the split point.
     *
     * @param firstValue the first actuator's measured value, in its own units
     * @param secondValue the second actuator's measured value, in its own units
     * @return the equivalent controller output, within the output range
     */
    public double outputFor(double firstValue, double secondValue) {
        double f = Math.max(first.min(), Math.min(first.max(), firstValue));
        if (f > first.min()) {
            return firstEnd - (firstEnd - outputMin) * (f - first.min()) / (first.max() - first.min());
        }
        double s = Math.max(second.min(), Math.min(second.max(), secondValue));
        if (s > second.min()) {
            return secondStart + (outputMax - secondStart) * (s - second.min()) / (second.max() - second.min());
        }
        return splitAt;
    }

    private double clampToRange(double output) {
        return output < outputMin ? outputMin : Math.min(output, outputMax);
    }

    /** {@return the controller output at which the split lies} */
    public double splitAt() {
        return splitAt;
    }

    /** {@return the width of the band around the split where both actuators are idle} */
    public double gap() {
        return gap;
    }

    /** {@return the actuator below the split} */
    public ActuatorRange firstRange() {
        return first;
    }

    /** {@return the actuator above the split} */
    public ActuatorRange secondRange() {
        return second;
    }

    /** {@return the bottom of the combined range (the controller's output minimum)} */
    public double outputMin() {
        return outputMin;
    }

    /** {@return the top of the combined range (the controller's output maximum)} */
    public double outputMax() {
        return outputMax;
    }
}
