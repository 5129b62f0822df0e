package org.loopwright.pid;

import java.util.Objects;

import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.DiscretePid;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * A discrete PID controller with the behaviour of an industrial one: setpoint weights, a filtered
 * derivative, output range and slew limits, windup protection, bumpless manual, tracking and
 * retune, feedforward, a deadband, a circular process variable, incremental output and a fault
 * policy for bad samples.
 *
 * <p>The law, in output units (Åström &amp; Hägglund, <i>Advanced PID Control</i>, 2006, ch. 3;
 * Åström &amp; Murray, <i>Feedback Systems</i>, 2nd ed., 2021, §11.5):
 * <pre>
 *   u = Kp·(b·r − y) + I + D + uff,   I' = Ki·e + (u_limited − u)/Tt,   Tf·D' + D = Kd·(c·r − y)'
 * </pre>
 * each term discretised as {@link org.loopwright.pid.discrete} describes. At the first sample every
 * dynamic state is zero; the recursions apply from the second sample on.
 *
 * <p>Bumpless by one rule: whenever the integral is not the law's own (after manual, tracking, a
 * safe output, a restore or an overflow), the first automatic sample sets it so that the output
 * equals the last output; a retune moves it so that P + I + D at the last inputs is unchanged (or,
 * when the new settings cannot express those inputs, rebalances from the last output). A sample
 * with a bad input (see {@link Fault}) touches no state at all: it does not even adopt a pending
 * retune. Every state stays finite, so the controller never locks itself in a fault, and manual
 * mode always obeys the operator.
 *
 * <p>Per update: {@code update} allocates nothing and does not box, log, lock, throw or iterate; it
 * reads the published settings through one volatile read, uses coefficients computed once when the
 * settings were built (or, on the variable-period path, per call from primitives), and branches
 * instead of throwing on a bad sample. The mode and input methods keep to the same rules. The proof is
 * measured, not assumed: {@code AllocationTest} (pid-core) and {@code ClosedLoopAllocationTest}
 * (pid-sim) count the bytes a thread allocates across many updates with {@code ThreadMXBean},
 * and the JMH suite in pid-bench reports bytes per operation with the GC profiler.
 *
 * <p>Example: {@code double heaterPercent = controller.update(60.0, bathTemperature);} once per
 * sample period.
 *
 * <p>Not thread-safe: one loop thread calls {@code update} and the mode and input methods;
 * {@link #retune} may be called from any thread, and the next update adopts the new settings whole
 * and without a bump.
 */
public final class PidController {

    private static final Logger LOG = LoggerFactory.getLogger(PidController.class);

    private volatile ControllerSettings published;
    private ControllerSettings active;

    // inputs that the caller sets between updates
    private double feedforward;
    private boolean feedforwardOn;
    private double manualValue;
    private double trackValue = Double.NaN;
    private double actuatorPosition = Double.NaN;
    private Mode mode = Mode.AUTOMATIC;

    // dynamic state
    private boolean started;
    private boolean rebalancePending;
    private double integral;
    private double derivativeState;
    private double previousError;
    private double previousSetpoint;
    private double previousMeasurement;
    private double previousUnlimited;
    private double previousOutput;
    private double previousFeedforward;
    private boolean feedforwardApplied;

    // status of the last sample
    private double proportionalTerm;
    private double integralTerm;
    private double derivativeTerm;
    private double feedforwardTerm;
    private double emitted;
    private boolean outputLimited;
    private Fault fault = Fault.NONE;
    private long faultCount;

    /**
     * A controller in automatic mode with every state zero.
     *
     * @param settings the settings the first update uses
     */
    public PidController(ControllerSettings settings) {
        this.published = Objects.requireNonNull(settings, "settings");
        this.active = settings;
        reset();
    }

    /**
     * One fixed-period update with the configured sample period.
     *
     * @param setpoint    r, in process units
     * @param measurement y, in process units
     * @return the output (or its increment, for {@link OutputKind#INCREMENT}); never NaN, always in range
     */
    public double update(double setpoint, double measurement) {
        ControllerSettings s = published;
        DiscretePid c = s.fixedPeriod;
        return step(s, setpoint, measurement, c.integralWeightOnCurrent(), c.integralWeightOnPrevious(),
                c.derivativePole(), c.derivativeGain(), s.setpointStepLimit, s.outputStepLimit, s.fixedTrackingGain);
    }

    /**
     * One variable-period update: the coefficients are computed for this period.
     *
     * A forward-Euler derivative cannot run at a period of 2·Tf or more; for such a period this
     * update uses backward Euler instead (the hot path does not throw).
     *
     * @param setpoint      r, in process units
     * @param measurement   y, in process units
     * @param periodSeconds time since the previous update; a non-finite or non-positive one is a fault
     * @return the output (or its increment, for {@link OutputKind#INCREMENT}); never NaN, always in range
     */
    public double update(double setpoint, double measurement, double periodSeconds) {
        ControllerSettings s = published;
        double h = periodSeconds;
        if (!(h > 0.0) || h == Double.POSITIVE_INFINITY) {
            return onFault(s, classify(setpoint, measurement, false));
        }
        DerivativeMethod method = s.derivativeMethod().isStable(h, s.filterTimeSeconds)
                ? s.derivativeMethod() : DerivativeMethod.BACKWARD_EULER;
        boolean hasDerivative = s.derivativeGain > 0.0;
        return step(s, setpoint, measurement,
                s.integralMethod().weightOnCurrent(s.integralGain, h),
                s.integralMethod().weightOnPrevious(s.integralGain, h),
                hasDerivative ? method.pole(h, s.filterTimeSeconds) : 0.0,
                hasDerivative ? method.gain(s.derivativeGain, h, s.filterTimeSeconds) : 0.0,
                s.setpointSlewPerSecond() * h, s.outputStep(h), s.trackingGain(h));
    }

    /**
     * The law, with the coefficients of this sample's period: integral weights b0, b1, derivative
     * pole ad and gain bd, the largest setpoint and output steps and the back-calculation gain.
     * Split into methods small enough for the JIT to inline them all into {@link #update(double, double)};
     * what is rare lives in methods of its own.
     */
    private double step(ControllerSettings s, double r, double y, double b0, double b1, double ad, double bd,
            double setpointStep, double outputStep, double trackingGain) {
        if (!(Double.isFinite(r) && Double.isFinite(y)) || feedforwardOn && !Double.isFinite(feedforward)) {
            return onFault(s, classify(r, y, true));
        }
        if (s != active) {
            // adopted on a good sample only, so that a fault never touches the state
            adopt(s);
        }
        boolean running = started;
        double rampedSetpoint = running && s.slewsSetpoint ? slew(s, previousSetpoint, r, setpointStep) : r;
        double rawError = rawError(s, rampedSetpoint, y);
        double error = deadband(rawError, s.errorDeadband());
        double proportional = s.proportionalGain * proportionalInput(s, rampedSetpoint, rawError, error);
        double uff = feedforwardOn ? feedforward : 0.0;
        if (!running) {
            // the first sample: every dynamic state is zero, and only the range limits the output
            return conclude(s, rampedSetpoint, y, error, proportional, 0.0, 0.0, integral, uff,
                    s.outputMin(), s.outputMax(), false);
        }
        double derivative = ad * derivativeState + bd * derivativeInputChange(s, rampedSetpoint, y);
        double increment = b0 * error + b1 * previousError;
        return conclude(s, rampedSetpoint, y, error, proportional, derivative, increment,
                integrated(s, increment, trackingGain, uff), uff,
                Math.max(s.outputMin(), previousOutput - outputStep), Math.min(s.outputMax(), previousOutput + outputStep),
                true);
    }

    /** c·r − y with the action's sign, as a change since the last sample. */
    private double derivativeInputChange(ControllerSettings s, double setpoint, double measurement) {
        return s.sign * (s.derivativeSetpointWeight() * wrap(s, setpoint - previousSetpoint)
                - wrap(s, measurement - previousMeasurement));
    }

    /** The integral after this sample's increment, back-calculation and any feedforward switch. */
    private double integrated(ControllerSettings s, double increment, double trackingGain, double uff) {
        double next = integral
                + (increment + (s.backCalculates ? trackingGain * (appliedOutput(s) - previousUnlimited) : 0.0));
        if (feedforwardOn != feedforwardApplied) {
            // switching feedforward on or off moves the integral so that the output does not step
            next += feedforwardApplied ? previousFeedforward : -uff;
        }
        return next;
    }

    /**
     * The output for the mode within the bounds lo..hi, then the state, unless the sum overflowed.
     * The integral is next, unless the mode or conditional integration says otherwise.
     */
    private double conclude(ControllerSettings s, double setpoint, double y, double error, double proportional,
            double derivative, double increment, double next, double uff, double lo, double hi, boolean running) {
        double integralNow = next;
        double unlimited;
        double output;
        boolean automatic = mode == Mode.AUTOMATIC;
        if (automatic) {
            if (rebalancePending) {
                integralNow = previousOutput - proportional - derivative - uff;
            } else if (s.clampsIntegral) {
                integralNow = conditionallyIntegrated(s, proportional, next, derivative, uff, increment, lo, hi);
            }
            unlimited = proportional + integralNow + derivative + uff;
            output = limit(s, unlimited, lo, hi);
        } else {
            output = limit(s, heldOutput(), lo, hi);
            unlimited = output;
            integralNow = integral;
        }
        // a sum is finite only when every term is: in automatic this one test covers them all
        if (automatic && !Double.isFinite(unlimited)) {
            // finite inputs far too large for the gains (or for the last inputs): the sample is dropped
            // like a faulty one, and the law starts again at the next sample as at a first one, bumpless
            // from the last output, so that ordinary inputs never meet these memories and stay in the fault
            started = false;
            rebalancePending = true;
            return onFault(s, Fault.ARITHMETIC_OVERFLOW);
        }
        // outside automatic the output is the operator's whatever the law's terms; a term that overflowed
        // restarts from zero, and the integral is rebalanced on the return to automatic anyway
        boolean lawFinite = automatic || Double.isFinite(error) && Double.isFinite(derivative);
        double result = s.incrementOutput ? (running ? output - previousOutput : 0.0) : output;
        if (rebalancePending == automatic) {
            // outside automatic the integral is not the law's own: the next automatic sample rebalances it
            rebalancePending = !automatic;
        }
        outputLimited = automatic && output != unlimited;
        integral = integralNow;
        derivativeState = lawFinite ? derivative : 0.0;
        previousError = lawFinite ? error : 0.0;
        previousSetpoint = setpoint;
        previousMeasurement = y;
        previousUnlimited = unlimited;
        previousOutput = output;
        previousFeedforward = uff;
        report(proportional, integralNow, derivative, uff, result, running);
        return result;
    }

    /** The status of a good sample; the flags are written only when they change. */
    private void report(double proportional, double integralNow, double derivative, double uff, double result,
            boolean running) {
        proportionalTerm = proportional;
        integralTerm = integralNow;
        derivativeTerm = derivative;
        feedforwardTerm = uff;
        emitted = result;
        if (!running || feedforwardOn != feedforwardApplied || fault != Fault.NONE) {
            feedforwardApplied = feedforwardOn;
            started = true;
            fault = Fault.NONE;
        }
    }

    /**
     * Conditional integration: the integral without this sample's increment when the output is
     * limited and the increment pushes further into the limit.
     */
    private double conditionallyIntegrated(ControllerSettings s, double proportional, double next,
            double derivative, double uff, double increment, double lo, double hi) {
        double unlimited = proportional + next + derivative + uff;
        double output = limit(s, unlimited, lo, hi);
        return output != unlimited && (unlimited > output ? increment > 0.0 : increment < 0.0) ? next - increment : next;
    }

    /** The output manual or tracking mode asks for; a non-finite track value holds the output. */
    private double heldOutput() {
        if (mode == Mode.MANUAL) {
            return manualValue;
        }
        return Double.isFinite(trackValue) ? trackValue : previousOutput;
    }

    /** The output that back-calculation drives the integral towards (Åström &amp; Murray 2021, §11.4). */
    private double appliedOutput(ControllerSettings s) {
        return s.windupProtection() == WindupProtection.ACTUATOR_TRACKING && Double.isFinite(actuatorPosition)
                ? actuatorPosition : previousOutput;
    }

    private Fault classify(double r, double y, boolean periodValid) {
        if (!Double.isFinite(r)) {
            return Fault.SETPOINT_NOT_FINITE;
        }
        if (!Double.isFinite(y)) {
            return Fault.MEASUREMENT_NOT_FINITE;
        }
        if (!periodValid) {
            return Fault.PERIOD_NOT_VALID;
        }
        if (feedforwardOn && !Double.isFinite(feedforward)) {
            return Fault.FEEDFORWARD_NOT_FINITE;
        }
        return Fault.NONE;
    }

    /**
     * A faulty sample never reaches the state; the policy of the latest settings decides the output,
     * which stays within their range. The safe output is applied at once, past the slew limit: it is
     * a safety action. In manual the operator's output is applied as on a good sample (slew-limited at
     * the configured period): manual always obeys the operator.
     */
    private double onFault(ControllerSettings s, Fault seen) {
        faultCount++;
        fault = seen;
        // in manual the operator's output stands whatever the inputs: the policy is for automatic and tracking
        boolean manual = mode == Mode.MANUAL;
        double target = manual ? manualValue
                : s.faultPolicy() == FaultPolicy.SAFE_OUTPUT ? s.safeOutput() : previousOutput;
        double step = manual ? s.outputStepLimit : s.largestOutputStep;
        double output = limit(s, target, Math.max(s.outputMin(), previousOutput - step),
                Math.min(s.outputMax(), previousOutput + step));
        if (output != previousOutput) {
            rebalancePending = true;
        }
        double result = s.incrementOutput ? output - previousOutput : output;
        previousOutput = output;
        emitted = result;
        return result;
    }

    /** Adopts newly published settings so that the output at the last inputs does not change. */
    private void adopt(ControllerSettings next) {
        if (started) {
            double oldRawError = rawError(active, previousSetpoint, previousMeasurement);
            double oldProportional = active.proportionalGain * proportionalInput(active, previousSetpoint,
                    oldRawError, deadband(oldRawError, active.errorDeadband()));
            double newRawError = rawError(next, previousSetpoint, previousMeasurement);
            double newError = deadband(newRawError, next.errorDeadband());
            double newProportional = next.proportionalGain
                    * proportionalInput(next, previousSetpoint, newRawError, newError);
            double rebalanced = integral + (oldProportional - newProportional)
                    + (next.derivativeGain == 0.0 ? derivativeState : 0.0);
            if (Double.isFinite(rebalanced)) {
                integral = rebalanced;
                previousError = newError;
            } else {
                // the last inputs are beyond what the new settings can express (an error or P that
                // overflows): this sample rebalances the integral from the last output instead
                rebalancePending = true;
                previousError = 0.0;
            }
            if (next.derivativeGain == 0.0) {
                derivativeState = 0.0;
            }
        }
        active = next;
    }

    /** r − y with the action's sign, the short way round on a circular process variable. */
    private static double rawError(ControllerSettings s, double setpoint, double measurement) {
        return s.sign * wrap(s, setpoint - measurement);
    }

    /** b·r − y with the action's sign, less whatever the deadband removed from the error. */
    private static double proportionalInput(ControllerSettings s, double setpoint, double rawError, double error) {
        double weighted = rawError - s.proportionalSetpointFactor * setpoint;
        return weighted - (rawError - error);
    }

    private static double wrap(ControllerSettings s, double difference) {
        double span = s.wrapSpan();
        return span > 0.0 ? difference - span * Math.floor(difference / span + 0.5) : difference;
    }

    private static double deadband(double error, double band) {
        if (error > band) {
            return error - band;
        }
        return error < -band ? error + band : 0.0;
    }

    /** Moves from towards to by at most maxStep, the short way round on a circular process variable. */
    private static double slew(ControllerSettings s, double from, double to, double maxStep) {
        double distance = wrap(s, to - from);
        double stepped = from + Math.copySign(maxStep, distance);
        // a distance or a step beyond the double range (NaN or infinite) goes to the target, which is finite
        return Math.abs(distance) > maxStep && Double.isFinite(stepped) ? stepped : to;
    }

    /**
     * Within the slew bounds lo..hi, themselves within the range. Only when the last output lies
     * outside a range that a retune moved can lo exceed hi; the range wins then over the slew limit,
     * but not over the largest position step of an increment output: a range moved further than that
     * is reached in several such steps, so that the increment stays finite.
     */
    private double limit(ControllerSettings s, double value, double lo, double hi) {
        double limited = clamp(value, lo, hi);
        return lo > hi ? clamp(clamp(limited, s.outputMin(), s.outputMax()),
                previousOutput - s.largestOutputStep, previousOutput + s.largestOutputStep) : limited;
    }

    private static double clamp(double value, double lo, double hi) {
        return value < lo ? lo : (value > hi ? hi : value);
    }

    /**
     * Publishes new settings; the next update adopts them whole and rebalances the integral so the
     * output does not step. Safe to call from any thread.
     *
     * @param settings the new settings, adopted at the next update
     */
    public void retune(ControllerSettings settings) {
        published = Objects.requireNonNull(settings, "settings");
        LOG.debug("retune published: {}", settings.gains());
    }

    /** {@return the settings the next update will use} */
    public ControllerSettings settings() {
        return published;
    }

    /** Switches to manual; the output stays where it is until {@link #manualOutput(double)} moves it. */
    public void switchToManual() {
        if (mode != Mode.MANUAL) {
            manualValue = previousOutput;
            mode = Mode.MANUAL;
        }
    }

    /** Switches to tracking: the output follows {@link #trackValue(double)}. */
    public void switchToTracking() {
        mode = Mode.TRACKING;
    }

    /** Switches to automatic; the first automatic output equals the last output (bumpless). */
    public void switchToAutomatic() {
        mode = Mode.AUTOMATIC;
    }

    /** {@return the current mode} */
    public Mode mode() {
        return mode;
    }

    /**
     * Sets the operator's output for manual mode.
     *
     * @param value the output to hold in manual mode, finite
     * @return false, and nothing changes, when the value is not finite
     */
    public boolean manualOutput(double value) {
        if (!Double.isFinite(value)) {
            return false;
        }
        manualValue = value;
        return true;
    }

    /**
     * Sets the external value that tracking mode follows; a non-finite one holds the output.
     *
     * @param value the value the output follows in tracking mode, in output units
     */
    public void trackValue(double value) {
        trackValue = value;
    }

    /**
     * Sets the actuator's measured position for {@link WindupProtection#ACTUATOR_TRACKING}.
     *
     * @param value the actuator's measured position, in output units
     */
    public void actuatorPosition(double value) {
        actuatorPosition = value;
    }

    /**
     * Sets the feedforward input, added to the output before the limits while feedforward is on.
     *
     * @param value the feedforward term in output units
     */
    public void feedforward(double value) {
        feedforward = value;
    }

    /**
     * Switches the feedforward on or off; either switch is bumpless.
     *
     * @param on true to add the feedforward input to the output, false to leave it out
     */
    public void feedforwardOn(boolean on) {
        feedforwardOn = on;
    }

    /** Clears every state and counter, back to a controller that has seen no sample. */
    public void reset() {
        ControllerSettings s = active;
        started = false;
        rebalancePending = false;
        integral = 0.0;
        derivativeState = 0.0;
        previousError = 0.0;
        previousSetpoint = 0.0;
        previousMeasurement = 0.0;
        previousUnlimited = 0.0;
        previousOutput = clamp(0.0, s.outputMin(), s.outputMax());
        previousFeedforward = 0.0;
        feedforwardApplied = feedforwardOn;
        manualValue = previousOutput;
        proportionalTerm = 0.0;
        integralTerm = 0.0;
        derivativeTerm = 0.0;
        feedforwardTerm = 0.0;
        emitted = 0.0;
        outputLimited = false;
        fault = Fault.NONE;
        faultCount = 0;
    }

    /** {@return the value the last update returned} */
    public double output() {
        return emitted;
    }

    /** {@return the actuator position the last update asked for (equal to {@link #output()} for position output)} */
    public double position() {
        return previousOutput;
    }

    /**
     * Whether the range or the slew limit cut the output of the last good automatic sample (false
     * outside automatic). A cascade reads it to stop the outer loop pushing a saturated inner loop.
     *
     * @return true when the last good automatic output was cut by the range or the slew limit
     */
    public boolean outputLimited() {
        return outputLimited;
    }

    /** {@return the proportional contribution of the last good sample} */
    public double proportionalTerm() {
        return proportionalTerm;
    }

    /** {@return the integral contribution of the last good sample} */
    public double integralTerm() {
        return integralTerm;
    }

    /** {@return the derivative contribution of the last good sample} */
    public double derivativeTerm() {
        return derivativeTerm;
    }

    /** {@return the feedforward contribution of the last good sample} */
    public double feedforwardTerm() {
        return feedforwardTerm;
    }

    /** {@return the fault of the last sample, {@link Fault#NONE} when it was good} */
    public Fault fault() {
        return fault;
    }

    /** {@return faulty samples seen since construction or the last reset} */
    public long faultCount() {
        return faultCount;
    }

    /** {@return a copy of the whole dynamic state, for a warm restart} */
    public StateSnapshot snapshot() {
        ControllerSettings s = active;
        return new StateSnapshot(new StateSnapshot.Values(s.action(), s.outputKind(), s.outputMin(), s.outputMax(),
                s.wrapSpan(), mode, started, integral, derivativeState, previousError, previousSetpoint,
                previousMeasurement, previousUnlimited, previousOutput, previousFeedforward, feedforwardApplied,
                manualValue, faultCount));
    }

    /**
     * Copies the whole dynamic state into a holder without allocating (for a snapshot taken on the
     * loop thread; the holder makes the {@link StateSnapshot} on the reader's thread).
     *
     * @param into the holder to overwrite; a later capture overwrites it again
     */
    public void captureState(StateCapture into) {
        into.write(active, mode, started, integral, derivativeState, previousError, previousSetpoint,
                previousMeasurement, previousUnlimited, previousOutput, previousFeedforward, feedforwardApplied,
                manualValue, faultCount);
    }

    /**
     * Restores a snapshot; the next automatic output equals the snapshot's last output (bumpless
     * restart), even when the gains have changed since.
     *
     * @param snapshot a snapshot taken from a controller with the same action, output kind, output range and wrap span
     * @throws IllegalArgumentException when the snapshot was taken with a different action, output
     *                                  kind, output range or wrap span
     */
    public void restore(StateSnapshot snapshot) {
        ControllerSettings s = published;
        snapshot.requireCompatibleWith(s);
        StateSnapshot.Values v = snapshot.values();
        active = s;
        mode = v.mode();
        started = v.started();
        integral = v.integral();
        derivativeState = s.derivativeGain > 0.0 ? v.derivativeState() : 0.0;
        previousError = v.previousError();
        previousSetpoint = v.previousSetpoint();
        previousMeasurement = v.previousMeasurement();
        previousUnlimited = v.previousUnlimited();
        previousOutput = v.previousOutput();
        previousFeedforward = v.previousFeedforward();
        feedforwardApplied = v.feedforwardApplied();
        manualValue = v.manualValue();
        faultCount = v.faultCount();
        // the integral is the snapshot's, not the law's of these settings: the first automatic sample rebalances it
        rebalancePending = started;
        fault = Fault.NONE;
        LOG.debug("state restored: output {}", previousOutput);
    }
}
