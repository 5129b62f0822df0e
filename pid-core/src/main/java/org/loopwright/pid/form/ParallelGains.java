package org.loopwright.pid.form;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;

/**
 * Parallel-form gains: u = Kp·e + Ki·∫e dt + Kd·de/dt, all in output units per unit of error
 * (Ki per second, Kd times seconds). Ki = 0 means no integral action, Kd = 0 no derivative.
 *
 * <p>Example: {@code new ParallelGains(2.0, 0.1, 4.0)} is Kc = 2, Ti = 20 s, Td = 2 s in ideal form.
 *
 * @param proportionalGain Kp, finite and &ge; 0
 * @param integralGain     Ki in 1/s, finite and &ge; 0
 * @param derivativeGain   Kd in s, finite and &ge; 0
 */
public record ParallelGains(double proportionalGain, double integralGain, double derivativeGain)
        implements PidGains {

    /**
     * Validates every gain; see the record description for the allowed ranges.
     *
     * @param proportionalGain Kp, finite and &ge; 0
     * @param integralGain Ki in 1/s, finite and &ge; 0
     * @param derivativeGain Kd in s, finite and &ge; 0
     */
    public ParallelGains {
        SettingChecks.nonNegative("proportionalGain", proportionalGain);
        SettingChecks.nonNegative("integralGain", integralGain);
        SettingChecks.nonNegative("derivativeGain", derivativeGain);
    }

    @Override
    public ControllerForm form() {
        return ControllerForm.PARALLEL;
    }

    @Override
    public ParallelGains toParallel() {
        return this;
    }

    /**
     * The ideal equivalent Kc = Kp, Ti = Kp/Ki, Td = Kd/Kp (Åström &amp; Hägglund 2006, §3.4).
     *
     * @return the ideal gains Kc, Ti, Td
     * @throws InvalidSettingException when Kp = 0 and Ki or Kd is not, which no ideal form can express
     */
    public IdealGains toIdeal() {
        if (proportionalGain == 0.0 && (integralGain > 0.0 || derivativeGain > 0.0)) {
            throw new InvalidSettingException("proportionalGain", proportionalGain,
                    "must be > 0 to express integral or derivative action in ideal form");
        }
        double integralTime = integralGain == 0.0 ? Double.POSITIVE_INFINITY : proportionalGain / integralGain;
        double derivativeTime = proportionalGain == 0.0 ? 0.0 : derivativeGain / proportionalGain;
        return new IdealGains(proportionalGain, integralTime, derivativeTime);
    }
}
