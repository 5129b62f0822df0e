package org.loopwright.pid.multiloop;

import java.util.Objects;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;

/**
 * Two controllers in cascade: the outer (primary) controller's output is the inner (secondary)
 * controller's setpoint, and the inner controller's output drives the actuator. Call
 * {@link #update} once per inner sample period; it runs the outer controller on every n-th call,
 * where n is the ratio of the two sample periods (a whole number, 1 or more), and holds the inner
 * setpoint in between.
 *
 * <p>The outer loop does not wind up. It runs {@link WindupProtection#ACTUATOR_TRACKING}, and the
 * cascade feeds it, as the position its output actually took, the inner setpoint in force when the
 * inner loop follows it, and the inner measurement while the inner output was limited at any
 * sample of the outer period. This is external reset feedback: with the default tracking time
 * Tt = Ti of a PI controller, back-calculation I' = Ki·e + (v − u)/Tt reduces to Ti·I' = v − I, the
 * reset filter fed by the realised signal v (Åström &amp; Hägglund, <i>Advanced PID Control</i>,
 * 2006, §3.5). It was chosen over switching the outer controller to tracking mode on saturation
 * because it keeps the outer loop in control while it pulls in the right direction, needs no mode
 * logic at the saturation edge, and leaves the outer law untouched while nothing is limited (so the
 * linear analysis of the cascade holds). The outer output range is the inner setpoint range: a
 * clamped inner setpoint is the outer controller's own limit.
 *
 * <p>Local and manual are handled by tracking mode. While the inner loop is {@link CascadeMode#LOCAL}
 * the outer controller tracks the local setpoint; while the inner controller is outside automatic it
 * tracks the inner measurement, and so does the inner setpoint (so that the inner loop returns to
 * automatic with no error to jump on). The outer controller leaves tracking on the first outer
 * sample after the cause has gone (a local spell between two outer samples counts): that sample
 * still tracks the inner setpoint then in force, and the outer law resumes from it one outer period
 * later, so the inner setpoint never steps.
 *
 * <p>Example: a position loop every 10 ms around a speed loop every 1 ms,
 * {@code new Cascade(new PidController(position), new PidController(speed))}, then once per
 * millisecond {@code double volts = axis.update(targetDegrees, degrees, rpm);}.
 *
 * <p>Not thread-safe: one loop thread calls {@code update} and the mode methods; either
 * controller's {@code retune} may be called from any thread, but must keep its sample period and,
 * for the outer controller, its windup protection.
 */
public final class Cascade {

    private final PidController outer;
    private final PidController inner;
    private final int innerSamplesPerOuterSample;

    private int innerSample;
    private CascadeMode mode = CascadeMode.CASCADE;
    private double localSetpoint;
    private double innerSetpoint;
    private boolean innerLimitedThisPeriod;
    private boolean outerFollowing;
    private boolean localSinceOuterSample;
    private Mode outerModeBeforeFollowing = Mode.AUTOMATIC;

    /**
     * Couples two controllers, both in the state they are in.
     *
     * @param outer the primary controller, whose output is the inner setpoint; it must run {@link
     *         WindupProtection#ACTUATOR_TRACKING}
     * @param inner the secondary controller, whose sample period divides the outer one's
     * @throws InvalidSettingException when the outer controller does not run
     *         {@link WindupProtection#ACTUATOR_TRACKING} or its sample period is not a whole multiple of
     *         the inner one's
     */
    public Cascade(PidController outer, PidController inner) {
        this.outer = Objects.requireNonNull(outer, "outer");
        this.inner = Objects.requireNonNull(inner, "inner");
        innerSamplesPerOuterSample = requireCompatible(outer.settings(), inner.settings());
        innerSetpoint = outer.position();
    }

    /**
     * Checks that two controllers' settings can form a cascade.
     *
     * @param outer the primary controller's settings
     * @param inner the secondary controller's settings
     * @return the whole number n of inner samples per outer sample
     * @throws InvalidSettingException when the outer settings do not use
     *         {@link WindupProtection#ACTUATOR_TRACKING} or the periods are not in a whole ratio
     */
    public static int requireCompatible(ControllerSettings outer, ControllerSettings inner) {
        if (outer.windupProtection() != WindupProtection.ACTUATOR_TRACKING) {
            throw new InvalidSettingException("outerWindupProtection", outer.windupProtection(),
                    "must be ACTUATOR_TRACKING, so that the outer loop tracks what the inner loop achieves");
        }
        return samplesPerOuterSample(outer.samplePeriodSeconds(), inner.samplePeriodSeconds());
    }

    /**
     * The whole number n of inner samples per outer sample.
     *
     * @param outerPeriodSeconds the outer sample period in seconds
     * @param innerPeriodSeconds the inner sample period in seconds
     * @return n, &ge; 1
     * @throws InvalidSettingException when the outer period is not n times the inner one, n &ge; 1
     *         (to a relative 10⁻⁹, for periods written in decimal)
     */
    public static int samplesPerOuterSample(double outerPeriodSeconds, double innerPeriodSeconds) {
        double ratio = outerPeriodSeconds / innerPeriodSeconds;
        long whole = Math.round(ratio);
        if (whole < 1 || whole > Integer.MAX_VALUE || Math.abs(ratio - whole) > 1e-9 * ratio) {
            throw new InvalidSettingException("outerSamplePeriodSeconds", outerPeriodSeconds,
                    "must be a whole multiple (1, 2, 3, ...) of innerSamplePeriodSeconds (innerSamplePeriodSeconds="
                            + innerPeriodSeconds + ")");
        }
        return (int) whole;
    }

    /**
     * One inner sample period.
     *
     * @param outerSetpoint    the outer loop's setpoint, in outer process units
     * @param outerMeasurement the outer loop's measurement (read on outer samples only)
     * @param innerMeasurement the inner loop's measurement, in inner process units
     * @return the inner controller's output, for the actuator
     */
    public double update(double outerSetpoint, double outerMeasurement, double innerMeasurement) {
        if (innerSample == 0) {
            runOuter(outerSetpoint, outerMeasurement, innerMeasurement);
            innerLimitedThisPeriod = false;
        }
        innerSample = innerSample + 1 == innerSamplesPerOuterSample ? 0 : innerSample + 1;
        double output = inner.update(innerSetpoint, innerMeasurement);
        innerLimitedThisPeriod |= inner.outputLimited();
        return output;
    }

    private void runOuter(double outerSetpoint, double outerMeasurement, double innerMeasurement) {
        boolean innerAutomatic = inner.mode() == Mode.AUTOMATIC;
        boolean follow = mode == CascadeMode.LOCAL || !innerAutomatic;
        // local even for a moment since the last outer sample: the inner setpoint may have moved
        boolean wasLocal = localSinceOuterSample;
        localSinceOuterSample = mode == CascadeMode.LOCAL;
        if (!follow && !outerFollowing && !wasLocal) {
            outer.actuatorPosition(innerLimitedThisPeriod && Double.isFinite(innerMeasurement)
                    ? innerMeasurement : innerSetpoint);
            innerSetpoint = outer.update(outerSetpoint, outerMeasurement);
            return;
        }
        if (!outerFollowing) {
            outerModeBeforeFollowing = outer.mode();
            outer.switchToTracking();
            outerFollowing = true;
        }
        // a non-finite track value holds the outer output, so a bad inner sample is not tracked
        outer.trackValue(mode == CascadeMode.LOCAL || innerAutomatic ? innerSetpoint : innerMeasurement);
        double tracked = outer.update(outerSetpoint, outerMeasurement);
        if (mode == CascadeMode.CASCADE) {
            innerSetpoint = tracked;
        }
        if (!follow) {
            outerFollowing = false;
            if (outerModeBeforeFollowing == Mode.MANUAL) {
                outer.switchToManual();
            } else {
                outer.switchToAutomatic();
            }
        }
    }

    /**
     * Switches the inner loop to its local setpoint, which starts at the inner setpoint in force
     * (bumpless); the outer controller tracks it from its next sample on.
     */
    public void switchToLocal() {
        if (mode != CascadeMode.LOCAL) {
            localSetpoint = innerSetpoint;
            mode = CascadeMode.LOCAL;
            localSinceOuterSample = true;
        }
    }

    /**
     * Switches the inner loop back to the outer controller's output. The inner setpoint holds
     * until the outer controller, having tracked it on its next sample, takes over from it.
     */
    public void switchToCascade() {
        mode = CascadeMode.CASCADE;
    }

    /**
     * Moves the local setpoint, within the outer controller's output range; it acts at once while
     * the cascade is local.
     *
     * @param value the local setpoint, in the outer controller's output units
     * @return false, and nothing changes, when the value is not finite
     */
    public boolean localSetpoint(double value) {
        if (!Double.isFinite(value)) {
            return false;
        }
        ControllerSettings o = outer.settings();
        localSetpoint = Math.max(o.outputMin(), Math.min(o.outputMax(), value));
        if (mode == CascadeMode.LOCAL) {
            innerSetpoint = localSetpoint;
        }
        return true;
    }

    /**
     * Back to the state of a new cascade: both controllers reset (counters included), cascade mode,
     * the outer controller about to run. For a simulation that starts again from rest.
     */
    public void reset() {
        if (outerFollowing) {
            outer.switchToAutomatic();
        }
        outer.reset();
        inner.reset();
        innerSample = 0;
        mode = CascadeMode.CASCADE;
        localSetpoint = 0.0;
        innerSetpoint = outer.position();
        innerLimitedThisPeriod = false;
        outerFollowing = false;
        localSinceOuterSample = false;
        outerModeBeforeFollowing = Mode.AUTOMATIC;
    }

    /** {@return cascade or local} */
    public CascadeMode mode() {
        return mode;
    }

    /** {@return the setpoint the inner controller is following now} */
    public double innerSetpoint() {
        return innerSetpoint;
    }

    /** {@return whether the outer controller is tracking (local, inner outside automatic, or handing back)} */
    public boolean outerTracking() {
        return outerFollowing;
    }

    /** {@return inner samples per outer sample} */
    public int innerSamplesPerOuterSample() {
        return innerSamplesPerOuterSample;
    }

    /** {@return the outer (primary) controller, for its status, settings and retune} */
    public PidController outer() {
        return outer;
    }

    /** {@return the inner (secondary) controller, for its status, settings, retune and manual mode} */
    public PidController inner() {
        return inner;
    }
}
