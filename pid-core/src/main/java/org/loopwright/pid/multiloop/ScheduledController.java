package org.loopwright.pid.multiloop;

import java.util.Objects;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.PidController;

/**
 * A controller whose gains follow a {@link GainSchedule}; every other setting comes from a base.
 *
 * <p>The update allocates nothing: at construction the settings are built once for every table
 * point and for {@code stepsPerSegment − 1} evenly spaced values between each pair of neighbours,
 * and each update hands the controller the precomputed settings nearest to the interpolated ones.
 * A change of settings goes through {@link PidController#retune}, so it is bumpless by the retune
 * rule (the integral absorbs the change of the proportional term). The gains are exact at the table
 * points and within half a step of the linear interpolation between them: with the default 64
 * steps, within 0.8 % of the difference between the neighbours.
 *
 * <p>A non-finite scheduling variable keeps the settings in force (the sample itself is then
 * judged by the controller's fault policy). Beyond the ends of the table the end point's gains hold.
 *
 * <p>Example: {@code ScheduledController level = new ScheduledController(base, schedule);}, then
 * {@code double valvePercent = level.update(setpointMetres, levelMetres);} once per sample period.
 *
 * <p>Not thread-safe: one loop thread calls {@code update} and {@link #externalValue}. Retune
 * through a new scheduled controller, not through {@link #controller()}: its next change of
 * schedule step would undo a direct retune.
 */
public final class ScheduledController {

    /** Default number of precomputed steps between two table points. */
    public static final int DEFAULT_STEPS_PER_SEGMENT = 64;

    /** Most steps between two table points: finer buys nothing measurable and costs memory. */
    public static final int MAX_STEPS_PER_SEGMENT = 4096;

    private final GainSchedule schedule;
    private final int stepsPerSegment;
    private final ControllerSettings[] steps;
    private final PidController controller;
    private int current;
    private double external = Double.NaN;

    /**
     * A schedule with {@link #DEFAULT_STEPS_PER_SEGMENT}.
     *
     * @param base the settings every step starts from; the schedule sets only the gains
     * @param schedule the gain table
     */
    public ScheduledController(ControllerSettings base, GainSchedule schedule) {
        this(base, schedule, DEFAULT_STEPS_PER_SEGMENT);
    }

    /**
     * Builds the settings of every step, starting at the first table point's.
     *
     * @param base the settings every step starts from; the schedule sets only the gains
     * @param schedule the gain table
     * @param stepsPerSegment precomputed steps between two neighbouring table points, 1..{@value
     *         #MAX_STEPS_PER_SEGMENT}
     * @throws InvalidSettingException when the steps are out of 1..{@value #MAX_STEPS_PER_SEGMENT},
     *         or the base settings cannot take a point's gains (the message names the point)
     */
    public ScheduledController(ControllerSettings base, GainSchedule schedule, int stepsPerSegment) {
        Objects.requireNonNull(base, "base");
        this.schedule = Objects.requireNonNull(schedule, "schedule");
        if (stepsPerSegment < 1 || stepsPerSegment > MAX_STEPS_PER_SEGMENT) {
            throw new InvalidSettingException("stepsPerSegment", stepsPerSegment,
                    "must be between 1 and " + MAX_STEPS_PER_SEGMENT);
        }
        this.stepsPerSegment = stepsPerSegment;
        steps = new ControllerSettings[(schedule.size() - 1) * stepsPerSegment + 1];
        for (int k = 0; k < steps.length; k++) {
            int point = k / stepsPerSegment;
            try {
                steps[k] = base.toBuilder()
                        .gains(schedule.blend(point, (k % stepsPerSegment) / (double) stepsPerSegment))
                        .build();
            } catch (InvalidSettingException e) {
                throw new InvalidSettingException("points[" + point + "]", e.getMessage(),
                        "must give gains the base settings accept");
            }
        }
        controller = new PidController(steps[0]);
    }

    /**
     * One fixed-period update, with the settings for the scheduling variable's value now.
     *
     * @param setpoint    r, in process units
     * @param measurement y, in process units
     * @return the controller's output
     */
    public double update(double setpoint, double measurement) {
        double value = switch (schedule.variable()) {
            case MEASUREMENT -> measurement;
            case SETPOINT -> setpoint;
            case EXTERNAL -> external;
        };
        if (Double.isFinite(value)) {
            int segment = schedule.segment(value);
            int step = segment * stepsPerSegment
                    + (int) Math.round(schedule.fraction(segment, value) * stepsPerSegment);
            if (step != current) {
                current = step;
                controller.retune(steps[step]);
            }
        }
        return controller.update(setpoint, measurement);
    }

    /**
     * Back to the state of a new scheduled controller: the controller reset, the first point's
     * settings published, no external value. For a simulation that starts again from rest.
     */
    public void reset() {
        current = 0;
        external = Double.NaN;
        controller.retune(steps[0]);
        controller.reset();
    }

    /**
     * Sets the scheduling variable for {@link ScheduleVariable#EXTERNAL}; ignored by the others.
     *
     * @param value the scheduling variable's value, in its own units
     */
    public void externalValue(double value) {
        external = value;
    }

    /** {@return the settings in force from the next update on} */
    public ControllerSettings settings() {
        return steps[current];
    }

    /** {@return the schedule} */
    public GainSchedule schedule() {
        return schedule;
    }

    /** {@return the controller, for its modes, inputs and status} */
    public PidController controller() {
        return controller;
    }
}
