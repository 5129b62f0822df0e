package org.loopwright.pid;

/** Who decides the output. Every switch between modes is bumpless. */
public enum Mode {
    /** The control law decides. */
    AUTOMATIC,
    /** The operator sets the output; the range and slew limits still apply. */
    MANUAL,
    /** The output follows an external value (another controller, a selector), within the range. */
    TRACKING
}
