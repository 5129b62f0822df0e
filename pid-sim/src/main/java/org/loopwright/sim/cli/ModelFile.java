package org.loopwright.sim.cli;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import com.fasterxml.jackson.databind.PropertyNamingStrategies;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.sim.config.NumberRule;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.identify.ModelKind;

/**
 * Reads the model that {@code identify --json} prints: {@code model} (fopdt or sopdt), {@code gain},
 * {@code time_constant} (fopdt) or {@code time_constants} [T1, T2] (sopdt), {@code dead_time}; the fit's
 * other keys are allowed and ignored. JSON is read as YAML (a subset of it), so every error names the
 * file, line and column.
 */
final class ModelFile {

    /** The keys identify writes: its record's fields as JSON names them, so the two cannot drift apart. */
    private static final List<String> KEYS = Arrays.stream(IdentifyCommand.ModelJson.class.getRecordComponents())
            .map(c -> new PropertyNamingStrategies.SnakeCaseStrategy().translate(c.getName())).toList();

    private ModelFile() {
    }

    static ProcessModel read(Path file) {
        YamlDocument doc = YamlDocument.read(file);
        doc.requireKeys("", KEYS);
        ModelKind kind = doc.requiredChoice("/model", OptionWords.MODEL_KINDS);
        double gain = doc.requiredNumber("/gain", NumberRule.FINITE);
        double deadTime = doc.requiredNumber("/dead_time", NumberRule.NON_NEGATIVE);
        try {
            if (kind == ModelKind.FOPDT) {
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
