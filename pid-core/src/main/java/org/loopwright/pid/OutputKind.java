package org.loopwright.pid;

/** Whether the controller emits the actuator's position or the change in it. */
public enum OutputKind {
    /** The output is the actuator position (a heater power, a valve opening). */
    POSITION,
    /**
     * The output is the change since the last sample (velocity form), for actuators that integrate
     * their input such as motor-driven valves. The first sample emits 0; a position step is at most
     * {@link #LARGEST_INCREMENT}, so that the increment is always finite. That holds after a retune
     * too: a range moved further than that from the last position is reached over several samples
     * (only ranges near the ends of the double range can do this).
     */
    INCREMENT;

    /** The largest position step of an increment output: half the largest double. */
    public static final double LARGEST_INCREMENT = Double.MAX_VALUE / 2.0;
}
