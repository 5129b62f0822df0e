package org.loopwright.sim.cli;

import java.nio.file.Path;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.plant.PlantType;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;

/**
 * A scenario file read for a frequency-domain command, which needs a linear plant and a PID
 * controller with fixed gains driving one actuator (no schedule, no split range). A cascade is
 * refused unless the command analyses cascades; its inner plant must be linear too.
 *
 * @param scenario the scenario as read
 * @param plant    its plant as a transfer function with dead time
 * @param settings its PID controller
 */
record LinearLoopFile(Scenario scenario, TransferFunction plant, ControllerSettings settings) {

    /**
     * Reads {@code file} for {@code command}.
     *
     * @throws InputFileException for a bad file, a nonlinear plant or an on-off controller
     */
    static LinearLoopFile read(Path file, String command) {
        return read(file, command, false);
    }

    /**
     * Reads {@code file} for {@code command}, which may analyse a cascade.
     *
     * @throws InputFileException for a bad file, a nonlinear plant, an on-off controller, a schedule,
     *                            a split range, or a cascade when the command does not take one
     */
    static LinearLoopFile read(Path file, String command, boolean cascades) {
        Scenario scenario = ScenarioFile.read(file);
        if (scenario.schedule().isPresent()) {
            throw InputFileException.whole(file.toString(), command + " analyses a loop with fixed gains, and the"
                    + " controller has a schedule: copy one point's gains into a scenario without the schedule", null);
        }
        if (scenario.splitRange().isPresent()) {
            throw InputFileException.whole(file.toString(), command + " analyses a loop with one actuator, and"
                    + " split-range is given: analyse each side as a plant of its own gain", null);
        }
        if (scenario.inner().isPresent() && !cascades) {
            throw InputFileException.whole(file.toString(), command + " studies a single loop, and inner is given"
                    + " (a cascade): margins and simulate take cascades", null);
        }
        if (scenario.inner().isPresent() && scenario.inner().get().plant().linear().isEmpty()) {
            throw InputFileException.whole(file.toString(), command + " needs a linear inner plant ("
                    + PlantType.linearWords() + "): inner.plant.type=" + scenario.inner().get().plant().type().word(),
                    null);
        }
        TransferFunction plant = scenario.linearPlant().orElseThrow(() -> InputFileException.whole(file.toString(),
                command + " needs a linear plant (" + PlantType.linearWords() + "): plant.type="
                        + scenario.plant().type().word(), null));
        ControllerSettings settings = scenario.controller().orElseThrow(() -> InputFileException.whole(
                file.toString(), command + " needs a PID controller (the controller key): on-off=given", null));
        return new LinearLoopFile(scenario, plant, settings);
    }
}
