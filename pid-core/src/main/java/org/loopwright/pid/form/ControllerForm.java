package org.loopwright.pid.form;

/** The way a set of PID gains is written; every form runs as its exact parallel equivalent. */
public enum ControllerForm {
    /** Kp, Ki, Kd acting side by side: u = Kp·e + Ki·∫e + Kd·de/dt. */
    PARALLEL,
    /** Kc, Ti, Td, non-interacting: u = Kc·(e + ∫e/Ti + Td·de/dt). */
    IDEAL,
    /** Kc', Ti', Td', interacting: u = Kc'·(1 + 1/(s·Ti'))·(1 + s·Td')·e. */
    SERIES
}
