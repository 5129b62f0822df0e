package org.loopwright.bench;

import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.discrete.DiscretePid;

/**
 * The limit for the full-featured update: the same difference equations, on plain final fields,
 * with nothing else (no mode, fault, retune, deadband, wrap or feedforward handling). Reverse
 * action, fixed period. Its outputs equal {@link org.loopwright.pid.PidController}'s for
 * {@link Workloads#fullFeatured()} (checked by a test), so the ratio of the two measures only the
 * controller's overhead.
 *
 * <p>Not thread-safe.
 */
public final class BareRecurrence {

    private final double kp;
    private final double b0;
    private final double b1;
    private final double ad;
    private final double bd;
    private final double proportionalWeight;
    private final double derivativeWeight;
    private final double outputMin;
    private final double outputMax;
    private final double maxStep;
    private final double trackingGain;

    private boolean started;
    private double integral;
    private double derivative;
    private double previousError;
    private double previousSetpoint;
    private double previousMeasurement;
    private double previousUnlimited;
    private double previousOutput;

    /** Copies the coefficients of a reverse-acting controller's settings. */
    public BareRecurrence(ControllerSettings s) {
        if (s.action() != Action.REVERSE) {
            throw new IllegalArgumentException("the bare recurrence is written for reverse action");
        }
        DiscretePid c = s.discretePid();
        kp = c.proportionalGain();
        b0 = c.integralWeightOnCurrent();
        b1 = c.integralWeightOnPrevious();
        ad = c.derivativePole();
        bd = c.derivativeGain();
        proportionalWeight = s.proportionalSetpointWeight();
        derivativeWeight = s.derivativeSetpointWeight();
        outputMin = s.outputMin();
        outputMax = s.outputMax();
        maxStep = s.outputSlewPerSecond() * s.samplePeriodSeconds();
        trackingGain = Math.min(s.samplePeriodSeconds() / s.trackingTimeSeconds(), 1.0);
        previousOutput = Math.max(outputMin, Math.min(outputMax, 0.0));
    }

    /** One sample: the output for setpoint r and measurement y. */
    public double update(double r, double y) {
        double error = r - y;
        double proportional = kp * (proportionalWeight * r - y);
        double lo = outputMin;
        double hi = outputMax;
        double next = integral;
        double filtered = 0.0;
        if (started) {
            lo = Math.max(lo, previousOutput - maxStep);
            hi = Math.min(hi, previousOutput + maxStep);
            filtered = ad * derivative + bd * (derivativeWeight * (r - previousSetpoint) - (y - previousMeasurement));
            next += b0 * error + b1 * previousError + trackingGain * (previousOutput - previousUnlimited);
        }
        double unlimited = proportional + next + filtered;
        double output = unlimited < lo ? lo : (unlimited > hi ? hi : unlimited);
        integral = next;
        derivative = filtered;
        previousError = error;
        previousSetpoint = r;
        previousMeasurement = y;
        previousUnlimited = unlimited;
        previousOutput = output;
        started = true;
        return output;
    }
}
