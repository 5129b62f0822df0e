package org.loopwright.sim.cli;

import java.nio.file.Path;
import java.util.List;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.config.NumberRule;
import org.loopwright.sim.config.YamlDocument;

import static java.util.Map.entry;

/**
 * Reads the model that {@code identify --json} prints: {@code model} (fopdt or sopdt), {@code gain},
 * {@code time_constant} (fopdt) or {@code time_constants} [T1, T2] (sopdt), {@code dead_time}; the fit's
 * other keys are allowed and ignored. JSON is read as YAML (a subset of it), so every error names the
 * file, line and column.
 */
final class ModelFile {

    private static final Keywords<String> KINDS = Keywords.of(entry("fopdt", "fopdt"), entry("sopdt", "sopdt"));
    private static final List<String> KEYS = List.of("model", "gain", "time_constant", "time_constants", "dead_time",
            "baseline", "step_time", "input_change", "rmse", "r_squared");

    private ModelFile() {
    }

    static ProcessModel read(Path file) {
        YamlDocument doc = YamlDocument.read(file);
        doc.requireKeys("", KEYS);
        String kind = doc.requiredChoice("/model", KINDS);
        double gain = doc.requiredNumber("/gain", NumberRule.FINITE);
        double deadTime = doc.requiredNumber("/dead_time", NumberRule.NON_NEGATIVE);
        try {
            if (kind.equals("fopdt")) {
                return new FopdtModel(gain, doc.requiredNumber("/time_constant", NumberRule.POSITIVE), deadTime);
            }
            double[] lags = doc.numberList("/time_constants", NumberRule.POSITIVE);
            if (lags.length != 2) {
                throw doc.error("/time_constants", "time_constants must hold two values [T1, T2] for sopdt:"
                        + " time_constants=" + doc.sourceText("/time_constants"));
            }
            return new SopdtModel(gain, Math.max(lags[0], lags[1]), Math.min(lags[0], lags[1]), deadTime);
        } catch (InvalidSettingException e) {
            throw doc.error("/gain", e.getMessage());
        }
    }
}
