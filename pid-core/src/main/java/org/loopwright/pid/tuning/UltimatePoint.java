package org.loopwright.pid.tuning;

import org.loopwright.pid.InvalidSettingException;

/**
 * The ultimate point of a loop: the proportional gain Ku at which it oscillates steadily, and the
 * period Pu of that oscillation, as found by a relay experiment or by raising a P gain.
 *
 * <p>Example: 1/(s+1)³ has Ku = 8 and Pu = 2π/√3 ≈ 3.628 s.
 *
 * @param ultimateGain          Ku, finite and &gt; 0
 * @param ultimatePeriodSeconds Pu, finite and &gt; 0
 */
public record UltimatePoint(double ultimateGain, double ultimatePeriodSeconds) {

    /**
     * Validates both values.
     *
     * @param ultimateGain Ku, finite and &gt; 0
     * @param ultimatePeriodSeconds Pu, finite and &gt; 0
     */
    public UltimatePoint {
        if (!Double.isFinite(ultimateGain) || ultimateGain <= 0.0) {
            throw new InvalidSettingException("ultimateGain", ultimateGain, "must be finite and > 0");
        }
        if (!Double.isFinite(ultimatePeriodSeconds) || ultimatePeriodSeconds <= 0.0) {
            throw new InvalidSettingException("ultimatePeriodSeconds", ultimatePeriodSeconds,
                    "must be finite and > 0");
        }
    }
}
