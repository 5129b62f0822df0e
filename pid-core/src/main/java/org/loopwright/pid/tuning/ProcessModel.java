package org.loopwright.pid.tuning;

/**
 * A process model the model-based tuning rules take: first order plus dead time
 * ({@link FopdtModel}), second order plus dead time ({@link SopdtModel}) or integrating plus dead
 * time, with an optional lag ({@link IntegratingModel}). Each rule says which of them its paper
 * covers and returns a {@link RuleNotApplicable} for the others.
 */
public sealed interface ProcessModel permits FopdtModel, SopdtModel, IntegratingModel {

    /** {@return K: the static gain, or for an integrating process the rate of change per unit input (1/s)} */
    double processGain();

    /** {@return L, the dead time in seconds, &ge; 0} */
    double deadTimeSeconds();

    /** {@return |K|, the magnitude the rules tune on (a negative gain asks for direct action)} */
    default double gainMagnitude() {
        return Math.abs(processGain());
    }
}
