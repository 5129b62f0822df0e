package org.loopwright.sim.nonideal;

/**
 * The running state of an {@link ActuatorModel}: the last delivered value, for the slew limit. It
 * starts at rest (0, or the nearest end of the range). Allocation-free; not thread-safe.
 */
public final class Actuator {

    private final ActuatorModel model;
    private double delivered;
    private boolean limited;

    /** An actuator at rest. */
    public Actuator(ActuatorModel model) {
        this.model = model;
        reset();
    }

    /** Back to rest. */
    public void reset() {
        delivered = Math.min(Math.max(0.0, model.min()), model.max());
        limited = false;
    }

    /**
     * What the plant receives for a command held over the next interval.
     *
     * @param command        the controller's output
     * @param periodSeconds  the time since the previous command (for the slew limit)
     * @return the delivered input
     */
    public double deliver(double command, double periodSeconds) {
        double dz = model.deadZone();
        double shifted = command > dz ? command - dz : command < -dz ? command + dz : 0.0;
        double clipped = Math.min(Math.max(shifted, model.min()), model.max());
        double step = model.slewPerSecond() * periodSeconds;
        double slewed = Math.min(Math.max(clipped, delivered - step), delivered + step);
        limited = clipped != shifted || slewed != clipped;
        delivered = slewed;
        return slewed;
    }

    /** Whether the last delivery was cut by the range or the slew limit. */
    public boolean limited() {
        return limited;
    }
}
