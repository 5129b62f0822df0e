package org.loopwright.pid;

import java.util.Objects;

import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.DiscretePid;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.form.PidGains;

/**
 * Everything a controller is configured with, validated once and immutable afterwards. The
 * coefficients for the configured sample period are computed here, so a controller that adopts
 * these settings does no more than read them.
 *
 * <p>Example: a PI controller with Kc = 2, Ti = 30 s, sampled every 0.1 s, output 0–100 %:
 * <pre>{@code
 * ControllerSettings s = ControllerSettings.builder()
 *         .gains(IdealGains.pi(2.0, 30.0))
 *         .samplePeriodSeconds(0.1)
 *         .outputRange(0.0, 100.0)
 *         .build();
 * }</pre>
 *
 * <p>Thread-safe: immutable.
 */
public final class ControllerSettings {

    /** Default derivative filter ratio N = Td/Tf (common practice: N between 8 and 20). */
    public static final double DEFAULT_DERIVATIVE_FILTER_RATIO = 10.0;

    private final PidGains gains;
    private final double samplePeriodSeconds;
    private final double proportionalSetpointWeight;
    private final double derivativeSetpointWeight;
    private final double derivativeFilterRatio;
    private final double derivativeFilterTimeSeconds;
    private final IntegralMethod integralMethod;
    private final DerivativeMethod derivativeMethod;
    private final Action action;
    private final double outputMin;
    private final double outputMax;
    private final WindupProtection windupProtection;
    private final double trackingTimeSeconds;
    private final double outputSlewPerSecond;
    private final double setpointSlewPerSecond;
    private final FaultPolicy faultPolicy;
    private final double safeOutput;
    private final double errorDeadband;
    private final double wrapSpan;
    private final OutputKind outputKind;

    // resolved once, read by the controller on every update
    final double proportionalGain;
    final double integralGain;
    final double derivativeGain;
    final double filterTimeSeconds;
    final double sign;
    final DiscretePid fixedPeriod;
    // the fixed-period update's per-sample constants and feature switches, so that it neither
    // multiplies by h nor pays for a feature that is off
    final double setpointStepLimit;
    final double outputStepLimit;
    final double largestOutputStep;
    final double fixedTrackingGain;
    final double proportionalSetpointFactor;
    final boolean slewsSetpoint;
    final boolean backCalculates;
    final boolean clampsIntegral;
    final boolean incrementOutput;
    private final boolean explicitFilterTime;
    private final boolean explicitTrackingTime;

    private ControllerSettings(Builder b) {
        gains = Objects.requireNonNull(b.gains, "gains");
        integralMethod = Objects.requireNonNull(b.integralMethod, "integralMethod");
        derivativeMethod = Objects.requireNonNull(b.derivativeMethod, "derivativeMethod");
        action = Objects.requireNonNull(b.action, "action");
        windupProtection = Objects.requireNonNull(b.windupProtection, "windupProtection");
        faultPolicy = Objects.requireNonNull(b.faultPolicy, "faultPolicy");
        outputKind = Objects.requireNonNull(b.outputKind, "outputKind");

        samplePeriodSeconds = SettingChecks.positive("samplePeriodSeconds", b.samplePeriodSeconds);
        proportionalSetpointWeight = SettingChecks.fraction("proportionalSetpointWeight", b.proportionalSetpointWeight);
        derivativeSetpointWeight = SettingChecks.fraction("derivativeSetpointWeight", b.derivativeSetpointWeight);
        derivativeFilterRatio = SettingChecks.positive("derivativeFilterRatio", b.derivativeFilterRatio);
        if (!Double.isNaN(b.derivativeFilterTimeSeconds)) {
            SettingChecks.positive("derivativeFilterTimeSeconds", b.derivativeFilterTimeSeconds);
        }
        if (Double.isNaN(b.outputMin) || b.outputMin == Double.POSITIVE_INFINITY) {
            throw new InvalidSettingException("outputMin", b.outputMin, "must be a number below +infinity");
        }
        if (Double.isNaN(b.outputMax) || b.outputMax == Double.NEGATIVE_INFINITY) {
            throw new InvalidSettingException("outputMax", b.outputMax, "must be a number above -infinity");
        }
        if (b.outputMin > b.outputMax) {
            throw new InvalidSettingException("outputMin", b.outputMin,
                    "must be <= outputMax (outputMax=" + b.outputMax + ")");
        }
        outputMin = b.outputMin;
        outputMax = b.outputMax;
        outputSlewPerSecond = SettingChecks.positiveOrInfinite("outputSlewPerSecond", b.outputSlewPerSecond, "no limit");
        setpointSlewPerSecond = SettingChecks.positiveOrInfinite("setpointSlewPerSecond", b.setpointSlewPerSecond, "no limit");
        safeOutput = SettingChecks.finite("safeOutput", b.safeOutput);
        errorDeadband = SettingChecks.nonNegative("errorDeadband", b.errorDeadband);
        wrapSpan = SettingChecks.nonNegative("wrapSpan", b.wrapSpan);
        if (wrapSpan > 0.0 && proportionalSetpointWeight != 1.0) {
            // b·r has no meaning on a circle: the proportional term would jump by Kp·(1 − b)·span
            // whenever the setpoint crosses the wrap point
            throw new InvalidSettingException("proportionalSetpointWeight", proportionalSetpointWeight,
                    "must be 1 on a circular process variable (wrapSpan=" + wrapSpan + ")");
        }

        ParallelGains parallel = gains.toParallel();
        proportionalGain = parallel.proportionalGain();
        integralGain = parallel.integralGain();
        derivativeGain = parallel.derivativeGain();
        explicitFilterTime = !Double.isNaN(b.derivativeFilterTimeSeconds);
        explicitTrackingTime = !Double.isNaN(b.trackingTimeSeconds);
        filterTimeSeconds = resolveFilterTime(b.derivativeFilterTimeSeconds);
        derivativeFilterTimeSeconds = filterTimeSeconds;
        trackingTimeSeconds = resolveTrackingTime(b.trackingTimeSeconds);
        sign = action.sign();

        derivativeMethod.requireStable(derivativeGain, samplePeriodSeconds, filterTimeSeconds);
        fixedPeriod = DiscretePid.of(proportionalGain, integralGain, derivativeGain, filterTimeSeconds,
                integralMethod, derivativeMethod, samplePeriodSeconds);
        setpointStepLimit = setpointSlewPerSecond * samplePeriodSeconds;
        // an increment beyond the largest double cannot be told: such a step is limited like a slew, to half
        // the largest double so that the rounding of the bounds can never take the increment past it
        largestOutputStep = outputKind == OutputKind.INCREMENT ? OutputKind.LARGEST_INCREMENT : Double.POSITIVE_INFINITY;
        outputStepLimit = outputStep(samplePeriodSeconds);
        fixedTrackingGain = trackingGain(samplePeriodSeconds);
        proportionalSetpointFactor = sign * (1.0 - proportionalSetpointWeight);
        // an infinite slew limit still matters on a circular variable, where a difference may overflow to NaN
        slewsSetpoint = setpointSlewPerSecond != Double.POSITIVE_INFINITY || wrapSpan > 0.0;
        // without integral action there is nothing to wind up, and the integral (then a fixed bias) stays
        backCalculates = integralGain != 0.0 && (windupProtection == WindupProtection.BACK_CALCULATION
                || windupProtection == WindupProtection.ACTUATOR_TRACKING);
        clampsIntegral = windupProtection == WindupProtection.CLAMPING;
        incrementOutput = outputKind == OutputKind.INCREMENT;
    }

    /** The largest output step in a period: the slew limit, and for an increment output the largest double. */
    double outputStep(double periodSeconds) {
        return Math.min(outputSlewPerSecond * periodSeconds, largestOutputStep);
    }

    /** The back-calculation gain h/Tt at a period, capped at 1 so that the discrete tracking never over-corrects. */
    double trackingGain(double periodSeconds) {
        return Math.min(periodSeconds / trackingTimeSeconds, 1.0);
    }

    /**
     * A builder with the defaults: reverse action, b = 1, c = 0, N = 10, Tustin integral,
     * backward-Euler derivative, unlimited output, back-calculation, hold on faults.
     *
     * @return a new builder holding those defaults; it still needs the gains and the sample period
     */
    public static Builder builder() {
        return new Builder();
    }

    /** {@return a builder that starts from these settings, for a retune that changes a few of them} */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.gains = gains;
        b.samplePeriodSeconds = samplePeriodSeconds;
        b.proportionalSetpointWeight = proportionalSetpointWeight;
        b.derivativeSetpointWeight = derivativeSetpointWeight;
        b.derivativeFilterRatio = derivativeFilterRatio;
        b.derivativeFilterTimeSeconds = Double.NaN;
        b.integralMethod = integralMethod;
        b.derivativeMethod = derivativeMethod;
        b.action = action;
        b.outputMin = outputMin;
        b.outputMax = outputMax;
        b.windupProtection = windupProtection;
        b.trackingTimeSeconds = Double.NaN;
        b.outputSlewPerSecond = outputSlewPerSecond;
        b.setpointSlewPerSecond = setpointSlewPerSecond;
        b.faultPolicy = faultPolicy;
        b.safeOutput = safeOutput;
        b.errorDeadband = errorDeadband;
        b.wrapSpan = wrapSpan;
        b.outputKind = outputKind;
        if (explicitFilterTime) {
            b.derivativeFilterTimeSeconds = derivativeFilterTimeSeconds;
        }
        if (explicitTrackingTime) {
            b.trackingTimeSeconds = trackingTimeSeconds;
        }
        return b;
    }

    private double resolveFilterTime(double explicit) {
        if (!Double.isNaN(explicit)) {
            return explicit;
        }
        if (derivativeGain == 0.0) {
            return 0.0;
        }
        if (proportionalGain == 0.0) {
            throw new InvalidSettingException("derivativeFilterTimeSeconds", explicit,
                    "must be given when proportionalGain = 0, since Td/N is undefined");
        }
        return derivativeGain / proportionalGain / derivativeFilterRatio;
    }

    /** Tt = √(Ti·Td) for PID and Ti for PI (Åström &amp; Hägglund 2006, §3.5, a rule of thumb). */
    private double resolveTrackingTime(double explicit) {
        if (!Double.isNaN(explicit)) {
            return SettingChecks.positive("trackingTimeSeconds", explicit);
        }
        if (integralGain == 0.0 || proportionalGain == 0.0) {
            return samplePeriodSeconds;
        }
        double integralTime = proportionalGain / integralGain;
        double derivativeTime = derivativeGain / proportionalGain;
        return derivativeTime > 0.0 ? Math.sqrt(integralTime * derivativeTime) : integralTime;
    }

    /** {@return the gains as given, in their own form} */
    public PidGains gains() {
        return gains;
    }

    /** {@return the gains as the controller runs them} */
    public ParallelGains parallelGains() {
        return gains.toParallel();
    }

    /** {@return the sample period h in seconds for the fixed-period update} */
    public double samplePeriodSeconds() {
        return samplePeriodSeconds;
    }

    /** {@return setpoint weight b of the proportional term, 0–1} */
    public double proportionalSetpointWeight() {
        return proportionalSetpointWeight;
    }

    /** {@return setpoint weight c of the derivative term, 0–1; 0 is derivative on measurement} */
    public double derivativeSetpointWeight() {
        return derivativeSetpointWeight;
    }

    /** {@return the derivative filter ratio N (used when no filter time is given)} */
    public double derivativeFilterRatio() {
        return derivativeFilterRatio;
    }

    /** {@return the derivative filter time Tf in seconds as resolved (0 when there is no derivative action)} */
    public double derivativeFilterTimeSeconds() {
        return derivativeFilterTimeSeconds;
    }

    /** {@return how the integral is discretised} */
    public IntegralMethod integralMethod() {
        return integralMethod;
    }

    /** {@return how the filtered derivative is discretised} */
    public DerivativeMethod derivativeMethod() {
        return derivativeMethod;
    }

    /** {@return direct or reverse action} */
    public Action action() {
        return action;
    }

    /** {@return lowest output (may be −∞)} */
    public double outputMin() {
        return outputMin;
    }

    /** {@return highest output (may be +∞)} */
    public double outputMax() {
        return outputMax;
    }

    /** {@return the windup protection scheme} */
    public WindupProtection windupProtection() {
        return windupProtection;
    }

    /** {@return tracking time Tt in seconds for back-calculation, as resolved} */
    public double trackingTimeSeconds() {
        return trackingTimeSeconds;
    }

    /** {@return largest output change per second (+∞ for none)} */
    public double outputSlewPerSecond() {
        return outputSlewPerSecond;
    }

    /** {@return largest setpoint change per second seen by the law (+∞ for none)} */
    public double setpointSlewPerSecond() {
        return setpointSlewPerSecond;
    }

    /** {@return what to output on a faulty sample} */
    public FaultPolicy faultPolicy() {
        return faultPolicy;
    }

    /** {@return the output for {@link FaultPolicy#SAFE_OUTPUT}, clamped to the range when used} */
    public double safeOutput() {
        return safeOutput;
    }

    /**
     * {@return the error deadband: errors smaller than this are treated as zero; larger ones are reduced by it (no
     * step at its edge)}
     */
    public double errorDeadband() {
        return errorDeadband;
    }

    /** {@return the span of a circular process variable (360 for degrees), or 0 for an ordinary one} */
    public double wrapSpan() {
        return wrapSpan;
    }

    /** {@return position or increment output} */
    public OutputKind outputKind() {
        return outputKind;
    }

    /** {@return the difference-equation coefficients at the configured sample period} */
    public DiscretePid discretePid() {
        return fixedPeriod;
    }

    /**
     * The difference-equation coefficients at another sample period, as the variable-period update uses them.
     *
     * @param periodSeconds the sample period h of this update in seconds, finite and &gt; 0
     * @return the coefficients P, I and D use at that period
     */
    public DiscretePid discretePid(double periodSeconds) {
        SettingChecks.positive("periodSeconds", periodSeconds);
        return DiscretePid.of(proportionalGain, integralGain, derivativeGain, filterTimeSeconds,
                integralMethod, derivativeMethod, periodSeconds);
    }

    /** Mutable builder; {@link #build()} validates every value. Not thread-safe. */
    public static final class Builder {
        private PidGains gains;
        private double samplePeriodSeconds = Double.NaN;
        private double proportionalSetpointWeight = 1.0;
        private double derivativeSetpointWeight = 0.0;
        private double derivativeFilterRatio = DEFAULT_DERIVATIVE_FILTER_RATIO;
        private double derivativeFilterTimeSeconds = Double.NaN;
        private IntegralMethod integralMethod = IntegralMethod.TUSTIN;
        private DerivativeMethod derivativeMethod = DerivativeMethod.BACKWARD_EULER;
        private Action action = Action.REVERSE;
        private double outputMin = Double.NEGATIVE_INFINITY;
        private double outputMax = Double.POSITIVE_INFINITY;
        private WindupProtection windupProtection = WindupProtection.BACK_CALCULATION;
        private double trackingTimeSeconds = Double.NaN;
        private double outputSlewPerSecond = Double.POSITIVE_INFINITY;
        private double setpointSlewPerSecond = Double.POSITIVE_INFINITY;
        private FaultPolicy faultPolicy = FaultPolicy.HOLD;
        private double safeOutput = 0.0;
        private double errorDeadband = 0.0;
        private double wrapSpan = 0.0;
        private OutputKind outputKind = OutputKind.POSITION;

        private Builder() {
        }

        /**
         * The gains, in any form (required).
         *
         * @param value the gains in ideal, parallel or series form
         * @return this builder
         */
        public Builder gains(PidGains value) {
            gains = value;
            return this;
        }

        /**
         * The sample period h in seconds (required, &gt; 0).
         *
         * @param value the sample period h in seconds, finite and &gt; 0
         * @return this builder
         */
        public Builder samplePeriodSeconds(double value) {
            samplePeriodSeconds = value;
            return this;
        }

        /**
         * Setpoint weights b (proportional) and c (derivative), each 0–1.
         *
         * @param proportional b, the share of the setpoint in the proportional term, 0–1 (default 1)
         * @param derivative c, the share of the setpoint in the derivative term, 0–1 (default 0)
         * @return this builder
         */
        public Builder setpointWeights(double proportional, double derivative) {
            proportionalSetpointWeight = proportional;
            derivativeSetpointWeight = derivative;
            return this;
        }

        /**
         * Derivative filter as N: Tf = Td/N (ideal Td).
         *
         * @param value N, &gt; 0 (default 10); replaces a filter time given before
         * @return this builder
         */
        public Builder derivativeFilterRatio(double value) {
            derivativeFilterRatio = value;
            derivativeFilterTimeSeconds = Double.NaN;
            return this;
        }

        /**
         * Derivative filter as a time constant Tf in seconds.
         *
         * @param value Tf in seconds, &gt; 0; when given it wins over N
         * @return this builder
         */
        public Builder derivativeFilterTimeSeconds(double value) {
            derivativeFilterTimeSeconds = value;
            return this;
        }

        /**
         * Integral discretisation.
         *
         * @param value the rule for the integral increment (default Tustin)
         * @return this builder
         */
        public Builder integralMethod(IntegralMethod value) {
            integralMethod = value;
            return this;
        }

        /**
         * Derivative discretisation.
         *
         * @param value the rule for the filtered derivative (default backward Euler)
         * @return this builder
         */
        public Builder derivativeMethod(DerivativeMethod value) {
            derivativeMethod = value;
            return this;
        }

        /**
         * Direct or reverse action.
         *
         * @param value reverse (output rises when the measurement is below the setpoint, default) or direct
         * @return this builder
         */
        public Builder action(Action value) {
            action = value;
            return this;
        }

        /**
         * Output range; use infinities for an unlimited side.
         *
         * @param min the lowest output, a number or −∞, &le; max
         * @param max the highest output, a number or +∞, &ge; min
         * @return this builder
         */
        public Builder outputRange(double min, double max) {
            outputMin = min;
            outputMax = max;
            return this;
        }

        /**
         * Windup protection scheme.
         *
         * @param value how the integral is kept from winding up while the output is limited (default back-calculation)
         * @return this builder
         */
        public Builder windupProtection(WindupProtection value) {
            windupProtection = value;
            return this;
        }

        /**
         * Tracking time Tt in seconds for back-calculation (default √(Ti·Td), or Ti for PI).
         *
         * @param value Tt in seconds, &gt; 0
         * @return this builder
         */
        public Builder trackingTimeSeconds(double value) {
            trackingTimeSeconds = value;
            return this;
        }

        /**
         * Output slew limit in units per second (+∞ for none).
         *
         * @param value the largest output change per second in output units, &gt; 0, or +∞ for none
         * @return this builder
         */
        public Builder outputSlewPerSecond(double value) {
            outputSlewPerSecond = value;
            return this;
        }

        /**
         * Setpoint slew limit in units per second (+∞ for none).
         *
         * @param value the largest setpoint change per second in process units, &gt; 0, or +∞ for none
         * @return this builder
         */
        public Builder setpointSlewPerSecond(double value) {
            setpointSlewPerSecond = value;
            return this;
        }

        /**
         * What to output on a faulty sample; the safe output is used by {@link FaultPolicy#SAFE_OUTPUT}.
         *
         * @param policy what to output on a faulty sample (default hold)
         * @param safeOutputValue the output for {@link FaultPolicy#SAFE_OUTPUT}, finite; clamped to the output range
         *         when used
         * @return this builder
         */
        public Builder faultPolicy(FaultPolicy policy, double safeOutputValue) {
            faultPolicy = policy;
            safeOutput = safeOutputValue;
            return this;
        }

        /**
         * Error deadband (0 for none).
         *
         * @param value the deadband in process units, &ge; 0
         * @return this builder
         */
        public Builder errorDeadband(double value) {
            errorDeadband = value;
            return this;
        }

        /**
         * Circular process variable of this span (360 for degrees); 0 for an ordinary one.
         *
         * @param value the span in process units, &ge; 0; a span &gt; 0 needs a proportional setpoint weight of 1
         * @return this builder
         */
        public Builder wrapSpan(double value) {
            wrapSpan = value;
            return this;
        }

        /**
         * Position or increment output.
         *
         * @param value position (the output itself, default) or increment (the change since the last update)
         * @return this builder
         */
        public Builder outputKind(OutputKind value) {
            outputKind = value;
            return this;
        }

        /**
         * Validates and freezes the settings.
         *
         * @return the immutable settings
         * @throws InvalidSettingException naming the field, the value and what is allowed
         */
        public ControllerSettings build() {
            if (gains == null) {
                throw new InvalidSettingException("gains", null, "must be given");
            }
            return new ControllerSettings(this);
        }
    }
}
