package org.loopwright.sim.scenario;

import java.util.Locale;

import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.IntegratingModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;

/**
 * A process model written as the {@code plant:} block of the scenario format ({@link ScenarioFile}),
 * each number in Java's shortest round-trip form, so reading the block back gives the same model bit
 * for bit. An integrating process with a lag has no plant type of its own and is written as a
 * transfer function.
 *
 * <p>Example: {@code PlantBlock.yaml(new FopdtModel(2, 30, 5))} is
 * {@code "plant: {type: fopdt, gain: 2.0, time-constant: 30.0, dead-time: 5.0}\n"}.
 */
public final class PlantBlock {

    private PlantBlock() {
    }

    /** The one-line {@code plant:} block, ending in a newline. */
    public static String yaml(ProcessModel model) {
        return "plant: " + mapping(model) + "\n";
    }

    /** The flow mapping of the model, such as {@code {type: fopdt, gain: 2.0, ...}}. */
    public static String mapping(ProcessModel model) {
        double k = model.processGain();
        double l = model.deadTimeSeconds();
        if (model instanceof FopdtModel m) {
            return String.format(Locale.ROOT, "{type: fopdt, gain: %s, time-constant: %s, dead-time: %s}", k,
                    m.timeConstantSeconds(), l);
        }
        if (model instanceof SopdtModel m) {
            return String.format(Locale.ROOT, "{type: sopdt, gain: %s, time-constants: [%s, %s], dead-time: %s}", k,
                    m.timeConstantSeconds(), m.secondTimeConstantSeconds(), l);
        }
        IntegratingModel m = (IntegratingModel) model;
        if (m.lagSeconds() == 0.0) {
            return String.format(Locale.ROOT, "{type: integrating, gain: %s, dead-time: %s}", k, l);
        }
        return String.format(Locale.ROOT, "{type: transfer-function, numerator: [%s], denominator: [%s, 1.0, 0.0],"
                + " dead-time: %s}", k, m.lagSeconds(), l);
    }
}
