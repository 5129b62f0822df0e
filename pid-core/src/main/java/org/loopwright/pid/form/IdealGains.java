package org.loopwright.pid.form;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;

/**
 * Ideal (non-interacting, "standard") gains: u = Kc·(e + (1/Ti)·∫e dt + Td·de/dt).
 * Ti = ∞ means no integral action; Td = 0 no derivative action.
 *
 * <p>Example: Kc = 2, Ti = 30 s, Td = 5 s is {@code new IdealGains(2.0, 30.0, 5.0)}.
 *
 * @param gain           Kc, finite and &ge; 0
 * @param integralTime   Ti in seconds, &gt; 0, or {@link Double#POSITIVE_INFINITY}
 * @param derivativeTime Td in seconds, finite and &ge; 0
 */
public record IdealGains(double gain, double integralTime, double derivativeTime) implements PidGains {

    /**
     * How far below 0 the discriminant 1 − 4·Td/Ti may fall by rounding and still count as Ti = 4·Td:
     * a series form with Ti' = Td' converts to exactly that boundary, a few ulps off either side.
     */
    private static final double ROUNDING = 1e-12;

    /**
     * Validates every value; see the record description for the allowed ranges.
     *
     * @param gain Kc, finite and &ge; 0
     * @param integralTime Ti in seconds, &gt; 0, or {@link Double#POSITIVE_INFINITY}
     * @param derivativeTime Td in seconds, finite and &ge; 0
     */
    public IdealGains {
        SettingChecks.nonNegative("gain", gain);
        SettingChecks.positiveOrInfinite("integralTime", integralTime, "no integral action");
        SettingChecks.nonNegative("derivativeTime", derivativeTime);
    }

    /**
     * PI or P-only gains: no derivative action.
     *
     * @param gain Kc, finite and &ge; 0
     * @param integralTime Ti in seconds, &gt; 0, or {@link Double#POSITIVE_INFINITY} for P only
     * @return the gains with Td = 0
     */
    public static IdealGains pi(double gain, double integralTime) {
        return new IdealGains(gain, integralTime, 0.0);
    }

    @Override
    public ControllerForm form() {
        return ControllerForm.IDEAL;
    }

    /** Kp = Kc, Ki = Kc/Ti, Kd = Kc·Td (Åström &amp; Hägglund 2006, §3.4). */
    @Override
    public ParallelGains toParallel() {
        double integralGain = Double.isInfinite(integralTime) ? 0.0 : gain / integralTime;
        return new ParallelGains(gain, integralGain, gain * derivativeTime);
    }

    /**
     * The series (interacting) equivalent, which exists only when Ti &ge; 4·Td
     * (Åström &amp; Hägglund 2006, eq. 3.10): with s = √(1 − 4·Td/Ti),
     * Kc' = Kc·(1 + s)/2, Ti' = Ti·(1 + s)/2, Td' = Ti·(1 − s)/2.
     *
     * @return the series gains Kc', Ti', Td'
     * @throws InvalidSettingException naming Ti and Td when Ti &lt; 4·Td (beyond rounding)
     */
    public SeriesGains toSeries() {
        if (derivativeTime == 0.0 || Double.isInfinite(integralTime)) {
            return new SeriesGains(gain, integralTime, derivativeTime);
        }
        double discriminant = 1.0 - 4.0 * derivativeTime / integralTime;
        if (discriminant < -ROUNDING) {
            throw new InvalidSettingException("integralTime", integralTime,
                    "must be >= 4 * derivativeTime for a series form to exist (derivativeTime="
                            + derivativeTime + ")");
        }
        double root = Math.sqrt(Math.max(discriminant, 0.0));
        return new SeriesGains(gain * (1.0 + root) / 2.0,
                integralTime * (1.0 + root) / 2.0,
                integralTime * (1.0 - root) / 2.0);
    }
}
