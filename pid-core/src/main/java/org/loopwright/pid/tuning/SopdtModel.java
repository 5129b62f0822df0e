package org.loopwright.pid.tuning;

import org.loopwright.pid.InvalidSettingException;

/**
 * A second-order-plus-dead-time process model with real poles,
 * G(s) = K·e^(−sL)/((T1·s + 1)(T2·s + 1)), T1 &ge; T2.
 *
 * <p>Example: a heated plate whose sensor sits behind a 12 s lag, K = 0.8, T1 = 90 s, T2 = 12 s,
 * L = 4 s, is {@code new SopdtModel(0.8, 90, 12, 4)}.
 *
 * @param processGain               K, finite and non-zero
 * @param timeConstantSeconds       T1, finite and &gt; 0
 * @param secondTimeConstantSeconds T2, finite, &gt; 0 and &le; T1
 * @param deadTimeSeconds           L, finite and &ge; 0
 */
public record SopdtModel(double processGain, double timeConstantSeconds, double secondTimeConstantSeconds,
        double deadTimeSeconds) implements ProcessModel {

    /**
     * Validates every parameter; see the record description for the allowed ranges.
     *
     * @param processGain K, finite and non-zero
     * @param timeConstantSeconds T1, finite and &gt; 0
     * @param secondTimeConstantSeconds T2, finite, &gt; 0 and &le; T1
     * @param deadTimeSeconds L, finite and &ge; 0
     */
    public SopdtModel {
        if (!Double.isFinite(processGain) || processGain == 0.0) {
            throw new InvalidSettingException("processGain", processGain, "must be finite and non-zero");
        }
        if (!Double.isFinite(timeConstantSeconds) || timeConstantSeconds <= 0.0) {
            throw new InvalidSettingException("timeConstantSeconds", timeConstantSeconds, "must be finite and > 0");
        }
        if (!Double.isFinite(secondTimeConstantSeconds) || secondTimeConstantSeconds <= 0.0
                || secondTimeConstantSeconds > timeConstantSeconds) {
            throw new InvalidSettingException("secondTimeConstantSeconds", secondTimeConstantSeconds,
                    "must be finite, > 0 and <= the first time constant (" + timeConstantSeconds + ")");
        }
        if (!Double.isFinite(deadTimeSeconds) || deadTimeSeconds < 0.0) {
            throw new InvalidSettingException("deadTimeSeconds", deadTimeSeconds, "must be finite and >= 0");
        }
    }

    /**
     * Skogestad's half rule (2003): half of T2 goes to the time constant, half to the dead time,
     * giving the first-order model K·e^(−s(L + T2/2))/((T1 + T2/2)·s + 1).
     *
     * @return the first-order-plus-dead-time model with time constant T1 + T2/2 and dead time L + T2/2
     */
    public FopdtModel halfRule() {
        return new FopdtModel(processGain, timeConstantSeconds + secondTimeConstantSeconds / 2.0,
                deadTimeSeconds + secondTimeConstantSeconds / 2.0);
    }
}
