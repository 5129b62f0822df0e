package org.loopwright.pid.tuning;

import org.loopwright.pid.InvalidSettingException;

/**
 * An integrating process with dead time and an optional lag, G(s) = K·e^(−sL)/(s·(T·s + 1)); T = 0
 * for a pure integrator. K is the rate at which the measurement moves per unit of output, in
 * measurement units per second per output unit.
 *
 * <p>Example: a tank level that rises 0.002 m/s per % of inlet valve, seen after 3 s, is
 * {@code new IntegratingModel(0.002, 0.0, 3.0)}.
 *
 * @param processGain     K, finite and non-zero
 * @param lagSeconds      T, finite and &ge; 0
 * @param deadTimeSeconds L, finite and &ge; 0
 */
public record IntegratingModel(double processGain, double lagSeconds, double deadTimeSeconds)
        implements ProcessModel {

    /**
     * Validates every parameter; see the record description for the allowed ranges.
     *
     * @param processGain K, finite and non-zero
     * @param lagSeconds T, finite and &ge; 0
     * @param deadTimeSeconds L, finite and &ge; 0
     */
    public IntegratingModel {
        if (!Double.isFinite(processGain) || processGain == 0.0) {
            throw new InvalidSettingException("processGain", processGain, "must be finite and non-zero");
        }
        if (!Double.isFinite(lagSeconds) || lagSeconds < 0.0) {
            throw new InvalidSettingException("lagSeconds", lagSeconds, "must be finite and >= 0");
        }
        if (!Double.isFinite(deadTimeSeconds) || deadTimeSeconds < 0.0) {
            throw new InvalidSettingException("deadTimeSeconds", deadTimeSeconds, "must be finite and >= 0");
        }
    }
}
