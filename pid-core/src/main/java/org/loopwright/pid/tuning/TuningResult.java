package org.loopwright.pid.tuning;

/**
 * What a tuning rule gives for one model and controller type: either {@link TunedGains} or, when
 * the rule does not apply, {@link RuleNotApplicable} with the reason. Both carry the citation.
 */
public sealed interface TuningResult permits TunedGains, RuleNotApplicable {

    /** {@return the rule that was asked} */
    TuningRule rule();

    /** {@return the controller type that was asked for} */
    ControllerType type();

    /** {@return the paper the rule comes from} */
    default String citation() {
        return rule().citation();
    }
}
