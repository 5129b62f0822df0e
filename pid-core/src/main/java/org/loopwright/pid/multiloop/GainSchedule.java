package org.loopwright.pid.multiloop;

import java.util.List;
import java.util.Objects;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.ParallelGains;

/**
 * A table of gains against a scheduling variable, validated once: at least one point, every
 * {@code at} finite and strictly increasing. Between two points the gains are interpolated
 * linearly in the <b>parallel form</b> (Kp, Ki, Kd); beyond the ends they hold the end point's.
 *
 * <p>Why the parallel form: the control law is linear in Kp, Ki and Kd, so the law between two
 * points is the same blend of the two neighbours' laws for any error history, and the discrete
 * coefficients (linear in those gains) blend the same way. A point without integral action
 * (Ti = ∞, Ki = 0) or without derivative action blends smoothly into one with it, which cannot be
 * done in Ti. Interpolating Kc, Ti, Td instead gives Ki = Kc/Ti, which between a point with
 * (Kc, Ti) = (2, 30 s) and one with (0.8, 45 s) halfway is 1.4/37.5 = 0.0373 /s, not the mean of
 * 0.0667 and 0.0178, 0.0422 /s: neither is wrong, but only the parallel one is a blend of the two
 * tuned laws.
 *
 * <p>Example: {@code new GainSchedule(ScheduleVariable.MEASUREMENT, List.of(new SchedulePoint(20,
 * IdealGains.pi(2.0, 30.0)), new SchedulePoint(80, IdealGains.pi(0.8, 45.0))))}.
 *
 * <p>Thread-safe: immutable.
 */
public final class GainSchedule {

    private final ScheduleVariable variable;
    private final double[] at;
    private final ParallelGains[] gains;

    /**
     * @param variable what the schedule is indexed by
     * @param points the table rows, at least one, with {@code at} finite and strictly increasing
     * @throws InvalidSettingException naming the point, when there is none, or an {@code at} is not
     *         finite or not above the previous one
     */
    public GainSchedule(ScheduleVariable variable, List<SchedulePoint> points) {
        this.variable = Objects.requireNonNull(variable, "variable");
        if (points.isEmpty()) {
            throw new InvalidSettingException("points", "[]", "must hold at least one point");
        }
        at = new double[points.size()];
        gains = new ParallelGains[points.size()];
        for (int i = 0; i < at.length; i++) {
            SchedulePoint p = points.get(i);
            String field = "points[" + i + "].at";
            if (!Double.isFinite(p.at())) {
                throw new InvalidSettingException(field, p.at(), "must be finite");
            }
            if (i > 0 && !(p.at() > at[i - 1])) {
                throw new InvalidSettingException(field, p.at(), "must be greater than the previous point's (points["
                        + (i - 1) + "].at=" + at[i - 1] + ")");
            }
            at[i] = p.at();
            gains[i] = p.gains().toParallel();
        }
    }

    /** {@return what the schedule is indexed by} */
    public ScheduleVariable variable() {
        return variable;
    }

    /** {@return the number of points} */
    public int size() {
        return at.length;
    }

    /**
     * The scheduling variable's value at point i.
     *
     * @param i the point's index, 0 to {@link #size()} − 1
     * @return the {@code at} of that point
     */
    public double at(int i) {
        return at[i];
    }

    /**
     * The interpolated gains at a value of the scheduling variable (held beyond the ends).
     * Allocates a result: for set-up and analysis, not for the update.
     *
     * @param value the scheduling variable's value, in its own units
     * @return the parallel gains there
     */
    public ParallelGains gainsAt(double value) {
        int i = segment(value);
        return blend(i, fraction(i, value));
    }

    /** The gains a fraction 0..1 of the way from point i to point i + 1 (point i alone when it is the last). */
    ParallelGains blend(int i, double fraction) {
        if (i == at.length - 1 || fraction <= 0.0) {
            return gains[i];
        }
        if (fraction >= 1.0) {
            return gains[i + 1];
        }
        ParallelGains lo = gains[i];
        ParallelGains hi = gains[i + 1];
        return new ParallelGains(mix(lo.proportionalGain(), hi.proportionalGain(), fraction),
                mix(lo.integralGain(), hi.integralGain(), fraction),
                mix(lo.derivativeGain(), hi.derivativeGain(), fraction));
    }

    private static double mix(double lo, double hi, double fraction) {
        return lo + (hi - lo) * fraction;
    }

    /** The segment that holds the value: the last point at or below it, 0 below the first. No allocation. */
    int segment(double value) {
        int i = 0;
        while (i + 1 < at.length && value >= at[i + 1]) {
            i++;
        }
        return i;
    }

    /** How far the value lies from point i towards point i + 1, within 0..1; 0 on the last point. */
    double fraction(int i, double value) {
        if (i == at.length - 1) {
            return 0.0;
        }
        double f = (value - at[i]) / (at[i + 1] - at[i]);
        return f < 0.0 ? 0.0 : Math.min(f, 1.0);
    }
}
