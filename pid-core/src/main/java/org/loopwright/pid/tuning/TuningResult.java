package org.loopwright.pid.tuning;

/**
 * What a tuning rule gives for one model and controller type: either {@link TunedGains} or, when
 * the rule does not apply, {@link RuleNotApplicable} with the reason. Both carry the citation.
 */
public sealed interface TuningResult permits TunedGains, RuleNotApplicable {

    /** The rule that was asked. */
    TuningRule rule();

    /** The controller type that was asked for. */
    ControllerType type();

    /** The paper the rule comes from. */
    default String citation() {
        return rule().citation();
    }
}
