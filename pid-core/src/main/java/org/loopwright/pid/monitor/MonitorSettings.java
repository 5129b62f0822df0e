package org.loopwright.pid.monitor;

import java.util.Objects;

import org.loopwright.pid.Action;
import org.loopwright.pid.InvalidSettingException;

/**
 * The thresholds of a {@link LoopMonitor}, validated once and immutable. Three values are required:
 * the sample period, the loop's time scale and the acceptable oscillation amplitude; every other value
 * has a default, named below with its source.
 *
 * <p>The time scale ties the oscillation detector to the loop: Hägglund (1995) uses the ultimate
 * period Tu when it is known and the controller's integral time Ti otherwise. An excursion of the
 * error counts as a load disturbance when its IAE between two zero crossings exceeds
 * a·T/π (= 2a/ω with ω = 2π/T, the IAE of half a sine of amplitude a at that frequency); more than
 * {@link #oscillationAlarmEvents()} of them within the supervision time is an oscillation.
 *
 * <p>Example: a pressure loop sampled at 10 Hz, Ti = 4 s, range 0–10 bar, so a = 1 % of it, output
 * 0–100 %:
 * <pre>{@code
 * MonitorSettings s = MonitorSettings.builder()
 *         .samplePeriodSeconds(0.1).timeScaleSeconds(4.0).acceptableAmplitude(0.1)
 *         .outputRange(0.0, 100.0)
 *         .build();
 * }</pre>
 *
 * <p>Thread-safe: immutable.
 */
public final class MonitorSettings {

    /** Supervision time in time scales (Hägglund 1995, from memory: 50 Tu). */
    public static final double SUPERVISION_TIME_SCALES = 50.0;
    /** Load disturbances within the supervision time that mean oscillation (Hägglund 1995, from memory). */
    public static final double DEFAULT_OSCILLATION_ALARM_EVENTS = 10.0;
    /** Warn at half the alarm count (our choice). */
    public static final double DEFAULT_OSCILLATION_WARN_EVENTS = 5.0;
    /** Idle index above which a loop is sluggish (Hägglund 1999, from memory). */
    public static final double DEFAULT_IDLE_INDEX_ALARM = 0.4;
    /** Idle index worth a look (our choice, half-way from 0 to the alarm). */
    public static final double DEFAULT_IDLE_INDEX_WARN = 0.2;
    /** Share of recent samples at an output limit worth a look (common practice). */
    public static final double DEFAULT_SATURATION_WARN_SHARE = 0.1;
    /** Share of recent samples at an output limit that needs action (common practice). */
    public static final double DEFAULT_SATURATION_ALARM_SHARE = 0.5;
    /** Default output movement that makes an unchanged measurement suspect, as a share of the output range. */
    public static final double DEFAULT_FROZEN_OUTPUT_MOVE_SHARE = 0.01;
    /** Fewest samples an unchanged measurement must last to be called frozen by default. */
    public static final int MIN_DEFAULT_FROZEN_SAMPLES = 10;

    private final double samplePeriodSeconds;
    private final double timeScaleSeconds;
    private final double acceptableAmplitude;
    private final double supervisionTimeSeconds;
    private final double oscillationWarnEvents;
    private final double oscillationAlarmEvents;
    private final Action action;
    private final double idleIndexWarn;
    private final double idleIndexAlarm;
    private final double outputMin;
    private final double outputMax;
    private final double saturationWindowSeconds;
    private final double saturationWarnShare;
    private final double saturationAlarmShare;
    private final int frozenSamples;
    private final double quantisationStep;
    private final double frozenOutputMove;
    private final double noiseWindowSeconds;
    private final double noiseWarn;
    private final double noiseAlarm;

    private MonitorSettings(Builder b) {
        samplePeriodSeconds = positiveFinite("samplePeriodSeconds", b.samplePeriodSeconds);
        timeScaleSeconds = positiveFinite("timeScaleSeconds", b.timeScaleSeconds);
        if (timeScaleSeconds < 2.0 * samplePeriodSeconds) {
            throw new InvalidSettingException("timeScaleSeconds", timeScaleSeconds,
                    "must be >= 2 sample periods (" + 2.0 * samplePeriodSeconds + ")");
        }
        acceptableAmplitude = positiveFinite("acceptableAmplitude", b.acceptableAmplitude);
        supervisionTimeSeconds = Double.isNaN(b.supervisionTimeSeconds)
                ? SUPERVISION_TIME_SCALES * timeScaleSeconds
                : atLeastOnePeriod("supervisionTimeSeconds", b.supervisionTimeSeconds);
        oscillationAlarmEvents = positiveFinite("oscillationAlarmEvents", b.oscillationAlarmEvents);
        oscillationWarnEvents = below("oscillationWarnEvents", b.oscillationWarnEvents,
                "oscillationAlarmEvents", oscillationAlarmEvents);
        action = Objects.requireNonNull(b.action, "action");
        if (!(b.idleIndexAlarm > -1.0 && b.idleIndexAlarm < 1.0)) {
            throw new InvalidSettingException("idleIndexAlarm", b.idleIndexAlarm, "must be > -1 and < 1");
        }
        idleIndexAlarm = b.idleIndexAlarm;
        if (!(b.idleIndexWarn > -1.0 && b.idleIndexWarn <= idleIndexAlarm)) {
            throw new InvalidSettingException("idleIndexWarn", b.idleIndexWarn,
                    "must be > -1 and <= idleIndexAlarm (" + idleIndexAlarm + ")");
        }
        idleIndexWarn = b.idleIndexWarn;
        if (Double.isNaN(b.outputMin) || b.outputMin == Double.POSITIVE_INFINITY) {
            throw new InvalidSettingException("outputMin", b.outputMin, "must be finite or -Infinity");
        }
        if (!(b.outputMax > b.outputMin) || b.outputMax == Double.NEGATIVE_INFINITY) {
            throw new InvalidSettingException("outputMax", b.outputMax,
                    "must be > outputMin (" + b.outputMin + ") and finite or +Infinity");
        }
        outputMin = b.outputMin;
        outputMax = b.outputMax;
        saturationWindowSeconds = Double.isNaN(b.saturationWindowSeconds) ? supervisionTimeSeconds
                : atLeastOnePeriod("saturationWindowSeconds", b.saturationWindowSeconds);
        saturationAlarmShare = share("saturationAlarmShare", b.saturationAlarmShare);
        saturationWarnShare = below("saturationWarnShare", share("saturationWarnShare", b.saturationWarnShare),
                "saturationAlarmShare", saturationAlarmShare);
        if (b.frozenSamples == 0) {
            frozenSamples = (int) Math.max(MIN_DEFAULT_FROZEN_SAMPLES,
                    Math.min(Integer.MAX_VALUE, Math.ceil(timeScaleSeconds / samplePeriodSeconds)));
        } else if (b.frozenSamples < 2) {
            throw new InvalidSettingException("frozenSamples", b.frozenSamples, "must be >= 2 (or 0 for the default)");
        } else {
            frozenSamples = b.frozenSamples;
        }
        if (!(b.quantisationStep >= 0.0 && b.quantisationStep < Double.POSITIVE_INFINITY)) {
            throw new InvalidSettingException("quantisationStep", b.quantisationStep, "must be finite and >= 0");
        }
        quantisationStep = b.quantisationStep;
        double outputSpan = outputMax - outputMin;
        if (Double.isNaN(b.frozenOutputMove)) {
            if (!Double.isFinite(outputSpan)) {
                throw new InvalidSettingException("frozenOutputMove", b.frozenOutputMove,
                        "must be given when the output range is not finite: outputMin=" + outputMin
                                + ", outputMax=" + outputMax);
            }
            frozenOutputMove = DEFAULT_FROZEN_OUTPUT_MOVE_SHARE * outputSpan;
        } else {
            frozenOutputMove = positiveFinite("frozenOutputMove", b.frozenOutputMove);
        }
        noiseWindowSeconds = Double.isNaN(b.noiseWindowSeconds) ? supervisionTimeSeconds
                : atLeastOnePeriod("noiseWindowSeconds", b.noiseWindowSeconds);
        noiseAlarm = Double.isNaN(b.noiseAlarm) ? acceptableAmplitude : positiveFinite("noiseAlarm", b.noiseAlarm);
        noiseWarn = below("noiseWarn", Double.isNaN(b.noiseWarn) ? 0.5 * noiseAlarm
                : positiveFinite("noiseWarn", b.noiseWarn), "noiseAlarm", noiseAlarm);
    }

    private static double positiveFinite(String field, double value) {
        if (!(value > 0.0 && value < Double.POSITIVE_INFINITY)) {
            throw new InvalidSettingException(field, value, "must be finite and > 0");
        }
        return value;
    }

    private double atLeastOnePeriod(String field, double value) {
        if (!(value >= samplePeriodSeconds && value < Double.POSITIVE_INFINITY)) {
            throw new InvalidSettingException(field, value,
                    "must be finite and >= samplePeriodSeconds (" + samplePeriodSeconds + ")");
        }
        return value;
    }

    private static double share(String field, double value) {
        if (!(value > 0.0 && value <= 1.0)) {
            throw new InvalidSettingException(field, value, "must be > 0 and <= 1");
        }
        return value;
    }

    private static double below(String field, double value, String limitField, double limit) {
        if (!(value > 0.0 && value <= limit)) {
            throw new InvalidSettingException(field, value, "must be > 0 and <= " + limitField + " (" + limit + ")");
        }
        return value;
    }

    /** {@return a builder: the three required values unset (NaN), every other at its default} */
    public static Builder builder() {
        return new Builder();
    }

    /** {@return h, the period at which the monitor is fed, in seconds} */
    public double samplePeriodSeconds() {
        return samplePeriodSeconds;
    }

    /** {@return T, the loop's time scale: the ultimate period if known, else the integral time (seconds)} */
    public double timeScaleSeconds() {
        return timeScaleSeconds;
    }

    /** {@return a, the largest oscillation amplitude of the error that is acceptable (measurement units)} */
    public double acceptableAmplitude() {
        return acceptableAmplitude;
    }

    /** {@return the IAE of one excursion that counts as a load disturbance: a·T/π (measurement units · s)} */
    public double iaeLimit() {
        return acceptableAmplitude * timeScaleSeconds / Math.PI;
    }

    /** {@return the time over which load disturbances are counted, with exponential forgetting (seconds)} */
    public double supervisionTimeSeconds() {
        return supervisionTimeSeconds;
    }

    /** {@return count of load disturbances within the supervision time that raises a warning} */
    public double oscillationWarnEvents() {
        return oscillationWarnEvents;
    }

    /** {@return count of load disturbances within the supervision time that means oscillation} */
    public double oscillationAlarmEvents() {
        return oscillationAlarmEvents;
    }

    /** {@return the controller's action, which fixes the sign of a sluggish recovery in the idle index} */
    public Action action() {
        return action;
    }

    /** {@return idle index that raises a warning} */
    public double idleIndexWarn() {
        return idleIndexWarn;
    }

    /** {@return idle index that means sluggish} */
    public double idleIndexAlarm() {
        return idleIndexAlarm;
    }

    /** {@return the controller's lower output limit, or -Infinity} */
    public double outputMin() {
        return outputMin;
    }

    /** {@return the controller's upper output limit, or +Infinity} */
    public double outputMax() {
        return outputMax;
    }

    /** {@return time constant of the running share of samples at an output limit (seconds)} */
    public double saturationWindowSeconds() {
        return saturationWindowSeconds;
    }

    /** {@return share of samples at a limit that raises a warning} */
    public double saturationWarnShare() {
        return saturationWarnShare;
    }

    /** {@return share of samples at a limit that raises an alarm} */
    public double saturationAlarmShare() {
        return saturationAlarmShare;
    }

    /** {@return N: samples with an unchanged measurement (while the output moves) that mean frozen} */
    public int frozenSamples() {
        return frozenSamples;
    }

    /** {@return a measurement change no larger than this counts as no change (measurement units)} */
    public double quantisationStep() {
        return quantisationStep;
    }

    /** {@return how far the output must move (max − min) while the measurement is unchanged (output units)} */
    public double frozenOutputMove() {
        return frozenOutputMove;
    }

    /** {@return time constant of the running noise estimate (seconds)} */
    public double noiseWindowSeconds() {
        return noiseWindowSeconds;
    }

    /** {@return noise standard deviation that raises a warning (default a/2, our choice)} */
    public double noiseWarn() {
        return noiseWarn;
    }

    /**
     * Noise standard deviation that raises an alarm (default a: noise as large as the acceptable
     * oscillation hides the oscillations the monitor looks for; our choice).
     *
     * @return the noise standard deviation that raises an alarm, in measurement units
     */
    public double noiseAlarm() {
        return noiseAlarm;
    }

    /** Builds {@link MonitorSettings}; not thread-safe. */
    public static final class Builder {
        private double samplePeriodSeconds = Double.NaN;
        private double timeScaleSeconds = Double.NaN;
        private double acceptableAmplitude = Double.NaN;
        private double supervisionTimeSeconds = Double.NaN;
        private double oscillationWarnEvents = DEFAULT_OSCILLATION_WARN_EVENTS;
        private double oscillationAlarmEvents = DEFAULT_OSCILLATION_ALARM_EVENTS;
        private Action action = Action.REVERSE;
        private double idleIndexWarn = DEFAULT_IDLE_INDEX_WARN;
        private double idleIndexAlarm = DEFAULT_IDLE_INDEX_ALARM;
        private double outputMin = Double.NEGATIVE_INFINITY;
        private double outputMax = Double.POSITIVE_INFINITY;
        private double saturationWindowSeconds = Double.NaN;
        private double saturationWarnShare = DEFAULT_SATURATION_WARN_SHARE;
        private double saturationAlarmShare = DEFAULT_SATURATION_ALARM_SHARE;
        private int frozenSamples;
        private double quantisationStep;
        private double frozenOutputMove = Double.NaN;
        private double noiseWindowSeconds = Double.NaN;
        private double noiseWarn = Double.NaN;
        private double noiseAlarm = Double.NaN;

        private Builder() {
        }

        /**
         * Required: the period at which the monitor is fed (seconds, &gt; 0).
         *
         * @param seconds h, finite and &gt; 0
         * @return this builder
         */
        public Builder samplePeriodSeconds(double seconds) {
            this.samplePeriodSeconds = seconds;
            return this;
        }

        /**
         * Required: the ultimate period if known, else the integral time (seconds, &ge; 2h).
         *
         * @param seconds T, finite and &ge; 2h
         * @return this builder
         */
        public Builder timeScaleSeconds(double seconds) {
            this.timeScaleSeconds = seconds;
            return this;
        }

        /**
         * Required: the acceptable oscillation amplitude (Hägglund 1995 suggests 1 % of the range).
         *
         * @param amplitude a, in measurement units, finite and &gt; 0
         * @return this builder
         */
        public Builder acceptableAmplitude(double amplitude) {
            this.acceptableAmplitude = amplitude;
            return this;
        }

        /**
         * Default {@value #SUPERVISION_TIME_SCALES} time scales.
         *
         * @param seconds the supervision time, finite and &ge; h
         * @return this builder
         */
        public Builder supervisionTimeSeconds(double seconds) {
            this.supervisionTimeSeconds = seconds;
            return this;
        }

        /**
         * Load-disturbance counts within the supervision time for warn and alarm (defaults 5 and 10).
         *
         * @param warn the count that raises a warning, &gt; 0 and &le; alarm
         * @param alarm the count that means oscillation, finite and &gt; 0
         * @return this builder
         */
        public Builder oscillationEvents(double warn, double alarm) {
            this.oscillationWarnEvents = warn;
            this.oscillationAlarmEvents = alarm;
            return this;
        }

        /**
         * The controller's action (default reverse).
         *
         * @param action reverse or direct, as the controller runs
         * @return this builder
         */
        public Builder action(Action action) {
            this.action = action;
            return this;
        }

        /**
         * Idle-index thresholds for warn and alarm (defaults 0.2 and 0.4).
         *
         * @param warn the index that raises a warning, &gt; −1 and &le; alarm
         * @param alarm the index that means sluggish, &gt; −1 and &lt; 1
         * @return this builder
         */
        public Builder idleIndex(double warn, double alarm) {
            this.idleIndexWarn = warn;
            this.idleIndexAlarm = alarm;
            return this;
        }

        /**
         * The controller's output limits (default none: saturation is never seen).
         *
         * @param min the lowest output, finite or −∞
         * @param max the highest output, &gt; min, finite or +∞
         * @return this builder
         */
        public Builder outputRange(double min, double max) {
            this.outputMin = min;
            this.outputMax = max;
            return this;
        }

        /**
         * Time constant of the saturation share (default the supervision time).
         *
         * @param seconds the time constant, finite and &ge; h
         * @return this builder
         */
        public Builder saturationWindowSeconds(double seconds) {
            this.saturationWindowSeconds = seconds;
            return this;
        }

        /**
         * Shares of samples at a limit for warn and alarm (defaults 0.1 and 0.5).
         *
         * @param warn the share that raises a warning, &gt; 0 and &le; alarm
         * @param alarm the share that raises an alarm, &gt; 0 and &le; 1
         * @return this builder
         */
        public Builder saturationShares(double warn, double alarm) {
            this.saturationWarnShare = warn;
            this.saturationAlarmShare = alarm;
            return this;
        }

        /**
         * N (default one time scale in samples, at least {@value #MIN_DEFAULT_FROZEN_SAMPLES}).
         *
         * @param samples N, &ge; 2, or 0 for the default
         * @return this builder
         */
        public Builder frozenSamples(int samples) {
            this.frozenSamples = samples;
            return this;
        }

        /**
         * The measurement's quantisation step (default 0: any change counts).
         *
         * @param step the step in measurement units, finite and &ge; 0
         * @return this builder
         */
        public Builder quantisationStep(double step) {
            this.quantisationStep = step;
            return this;
        }

        /**
         * The output movement that makes an unchanged measurement suspect (default 1 % of the output range).
         *
         * @param move the output movement (max − min) in output units, finite and &gt; 0; required when the output
         *         range is not finite
         * @return this builder
         */
        public Builder frozenOutputMove(double move) {
            this.frozenOutputMove = move;
            return this;
        }

        /**
         * Time constant of the noise estimate (default the supervision time).
         *
         * @param seconds the time constant, finite and &ge; h
         * @return this builder
         */
        public Builder noiseWindowSeconds(double seconds) {
            this.noiseWindowSeconds = seconds;
            return this;
        }

        /**
         * Noise standard deviations for warn and alarm (defaults a/2 and a).
         *
         * @param warn the standard deviation that raises a warning, in measurement units, &gt; 0 and &le; alarm, or
         *         NaN for half the alarm
         * @param alarm the standard deviation that raises an alarm, in measurement units, finite and &gt; 0, or NaN
         *         for a
         * @return this builder
         */
        public Builder noiseLevels(double warn, double alarm) {
            this.noiseWarn = warn;
            this.noiseAlarm = alarm;
            return this;
        }

        /**
         * The settings.
         *
         * @return the immutable settings
         * @throws InvalidSettingException naming the first value that is not allowed
         */
        public MonitorSettings build() {
            return new MonitorSettings(this);
        }
    }
}
