package org.loopwright.pid.tuning;

import org.loopwright.pid.InvalidSettingException;

/**
 * A first-order-plus-dead-time process model G(s) = K·e^(−sL)/(T·s + 1).
 *
 * <p>Example: a water bath that settles 2.5 °C higher per 10 % more heater power, with a 120 s
 * time constant and 15 s of dead time, is {@code new FopdtModel(0.25, 120.0, 15.0)}.
 *
 * <p>A negative gain is a process whose measurement falls when the output rises (a cooler): the
 * rules tune on |K| and the controller then needs direct action.
 *
 * @param processGain         K in measurement units per output unit, finite and non-zero
 * @param timeConstantSeconds T, finite and &gt; 0
 * @param deadTimeSeconds     L, finite and &ge; 0
 */
public record FopdtModel(double processGain, double timeConstantSeconds, double deadTimeSeconds)
        implements ProcessModel {

    /**
     * Validates every parameter; see the record description for the allowed ranges.
     *
     * @param processGain K in measurement units per output unit, finite and non-zero
     * @param timeConstantSeconds T, finite and &gt; 0
     * @param deadTimeSeconds L, finite and &ge; 0
     */
    public FopdtModel {
        if (!Double.isFinite(processGain) || processGain == 0.0) {
            throw new InvalidSettingException("processGain", processGain, "must be finite and non-zero");
        }
        if (!Double.isFinite(timeConstantSeconds) || timeConstantSeconds <= 0.0) {
            throw new InvalidSettingException("timeConstantSeconds", timeConstantSeconds, "must be finite and > 0");
        }
        if (!Double.isFinite(deadTimeSeconds) || deadTimeSeconds < 0.0) {
            throw new InvalidSettingException("deadTimeSeconds", deadTimeSeconds, "must be finite and >= 0");
        }
    }

    /** {@return the normalised dead time τ = L/(L + T), between 0 (lag-dominant) and 1 (pure delay)} */
    public double normalisedDeadTime() {
        return deadTimeSeconds / (deadTimeSeconds + timeConstantSeconds);
    }
}
