package org.loopwright.pid.form;

import org.loopwright.pid.SettingChecks;

/**
 * Series (interacting) gains: u = Kc'·(1 + 1/(s·Ti'))·(1 + s·Td')·e. Ti' = ∞ means no integral
 * action. The controller runs these as their exact ideal equivalent, with the derivative filter
 * applied to the ideal Td.
 *
 * @param gain           Kc', finite and &ge; 0
 * @param integralTime   Ti' in seconds, &gt; 0, or {@link Double#POSITIVE_INFINITY}
 * @param derivativeTime Td' in seconds, finite and &ge; 0
 */
public record SeriesGains(double gain, double integralTime, double derivativeTime) implements PidGains {

    /**
     * Validates every value; see the record description for the allowed ranges.
     *
     * @param gain Kc', finite and &ge; 0
     * @param integralTime Ti' in seconds, &gt; 0, or {@link Double#POSITIVE_INFINITY}
     * @param derivativeTime Td' in seconds, finite and &ge; 0
     */
    public SeriesGains {
        SettingChecks.nonNegative("gain", gain);
        SettingChecks.positiveOrInfinite("integralTime", integralTime, "no integral action");
        SettingChecks.nonNegative("derivativeTime", derivativeTime);
    }

    @Override
    public ControllerForm form() {
        return ControllerForm.SERIES;
    }

    /**
     * The ideal equivalent, which always exists (Åström &amp; Hägglund 2006, eq. 3.9):
     * Kc = Kc'·(1 + Td'/Ti'), Ti = Ti' + Td', Td = Ti'·Td'/(Ti' + Td').
     *
     * @return the ideal gains Kc, Ti, Td
     */
    public IdealGains toIdeal() {
        if (Double.isInfinite(integralTime)) {
            return new IdealGains(gain, integralTime, derivativeTime);
        }
        double sum = integralTime + derivativeTime;
        return new IdealGains(gain * sum / integralTime, sum, integralTime * derivativeTime / sum);
    }

    @Override
    public ParallelGains toParallel() {
        return toIdeal().toParallel();
    }
}
