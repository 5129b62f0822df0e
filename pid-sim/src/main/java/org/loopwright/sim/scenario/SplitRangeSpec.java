package org.loopwright.sim.scenario;

import java.util.Objects;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.multiloop.ActuatorRange;
import org.loopwright.pid.multiloop.SplitRange;

/**
 * A split range as a scenario gives it: the controller output that drives the actuator is spread
 * over a first actuator (below the split) and a second (above it), and the plant's input is
 * {@code second − first}: the first pulls the process down (cooling), the second pushes it up
 * (heating), each in the plant's input units.
 *
 * @param splitAt the controller output at the split
 * @param gap     the band around the split where both idle (0 for none)
 * @param first   the first actuator's range
 * @param second  the second actuator's range
 */
public record SplitRangeSpec(double splitAt, double gap, ActuatorRange first, ActuatorRange second) {

    /** Requires both ranges; {@link #forController} checks the values against the controller. */
    public SplitRangeSpec {
        Objects.requireNonNull(first, "first");
        Objects.requireNonNull(second, "second");
    }

    /**
     * The split over the output range of the controller that drives the actuator.
     *
     * @throws org.loopwright.pid.InvalidSettingException naming the value that does not fit
     */
    public SplitRange forController(ControllerSettings settings) {
        return new SplitRange(settings, splitAt, gap, first, second);
    }
}
