package org.loopwright.pid.tuning;

import java.util.Objects;

import org.loopwright.pid.Action;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;

/**
 * The settings of a {@link RelayExperiment}, validated once and immutable.
 *
 * <p>Example: a water bath held near 40 °C, heater at 30 %, relay ±10 % with 0.1 °C hysteresis,
 * aborting beyond ±2 °C, after 2 h, or when the relay has not switched for 20 min:
 * <pre>{@code
 * RelaySettings s = RelaySettings.builder()
 *         .setpoint(40.0).bias(30.0).relayAmplitude(10.0).hysteresis(0.1)
 *         .excursionLimit(2.0).timeoutSeconds(7200.0).maxHalfPeriodSeconds(1200.0)
 *         .build();
 * }</pre>
 *
 * <p>Thread-safe: immutable.
 */
public final class RelaySettings {

    /** Default number of cycles whose period and amplitude are averaged. */
    public static final int DEFAULT_MEASURED_CYCLES = 3;
    /** Default number of cycles discarded while the oscillation settles. */
    public static final int DEFAULT_SETTLING_CYCLES = 2;
    /** Default largest relative spread of period and amplitude among the measured cycles. */
    public static final double DEFAULT_CYCLE_TOLERANCE = 0.02;

    private final double setpoint;
    private final double bias;
    private final double relayAmplitude;
    private final double hysteresis;
    private final double excursionLimit;
    private final double timeoutSeconds;
    private final double maxHalfPeriodSeconds;
    private final int measuredCycles;
    private final int settlingCycles;
    private final double cycleTolerance;
    private final Action action;

    private RelaySettings(Builder b) {
        setpoint = SettingChecks.finite("setpoint", b.setpoint);
        bias = SettingChecks.finite("bias", b.bias);
        relayAmplitude = SettingChecks.positive("relayAmplitude", b.relayAmplitude);
        hysteresis = SettingChecks.nonNegative("hysteresis", b.hysteresis);
        excursionLimit = SettingChecks.positive("excursionLimit", b.excursionLimit);
        if (excursionLimit <= hysteresis) {
            throw new InvalidSettingException("excursionLimit", excursionLimit,
                    "must be > hysteresis (" + hysteresis + ")");
        }
        timeoutSeconds = SettingChecks.positive("timeoutSeconds", b.timeoutSeconds);
        maxHalfPeriodSeconds = SettingChecks.positive("maxHalfPeriodSeconds", b.maxHalfPeriodSeconds);
        if (maxHalfPeriodSeconds > timeoutSeconds) {
            throw new InvalidSettingException("maxHalfPeriodSeconds", maxHalfPeriodSeconds,
                    "must be <= timeoutSeconds (" + timeoutSeconds + ")");
        }
        measuredCycles = SettingChecks.atLeast("measuredCycles", b.measuredCycles, 2);
        settlingCycles = SettingChecks.atLeast("settlingCycles", b.settlingCycles, 0);
        if (!(b.cycleTolerance > 0.0 && b.cycleTolerance < 1.0)) {
            throw new InvalidSettingException("cycleTolerance", b.cycleTolerance, "must be > 0 and < 1");
        }
        cycleTolerance = b.cycleTolerance;
        action = Objects.requireNonNull(b.action, "action");
    }

    /** {@return a builder with no defaults for the required values (NaN until set)} */
    public static Builder builder() {
        return new Builder();
    }

    /** {@return the process-variable value the relay switches around} */
    public double setpoint() {
        return setpoint;
    }

    /** {@return the centre of the relay output: it switches between bias − d and bias + d} */
    public double bias() {
        return bias;
    }

    /** {@return d, half the relay's output swing, &gt; 0} */
    public double relayAmplitude() {
        return relayAmplitude;
    }

    /** {@return ε, the half-width of the band around the setpoint inside which the relay holds, &ge; 0} */
    public double hysteresis() {
        return hysteresis;
    }

    /** {@return the largest allowed |y − setpoint|; beyond it the experiment aborts} */
    public double excursionLimit() {
        return excursionLimit;
    }

    /** {@return the longest the experiment may run before it aborts, in seconds} */
    public double timeoutSeconds() {
        return timeoutSeconds;
    }

    /** {@return the longest the relay may stay in one position before the experiment aborts, in seconds} */
    public double maxHalfPeriodSeconds() {
        return maxHalfPeriodSeconds;
    }

    /** {@return how many consecutive cycles must agree before the result is taken, &ge; 2} */
    public int measuredCycles() {
        return measuredCycles;
    }

    /** {@return how many complete cycles are discarded first while the oscillation settles, &ge; 0} */
    public int settlingCycles() {
        return settlingCycles;
    }

    /** {@return the largest relative deviation of any measured cycle's period or amplitude from their mean} */
    public double cycleTolerance() {
        return cycleTolerance;
    }

    /**
     * {@return the relay's action} Reverse: output high while the measurement is below the setpoint (a heater);
     * direct: the opposite.
     */
    public Action action() {
        return action;
    }

    /** Collects relay settings; {@link #build()} validates them. Not thread-safe. */
    public static final class Builder {
        private double setpoint = Double.NaN;
        private double bias = Double.NaN;
        private double relayAmplitude = Double.NaN;
        private double hysteresis;
        private double excursionLimit = Double.NaN;
        private double timeoutSeconds = Double.NaN;
        private double maxHalfPeriodSeconds = Double.NaN;
        private int measuredCycles = DEFAULT_MEASURED_CYCLES;
        private int settlingCycles = DEFAULT_SETTLING_CYCLES;
        private double cycleTolerance = DEFAULT_CYCLE_TOLERANCE;
        private Action action = Action.REVERSE;

        private Builder() {
        }

        /**
         * @param value the setpoint, finite, in process units (required)
         * @return this builder
         * @see RelaySettings#setpoint()
         */
        public Builder setpoint(double value) {
            setpoint = value;
            return this;
        }

        /**
         * @param value the output bias, finite, in output units (required)
         * @return this builder
         * @see RelaySettings#bias()
         */
        public Builder bias(double value) {
            bias = value;
            return this;
        }

        /**
         * @param value d, finite and &gt; 0, in output units (required)
         * @return this builder
         * @see RelaySettings#relayAmplitude()
         */
        public Builder relayAmplitude(double value) {
            relayAmplitude = value;
            return this;
        }

        /**
         * @param value ε, finite and &ge; 0, in process units
         * @return this builder
         * @see RelaySettings#hysteresis() (default 0)
         */
        public Builder hysteresis(double value) {
            hysteresis = value;
            return this;
        }

        /**
         * @param value the limit, finite and &gt; the hysteresis, in process units (required)
         * @return this builder
         * @see RelaySettings#excursionLimit()
         */
        public Builder excursionLimit(double value) {
            excursionLimit = value;
            return this;
        }

        /**
         * @param value the timeout in seconds, finite and &gt; 0 (required)
         * @return this builder
         * @see RelaySettings#timeoutSeconds()
         */
        public Builder timeoutSeconds(double value) {
            timeoutSeconds = value;
            return this;
        }

        /**
         * @param value the longest half period in seconds, finite, &gt; 0 and &le; the timeout (required)
         * @return this builder
         * @see RelaySettings#maxHalfPeriodSeconds()
         */
        public Builder maxHalfPeriodSeconds(double value) {
            maxHalfPeriodSeconds = value;
            return this;
        }

        /**
         * @param value the count, &ge; 2
         * @return this builder
         * @see RelaySettings#measuredCycles() (default {@value RelaySettings#DEFAULT_MEASURED_CYCLES})
         */
        public Builder measuredCycles(int value) {
            measuredCycles = value;
            return this;
        }

        /**
         * @param value the count, &ge; 0
         * @return this builder
         * @see RelaySettings#settlingCycles() (default {@value RelaySettings#DEFAULT_SETTLING_CYCLES})
         */
        public Builder settlingCycles(int value) {
            settlingCycles = value;
            return this;
        }

        /**
         * @param value the relative tolerance, &gt; 0 and &lt; 1
         * @return this builder
         * @see RelaySettings#cycleTolerance() (default {@value RelaySettings#DEFAULT_CYCLE_TOLERANCE})
         */
        public Builder cycleTolerance(double value) {
            cycleTolerance = value;
            return this;
        }

        /**
         * @param value reverse (a heater) or direct
         * @return this builder
         * @see RelaySettings#action() (default reverse)
         */
        public Builder action(Action value) {
            action = value;
            return this;
        }

        /**
         * Validates and builds.
         *
         * @return the immutable settings
         * @throws InvalidSettingException naming the first invalid setting, its value and the rule
         */
        public RelaySettings build() {
            return new RelaySettings(this);
        }
    }
}
