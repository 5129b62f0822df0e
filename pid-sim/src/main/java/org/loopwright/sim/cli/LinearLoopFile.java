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
 * controller.
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
        Scenario scenario = ScenarioFile.read(file);
        TransferFunction plant = scenario.linearPlant().orElseThrow(() -> InputFileException.whole(file.toString(),
                command + " needs a linear plant (" + PlantType.linearWords() + "): plant.type="
                        + scenario.plant().type().word(), null));
        ControllerSettings settings = scenario.controller().orElseThrow(() -> InputFileException.whole(
                file.toString(), command + " needs a PID controller (the controller key): on-off=given", null));
        return new LinearLoopFile(scenario, plant, settings);
    }
}
