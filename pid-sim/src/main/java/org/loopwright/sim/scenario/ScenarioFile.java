package org.loopwright.sim.scenario;

import static java.util.Map.entry;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.List;
import java.util.function.Supplier;

import com.fasterxml.jackson.databind.JsonNode;

import org.loopwright.pid.Action;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.config.NumberRule;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.nonideal.ActuatorModel;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.MotorOutput;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.TankModel;
import org.loopwright.sim.plant.ThermalZoneModel;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The scenario file: a YAML mapping read into a {@link Scenario}, with every error located at a
 * line and column and naming the key, the value and what is allowed.
 *
 * <pre>
 * controller: bath-controller.yaml   # a controller file, relative to this file; or the controller
 *                                    # file's keys inline: {form: ideal, gain: 70, ...}
 * on-off:                            # instead of controller: an on-off controller
 *   {off-output: 0, on-output: 2000, hysteresis: 0.5, minimum-on: 20, minimum-off: 20,
 *    action: reverse, sample-period: 1.0}     # minimum-on/-off default 0, action reverse
 * plant: {type: first-order, gain: 2.0, time-constant: 30.0}
 * plant: {type: fopdt, gain: 2.0, time-constant: 30.0, dead-time: 5.0}
 * plant: {type: sopdt, gain: 1.0, time-constants: [10.0, 3.0], dead-time: 1.0}
 * plant: {type: sopdt, gain: 1.0, natural-frequency: 0.5, damping: 0.3, dead-time: 1.0}
 * plant: {type: integrating, gain: 0.1, dead-time: 2.0}
 * plant: {type: transfer-function, numerator: [1.0], denominator: [1.0, 3.0, 3.0, 1.0], dead-time: 0.0}
 * plant: {type: dc-motor, resistance: 2.0, inductance: 0.01, torque-constant: 0.1, back-emf-constant: 0.1,
 *         inertia: 0.01, viscous-friction: 0.01, load-torque: 0, coulomb-friction: 0.04,
 *         static-friction: 0.05, output: position, integration-step: 0.001}
 * plant: {type: thermal-zone, heat-capacity: 41800, loss-coefficient: 8, ambient: 20, max-power: 2000,
 *         integration-step: 1.0}
 * plant: {type: tank, area: 0.5, outlet-coefficient: 0.01, initial-level: 0.2, integration-step: 0.1}
 * setpoint: [{at: 0, value: 50}, {at: 300, value: 60, ramp-seconds: 60}]
 * disturbances: [{at: 200, value: -5}]      # the load added to the plant input from that time on
 * actuator: {min: 0, max: 100, slew-per-second: 20, dead-zone: 0.5}
 * sensor: {noise-std-dev: 0.05, quantisation-step: 0.01, delay-samples: 2, jitter: 0.01,
 *          dropout-probability: 0.001}
 * duration: 400
 * seed: 7
 * </pre>
 * Required: one of {@code controller} or {@code on-off}, {@code plant} and {@code duration}.
 * Defaults: dead-time 0; dc-motor viscous-friction, load-torque and coulomb-friction 0,
 * static-friction equal to coulomb-friction, output position, integration-step a tenth of L/R;
 * thermal-zone ambient 20, max-power unlimited, integration-step 1 s; tank initial-level 0,
 * integration-step 0.1 s; actuator and sensor ideal (each key optional); no setpoint entries (the
 * setpoint stays at the plant's rest value); no disturbances; seed 1. Times are in seconds.
 *
 * <p>Thread-safe: stateless.
 */
public final class ScenarioFile {

    /** The words of {@code plant.type}. */
    public static final Keywords<String> PLANT_TYPES = Keywords.of(entry("first-order", "first-order"),
            entry("fopdt", "fopdt"), entry("sopdt", "sopdt"), entry("integrating", "integrating"),
            entry("transfer-function", "transfer-function"), entry("dc-motor", "dc-motor"),
            entry("thermal-zone", "thermal-zone"), entry("tank", "tank"));
    /** The words of {@code plant.output} for a dc-motor. */
    public static final Keywords<MotorOutput> MOTOR_OUTPUTS = Keywords.of(entry("speed", MotorOutput.SPEED),
            entry("position", MotorOutput.POSITION));
    /** The words of {@code on-off.action}. */
    public static final Keywords<Action> ACTIONS = ControllerFile.ACTIONS;

    /** Every top-level key, in the order messages list them. */
    public static final List<String> KEYS = List.of("controller", "on-off", "plant", "setpoint", "disturbances",
            "actuator", "sensor", "duration", "seed");

    private static final List<String> ON_OFF_KEYS = List.of("off-output", "on-output", "hysteresis", "minimum-on",
            "minimum-off", "action", "sample-period");
    private static final List<String> ACTUATOR_KEYS = List.of("min", "max", "slew-per-second", "dead-zone");
    private static final List<String> SENSOR_KEYS = List.of("noise-std-dev", "quantisation-step", "delay-samples",
            "jitter", "dropout-probability");

    private static final String WATER_BATH = "water-bath.yaml";

    private ScenarioFile() {
    }

    /**
     * Reads a scenario file; a controller given by path is read relative to the file's directory.
     *
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static Scenario read(Path file) {
        Path directory = file.toAbsolutePath().getParent();
        return read(YamlDocument.read(file), directory);
    }

    /**
     * Reads a scenario from a parsed document.
     *
     * @param doc       the document
     * @param directory where a controller file given by path is looked for
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static Scenario read(YamlDocument doc, Path directory) {
        return new Reader(doc, directory).scenario();
    }

    /**
     * Reads a plant file: a YAML mapping with the one key {@code plant}, holding a plant mapping of
     * the scenario format (as {@code identify --write-plant} writes it).
     *
     * @throws InputFileException naming the file, line, column, key, value and what is allowed
     */
    public static PlantModel readPlant(Path file) {
        YamlDocument doc = YamlDocument.read(file);
        doc.requireKeys("", List.of("plant"));
        return new Reader(doc, file.toAbsolutePath().getParent()).plant("/plant");
    }

    /**
     * The built-in demo: a water bath of our own invention (a 2 kW heater, about 10 L of water, PI
     * control to 60 °C, a lid opened after an hour). Invented numbers, for demonstration only.
     */
    public static Scenario waterBathDemo() {
        return read(YamlDocument.parse("water-bath.yaml (built-in demo)", waterBathDemoText()), Path.of(""));
    }

    /** The text of the built-in demo scenario, as an example of the format. */
    public static String waterBathDemoText() {
        try (InputStream in = ScenarioFile.class.getResourceAsStream(WATER_BATH)) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static final class Reader {
        private final YamlDocument doc;
        private final Path directory;

        Reader(YamlDocument doc, Path directory) {
            this.doc = doc;
            this.directory = directory;
        }

        Scenario scenario() {
            doc.requireKeys("", KEYS);
            Scenario.Builder b = Scenario.builder();
            controller(b);
            b.plant(plant("/plant"));
            if (doc.has("/setpoint")) {
                for (String item : doc.items("/setpoint")) {
                    doc.requireKeys(item, List.of("at", "value", "ramp-seconds"));
                    b.setpoint(new SetpointChange(doc.requiredNumber(item + "/at", NumberRule.NON_NEGATIVE),
                            doc.requiredNumber(item + "/value", NumberRule.FINITE),
                            doc.optionalNumber(item + "/ramp-seconds", NumberRule.NON_NEGATIVE, 0.0)));
                }
            }
            if (doc.has("/disturbances")) {
                for (String item : doc.items("/disturbances")) {
                    doc.requireKeys(item, List.of("at", "value"));
                    b.disturbance(new LoadStep(doc.requiredNumber(item + "/at", NumberRule.NON_NEGATIVE),
                            doc.requiredNumber(item + "/value", NumberRule.FINITE)));
                }
            }
            if (doc.has("/actuator")) {
                b.actuator(actuator("/actuator"));
            }
            if (doc.has("/sensor")) {
                b.sensor(sensor("/sensor"));
            }
            b.durationSeconds(doc.requiredNumber("/duration", NumberRule.POSITIVE));
            if (doc.has("/seed")) {
                b.seed(whole("/seed", false));
            }
            try {
                return b.build();
            } catch (IllegalArgumentException e) {
                // checks across parts: duration against the sample period, jitter against it
                String key = e.getMessage().substring(0, e.getMessage().indexOf(' '));
                String at = doc.has("/sensor/" + key) ? "/sensor/" + key : doc.has("/" + key) ? "/" + key : "";
                throw doc.error(at, e.getMessage());
            }
        }

        private void controller(Scenario.Builder b) {
            boolean pid = doc.has("/controller");
            boolean onOff = doc.has("/on-off");
            if (pid && onOff) {
                throw doc.error("/on-off", "controller and on-off exclude each other; give one controller");
            }
            if (!pid && !onOff) {
                throw doc.error("", "missing key 'controller' (a controller mapping or a controller file's path)"
                        + " or 'on-off' (an on-off controller mapping)");
            }
            if (onOff) {
                onOff(b);
                return;
            }
            if (doc.node("/controller").isTextual()) {
                String written = doc.requiredText("/controller");
                Path file = directory.resolve(written);
                if (!Files.isRegularFile(file)) {
                    throw doc.error("/controller", "controller file not found: controller=" + written
                            + " (looked for " + file + ")");
                }
                b.controller(ControllerFile.read(file));
            } else {
                b.controller(ControllerFile.read(doc, "/controller"));
            }
        }

        private void onOff(Scenario.Builder b) {
            String p = "/on-off";
            doc.requireKeys(p, ON_OFF_KEYS);
            OnOffSettings settings = located(p, () -> new OnOffSettings(
                    doc.requiredNumber(p + "/off-output", NumberRule.FINITE),
                    doc.requiredNumber(p + "/on-output", NumberRule.FINITE),
                    doc.requiredNumber(p + "/hysteresis", NumberRule.NON_NEGATIVE),
                    doc.optionalNumber(p + "/minimum-on", NumberRule.NON_NEGATIVE, 0.0),
                    doc.optionalNumber(p + "/minimum-off", NumberRule.NON_NEGATIVE, 0.0),
                    doc.optionalChoice(p + "/action", ACTIONS, Action.REVERSE)));
            b.onOffController(settings, doc.requiredNumber(p + "/sample-period", NumberRule.POSITIVE));
        }

        private PlantModel plant(String p) {
            if (!doc.has(p)) {
                throw doc.missing(p, "a plant mapping with a type: " + PLANT_TYPES.describe());
            }
            doc.requireKeys(p, List.of("type", "gain", "time-constant", "time-constants", "natural-frequency",
                    "damping", "dead-time", "numerator", "denominator", "resistance", "inductance", "torque-constant",
                    "back-emf-constant", "inertia", "viscous-friction", "load-torque", "coulomb-friction",
                    "static-friction", "output", "integration-step", "heat-capacity", "loss-coefficient", "ambient",
                    "max-power", "area", "outlet-coefficient", "initial-level"));
            String type = doc.requiredChoice(p + "/type", PLANT_TYPES);
            return switch (type) {
                case "first-order" -> {
                    allow(p, type, "type", "gain", "time-constant");
                    yield located(p, () -> TransferFunction.firstOrder(number(p, "gain", NumberRule.FINITE),
                            number(p, "time-constant", NumberRule.POSITIVE)));
                }
                case "fopdt" -> {
                    allow(p, type, "type", "gain", "time-constant", "dead-time");
                    yield located(p, () -> TransferFunction.fopdt(number(p, "gain", NumberRule.FINITE),
                            number(p, "time-constant", NumberRule.POSITIVE), deadTime(p)));
                }
                case "sopdt" -> sopdt(p);
                case "integrating" -> {
                    allow(p, type, "type", "gain", "dead-time");
                    yield located(p, () -> TransferFunction.integrating(number(p, "gain", NumberRule.FINITE),
                            deadTime(p)));
                }
                case "transfer-function" -> {
                    allow(p, type, "type", "numerator", "denominator", "dead-time");
                    yield located(p, () -> new TransferFunction(doc.numberList(p + "/numerator", NumberRule.FINITE),
                            doc.numberList(p + "/denominator", NumberRule.FINITE), deadTime(p)));
                }
                case "dc-motor" -> motor(p);
                case "thermal-zone" -> {
                    allow(p, type, "type", "heat-capacity", "loss-coefficient", "ambient", "max-power",
                            "integration-step");
                    yield located(p, () -> new ThermalZoneModel(number(p, "heat-capacity", NumberRule.POSITIVE),
                            number(p, "loss-coefficient", NumberRule.NON_NEGATIVE),
                            doc.optionalNumber(p + "/ambient", NumberRule.FINITE, 20.0),
                            doc.optionalNumber(p + "/max-power", NumberRule.ANY, Double.POSITIVE_INFINITY),
                            doc.optionalNumber(p + "/integration-step", NumberRule.POSITIVE, 1.0)));
                }
                default -> {
                    allow(p, type, "type", "area", "outlet-coefficient", "initial-level", "integration-step");
                    yield located(p, () -> new TankModel(number(p, "area", NumberRule.POSITIVE),
                            number(p, "outlet-coefficient", NumberRule.POSITIVE),
                            doc.optionalNumber(p + "/initial-level", NumberRule.NON_NEGATIVE, 0.0),
                            doc.optionalNumber(p + "/integration-step", NumberRule.POSITIVE, 0.1)));
                }
            };
        }

        private PlantModel sopdt(String p) {
            allow(p, "sopdt", "type", "gain", "time-constants", "natural-frequency", "damping", "dead-time");
            double gain = number(p, "gain", NumberRule.FINITE);
            if (doc.has(p + "/time-constants")) {
                for (String other : List.of("natural-frequency", "damping")) {
                    if (doc.has(p + "/" + other)) {
                        throw doc.error(p + "/" + other, other + " excludes time-constants; give time-constants"
                                + " [T1, T2] or natural-frequency and damping");
                    }
                }
                double[] t = doc.numberList(p + "/time-constants", NumberRule.POSITIVE);
                if (t.length != 2) {
                    throw doc.error(p + "/time-constants", doc.keyName(p + "/time-constants")
                            + " must list two time constants [T1, T2]: " + doc.keyName(p + "/time-constants")
                            + " has " + t.length);
                }
                return located(p, () -> TransferFunction.sopdt(gain, t[0], t[1], deadTime(p)));
            }
            if (!doc.has(p + "/natural-frequency") && !doc.has(p + "/damping")) {
                throw doc.missing(p + "/time-constants", "[T1, T2] in seconds, or natural-frequency and damping");
            }
            return located(p, () -> TransferFunction.sopdtOscillatory(gain,
                    number(p, "natural-frequency", NumberRule.POSITIVE), number(p, "damping", NumberRule.POSITIVE),
                    deadTime(p)));
        }

        private PlantModel motor(String p) {
            allow(p, "dc-motor", "type", "resistance", "inductance", "torque-constant", "back-emf-constant", "inertia",
                    "viscous-friction", "load-torque", "coulomb-friction", "static-friction", "output",
                    "integration-step");
            double resistance = number(p, "resistance", NumberRule.POSITIVE);
            double inductance = number(p, "inductance", NumberRule.POSITIVE);
            double coulomb = doc.optionalNumber(p + "/coulomb-friction", NumberRule.NON_NEGATIVE, 0.0);
            return located(p, () -> new DcMotorModel(resistance, inductance,
                    number(p, "torque-constant", NumberRule.POSITIVE),
                    number(p, "back-emf-constant", NumberRule.NON_NEGATIVE),
                    number(p, "inertia", NumberRule.POSITIVE),
                    doc.optionalNumber(p + "/viscous-friction", NumberRule.NON_NEGATIVE, 0.0),
                    doc.optionalNumber(p + "/load-torque", NumberRule.FINITE, 0.0),
                    coulomb,
                    doc.optionalNumber(p + "/static-friction", NumberRule.NON_NEGATIVE, coulomb),
                    doc.optionalChoice(p + "/output", MOTOR_OUTPUTS, MotorOutput.POSITION),
                    doc.optionalNumber(p + "/integration-step", NumberRule.POSITIVE, 0.1 * inductance / resistance)));
        }

        private ActuatorModel actuator(String p) {
            doc.requireKeys(p, ACTUATOR_KEYS);
            return located(p, () -> new ActuatorModel(
                    doc.optionalNumber(p + "/min", NumberRule.ANY, Double.NEGATIVE_INFINITY),
                    doc.optionalNumber(p + "/max", NumberRule.ANY, Double.POSITIVE_INFINITY),
                    doc.optionalNumber(p + "/slew-per-second", NumberRule.ANY, Double.POSITIVE_INFINITY),
                    doc.optionalNumber(p + "/dead-zone", NumberRule.NON_NEGATIVE, 0.0)));
        }

        private SensorModel sensor(String p) {
            doc.requireKeys(p, SENSOR_KEYS);
            return located(p, () -> new SensorModel(
                    doc.optionalNumber(p + "/noise-std-dev", NumberRule.NON_NEGATIVE, 0.0),
                    doc.optionalNumber(p + "/quantisation-step", NumberRule.NON_NEGATIVE, 0.0),
                    doc.has(p + "/delay-samples") ? (int) whole(p + "/delay-samples", true) : 0,
                    doc.optionalNumber(p + "/jitter", NumberRule.NON_NEGATIVE, 0.0),
                    doc.optionalNumber(p + "/dropout-probability", NumberRule.FRACTION, 0.0)));
        }

        private double number(String mapping, String key, NumberRule rule) {
            return doc.requiredNumber(mapping + "/" + key, rule);
        }

        private double deadTime(String p) {
            return doc.optionalNumber(p + "/dead-time", NumberRule.NON_NEGATIVE, 0.0);
        }

        /** A whole number (a seed, a count of samples). */
        private long whole(String pointer, boolean nonNegative) {
            JsonNode node = doc.node(pointer);
            String key = doc.keyName(pointer);
            boolean ok = node.isIntegralNumber() && node.canConvertToLong() && (!nonNegative || node.longValue() >= 0)
                    && (!nonNegative || node.longValue() <= Integer.MAX_VALUE);
            if (!ok) {
                throw doc.error(pointer, key + " must be a whole number" + (nonNegative ? " >= 0" : "") + ": " + key
                        + "=" + doc.sourceText(pointer));
            }
            return node.longValue();
        }

        /** Keys of other plant types are errors, so no key is silently ignored. */
        private void allow(String p, String type, String... keys) {
            List<String> allowed = List.of(keys);
            Iterator<String> names = doc.node(p).fieldNames();
            while (names.hasNext()) {
                String key = names.next();
                if (!allowed.contains(key)) {
                    throw doc.error(p + "/" + key, "unknown key '" + key + "' for plant type " + type + "; allowed: "
                            + String.join(", ", allowed));
                }
            }
        }

        /**
         * Runs a constructor whose checks name file keys ("static-friction must be ...: static-friction=...")
         * and locates its complaint at that key when the mapping has it, else at the mapping.
         */
        private <T> T located(String mapping, Supplier<T> make) {
            try {
                return make.get();
            } catch (InputFileException e) {
                throw e;
            } catch (IllegalArgumentException e) {
                String message = e.getMessage();
                String key = message.contains(" ") ? message.substring(0, message.indexOf(' ')) : "";
                String at = doc.has(mapping + "/" + key) ? mapping + "/" + key : mapping;
                throw doc.error(at, message);
            }
        }
    }
}
