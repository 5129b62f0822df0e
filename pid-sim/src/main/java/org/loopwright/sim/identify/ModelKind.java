package org.loopwright.sim.identify;

/** The model structures a step test can be fitted with. */
public enum ModelKind {
    /** K·e^(−sL)/(T·s + 1): first order plus dead time. */
    FOPDT("fopdt"),
    /** K·e^(−sL)/((T1·s + 1)(T2·s + 1)), T1 &ge; T2: second order plus dead time, real poles. */
    SOPDT("sopdt");

    private final String label;

    ModelKind(String label) {
        this.label = label;
    }

    /** The name on the command line and in JSON. */
    public String label() {
        return label;
    }

    /** The number of time constants. */
    public int order() {
        return this == FOPDT ? 1 : 2;
    }
}
