package org.loopwright.pid;

/** Who decides the output. Every switch between modes is bumpless. */
public enum Mode {
    /** The control law decides. */
    AUTOMATIC,
    /** The operator sets the output; the range and slew limits still apply. */
    MANUAL,
    /**
     * The output follows an external value (another controller, a selector, the actuator's real
     * position); the range and slew limits still apply, so entering tracking moves the output no
     * faster than the slew limit allows.
     */
    TRACKING
}
