package org.loopwright.sim.design;

import java.util.List;
import java.util.Objects;

import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.sweep.Spread;

/**
 * What the device can do and what the design asks for: the sample period, the output limits and
 * slew, the sensor delay, the robustness limit Ms, the controller types, the discretisation, and the
 * uncertainty the robustness sweep draws plants from. Every check names the command-line option.
 *
 * @param samplePeriodSeconds  h &gt; 0
 * @param outputMin            lower output limit (−∞ for none)
 * @param outputMax            upper output limit (+∞ for none), &gt; outputMin
 * @param outputSlewPerSecond  output slew limit, &gt; 0 (+∞ for none)
 * @param sensorDelaySamples   whole samples of measurement delay, 0 to {@value #MAX_SENSOR_DELAY}
 * @param maxSensitivity       the limit on Ms, &gt; 1
 * @param types                PI and/or PID, not empty
 * @param integralMethod       the integral's discretisation
 * @param derivativeMethod     the derivative's discretisation
 * @param spread               how far the sweep's plants stray from the model
 * @param runs                 sweep runs per candidate, 1 to {@value #MAX_RUNS}
 * @param seed                 the sweep's seed
 */
public record DesignSpec(double samplePeriodSeconds, double outputMin, double outputMax, double outputSlewPerSecond,
        int sensorDelaySamples, double maxSensitivity, List<ControllerType> types, IntegralMethod integralMethod,
        DerivativeMethod derivativeMethod, Spread spread, int runs, long seed) {

    /** The most sweep runs per candidate. */
    public static final int MAX_RUNS = 10_000;
    /** The most samples of sensor delay. */
    public static final int MAX_SENSOR_DELAY = 100;
    /** Ms limit when none is given (Åström &amp; Hägglund 2006, §4.5: 1.4 is a robust choice, from memory). */
    public static final double DEFAULT_MAX_SENSITIVITY = 1.4;

    /** Validates every value, naming its option. */
    public DesignSpec {
        if (!(samplePeriodSeconds > 0.0) || !Double.isFinite(samplePeriodSeconds)) {
            throw new InputException("--sample-period must be finite and > 0: --sample-period="
                    + samplePeriodSeconds);
        }
        if (Double.isNaN(outputMin) || Double.isNaN(outputMax) || !(outputMin < outputMax)
                || outputMin == Double.POSITIVE_INFINITY || outputMax == Double.NEGATIVE_INFINITY) {
            throw new InputException("--output-min must be < --output-max: --output-min=" + outputMin
                    + ", --output-max=" + outputMax);
        }
        if (!(outputSlewPerSecond > 0.0)) {
            throw new InputException("--output-slew must be > 0: --output-slew=" + outputSlewPerSecond);
        }
        if (sensorDelaySamples < 0 || sensorDelaySamples > MAX_SENSOR_DELAY) {
            throw new InputException("--sensor-delay-samples must be from 0 to " + MAX_SENSOR_DELAY
                    + ": --sensor-delay-samples=" + sensorDelaySamples);
        }
        if (!(maxSensitivity > 1.0) || !Double.isFinite(maxSensitivity)) {
            throw new InputException("--max-sensitivity must be finite and > 1: --max-sensitivity="
                    + maxSensitivity);
        }
        types = List.copyOf(types);
        if (types.isEmpty()) {
            throw new InputException("--type must allow PI or PID: --type=none");
        }
        Objects.requireNonNull(integralMethod, "integralMethod");
        Objects.requireNonNull(derivativeMethod, "derivativeMethod");
        Objects.requireNonNull(spread, "spread");
        if (runs < 1 || runs > MAX_RUNS) {
            throw new InputException("--runs must be from 1 to " + MAX_RUNS + ": --runs=" + runs);
        }
    }

    /** Whether both output limits are given. */
    public boolean hasOutputRange() {
        return Double.isFinite(outputMin) && Double.isFinite(outputMax);
    }
}
