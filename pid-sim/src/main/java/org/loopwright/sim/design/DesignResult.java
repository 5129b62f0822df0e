package org.loopwright.sim.design;

import java.util.List;
import java.util.Optional;

/**
 * What a design found: the model, the specification, the experiment, every candidate with its
 * evidence, the rules that did not apply and why, the recommendation and the discretisation check
 * of the recommended gains.
 *
 * @param model          the model
 * @param spec           the specification
 * @param experiment     the closed-loop experiment of the checks
 * @param candidates     every candidate, in the order proposed
 * @param notApplicable  "rule (type): reason" for each rule that did not apply
 * @param recommended    the recommendation; empty only when no candidate is stable
 * @param constraintsMet whether the recommendation meets the constraints
 * @param discretisation the recommended gains under each discretisation at h (empty without a recommendation)
 */
public record DesignResult(DesignModel model, DesignSpec spec, DesignExperiment experiment, List<Candidate> candidates,
        List<String> notApplicable, Optional<Candidate> recommended, boolean constraintsMet,
        List<DiscretisationCheck> discretisation) {

    /** The verdict word of design.json. */
    public static final String RECOMMENDED = "recommended";
    /** The verdict word when no candidate meets the constraints. */
    public static final String NONE_MEETS = "no-candidate-meets-constraints";

    /** Copies the lists. */
    public DesignResult {
        candidates = List.copyOf(candidates);
        notApplicable = List.copyOf(notApplicable);
        discretisation = List.copyOf(discretisation);
    }

    /** {@value #RECOMMENDED} or {@value #NONE_MEETS}. */
    public String verdict() {
        return constraintsMet ? RECOMMENDED : NONE_MEETS;
    }
}
