package org.loopwright.pid.tuning;

import java.util.Objects;

/**
 * A rule that does not apply to the given model or controller type, and why — for example a
 * delay-dominant process for Ziegler–Nichols, or a PID variant that the paper does not give.
 *
 * @param rule   the rule
 * @param type   PI or PID
 * @param reason one sentence naming the limit and the offending values
 */
public record RuleNotApplicable(TuningRule rule, ControllerType type, String reason) implements TuningResult {

    /**
     * Checks that nothing is null.
     *
     * @param rule the rule
     * @param type PI or PID
     * @param reason one sentence naming the limit and the offending values
     */
    public RuleNotApplicable {
        Objects.requireNonNull(rule, "rule");
        Objects.requireNonNull(type, "type");
        Objects.requireNonNull(reason, "reason");
    }
}
