package org.loopwright.sim.metrics;

/** Whether a response's step figures have the settled, finite loop they assume. */
public enum ResponseState {

    /** The output settled within the 2 % band: every step figure applies. */
    SETTLED("settled"),
    /** Still outside the 2 % band in the window's final stretch: no step figure is given. */
    NOT_SETTLED("not settled"),
    /** The run diverged and was stopped (see {@code Divergence}): no figure is given. */
    DIVERGED("DIVERGED"),
    /** No setpoint change in the window (a load response, or a step to where the output already was). */
    NO_STEP("no setpoint change");

    private final String words;

    ResponseState(String words) {
        this.words = words;
    }

    /** How reports write this state. */
    public String words() {
        return words;
    }
}
