package org.loopwright.pid.tuning;

/**
 * A published tuning rule: one of the {@link ModelRule}s (from a process model) or of the
 * {@link UltimatePointRule}s (from an ultimate gain and period). Each has a label of its own within
 * its set (the word on the command line) and the paper it comes from.
 */
public sealed interface TuningRule permits ModelRule, UltimatePointRule {

    /** @return the rule's short name on the command line, such as {@code "simc"} */
    String label();

    /** @return the paper the rule comes from */
    String citation();
}
