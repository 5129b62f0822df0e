package org.loopwright.pid.tuning;

import java.util.Objects;

import org.loopwright.pid.form.IdealGains;

/**
 * Gains that a rule gave, in ideal form, with a note on the design choice behind them (for
 * example the closed-loop time constant used), empty when the rule has none.
 *
 * @param rule  the rule
 * @param type  PI or PID
 * @param gains the ideal-form gains; derivative time 0 for PI
 * @param note  the design parameter used, such as {@code "tau_c = 2.0 s (= L)"}, or empty
 */
public record TunedGains(TuningRule rule, ControllerType type, IdealGains gains, String note)
        implements TuningResult {

    /**
     * Checks that nothing is null.
     *
     * @param rule the rule
     * @param type PI or PID
     * @param gains the ideal-form gains; derivative time 0 for PI
     * @param note the design parameter used, such as {@code "tau_c = 2.0 s (= L)"}, or empty
     */
    public TunedGains {
        Objects.requireNonNull(rule, "rule");
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(gains, "gains");
        Objects.requireNonNull(note, "note");
    }
}
