package org.loopwright.sim.scenario;

import static java.util.Map.entry;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.ControllerForm;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.form.PidGains;
import org.loopwright.pid.form.SeriesGains;
import org.loopwright.pid.multiloop.ActuatorRange;
import org.loopwright.pid.multiloop.Cascade;
import org.loopwright.pid.multiloop.GainSchedule;
import org.loopwright.pid.multiloop.ScheduleVariable;
import org.loopwright.pid.multiloop.SchedulePoint;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.config.FileMapping;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.config.NumberRule;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.nonideal.ActuatorModel;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.PlantType;

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
 * inner: {controller: ..., plant: ...}     # a cascade: the controller above is the outer one
 *                                          # (windup: actuator-tracking, period a whole multiple)
 * controller: {..., schedule: {variable: measurement, points: [{at: 20, gain: 2.0, integral-time: 30}]}}
 * split-range: {split-at: 50, gap: 0, first: {min: 0, max: 100}, second: {min: 0, max: 100}}
 * units: {process: "°C", output: "W"}   # shown on axes, table and CSV headers
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

    /** The words of {@code on-off.action}. */
    public static final Keywords<Action> ACTIONS = ControllerFile.ACTIONS;

    /** {@code controller}: a controller file's path or its keys inline. */
    public static final FileKey<String> CONTROLLER = FileKey.section("controller", "controller",
            "a controller mapping or a controller file's path").optional();
    /** {@code on-off}: an on-off controller instead of a PID one. */
    public static final FileKey<String> ON_OFF = FileKey.section("on-off", "onOffController",
            "an on-off controller mapping").optional();
    /** {@code plant}: the plant mapping, read by {@link PlantType}. */
    public static final FileKey<String> PLANT = FileKey.section("plant", "plant",
            "a plant mapping with a type: " + PlantType.WORDS.describe());
    /** {@code setpoint}: a list of setpoint changes. */
    public static final FileKey<String> SETPOINT = FileKey.section("setpoint", "setpoint", "a list").optional();
    /** {@code disturbances}: a list of load steps. */
    public static final FileKey<String> DISTURBANCES = FileKey.section("disturbances", "disturbances", "a list")
            .optional();
    /** {@code actuator}: the actuator mapping. */
    public static final FileKey<String> ACTUATOR = FileKey.section("actuator", "actuator", "a mapping").optional();
    /** {@code sensor}: the sensor mapping. */
    public static final FileKey<String> SENSOR = FileKey.section("sensor", "sensor", "a mapping").optional();
    /** {@code duration}: seconds simulated. */
    public static final FileKey<Double> DURATION = FileKey.number("duration", "durationSeconds", NumberRule.POSITIVE);
    /** {@code seed}: of every random stream. */
    public static final FileKey<Long> SEED = FileKey.whole("seed", "seed", Long.MIN_VALUE, Long.MAX_VALUE)
            .orElse(1L);
    /** {@code inner}: the inner loop of a cascade, {controller, plant}. */
    public static final FileKey<String> INNER = FileKey.section("inner", "inner",
            "an inner-loop mapping {controller, plant}").optional();
    /** {@code split-range}: the driving controller's output over two actuators. */
    public static final FileKey<String> SPLIT_RANGE = FileKey.section("split-range", "splitRange",
            "a split-range mapping {split-at, gap, first, second}").optional();

    /** {@code units}: the engineering units for axes, tables and CSV headers. */
    public static final FileKey<String> UNITS = FileKey.section("units", "units", "a mapping").optional();

    /** Every top-level key, in the order messages list them. */
    public static final List<FileKey<?>> KEYS = List.of(CONTROLLER, ON_OFF, PLANT, INNER, SETPOINT, DISTURBANCES,
            ACTUATOR, SPLIT_RANGE, SENSOR, DURATION, SEED, UNITS);

    private static final FileKey<String> PROCESS_UNIT = FileKey.text("process", "process").orElse("");
    private static final FileKey<String> OUTPUT_UNIT = FileKey.text("output", "output").orElse("");

    /** The words of {@code schedule.variable}; external is the load in effect, as a measured disturbance. */
    public static final Keywords<ScheduleVariable> SCHEDULE_VARIABLES = Keywords.of(
            entry("measurement", ScheduleVariable.MEASUREMENT), entry("setpoint", ScheduleVariable.SETPOINT),
            entry("external", ScheduleVariable.EXTERNAL));
    /** {@code schedule}, inside a single loop's controller mapping: gains against a scheduling variable. */
    public static final FileKey<String> SCHEDULE = FileKey.section("schedule", "schedule",
            "a schedule mapping {variable, points}").optional();

    private static final FileKey<String> INNER_CONTROLLER = FileKey.section("controller", "innerController",
            "a controller mapping or a controller file's path");
    private static final FileKey<String> INNER_PLANT = FileKey.section("plant", "innerPlant",
            "a plant mapping with a type: " + PlantType.WORDS.describe());

    private static final FileKey<ScheduleVariable> SCHEDULE_VARIABLE = FileKey.choice("variable", "variable",
            SCHEDULE_VARIABLES);
    private static final FileKey<String> SCHEDULE_POINTS = FileKey.section("points", "points",
            "a list of points {at, and the gains of the controller's form}");
    private static final FileKey<Double> POINT_AT = FileKey.number("at", "at", NumberRule.FINITE);
    private static final Pattern POINT_INDEX = Pattern.compile("^points\\[(\\d+)]");

    private static final FileKey<Double> SPLIT_AT = FileKey.number("split-at", "splitAt", NumberRule.FINITE);
    private static final FileKey<Double> GAP = FileKey.number("gap", "gap", NumberRule.NON_NEGATIVE).orElse(0.0);
    private static final FileKey<String> FIRST = FileKey.section("first", "first", "a mapping {min, max}");
    private static final FileKey<String> SECOND = FileKey.section("second", "second", "a mapping {min, max}");
    private static final FileKey<Double> RANGE_MIN = FileKey.number("min", "min", NumberRule.FINITE);
    private static final FileKey<Double> RANGE_MAX = FileKey.number("max", "max", NumberRule.FINITE);

    private static final FileKey<Double> AT = FileKey.number("at", "atSeconds", NumberRule.NON_NEGATIVE);
    private static final FileKey<Double> VALUE = FileKey.number("value", "value", NumberRule.FINITE);
    private static final FileKey<Double> RAMP = FileKey.number("ramp-seconds", "rampSeconds", NumberRule.NON_NEGATIVE)
            .orElse(0.0);

    private static final FileKey<Double> OFF_OUTPUT = FileKey.number("off-output", "offOutput", NumberRule.FINITE);
    private static final FileKey<Double> ON_OUTPUT = FileKey.number("on-output", "onOutput", NumberRule.FINITE);
    private static final FileKey<Double> HYSTERESIS = FileKey.number("hysteresis", "hysteresis",
            NumberRule.NON_NEGATIVE);
    private static final FileKey<Double> MINIMUM_ON = FileKey.number("minimum-on", "minimumOnSeconds",
            NumberRule.NON_NEGATIVE).orElse(0.0);
    private static final FileKey<Double> MINIMUM_OFF = FileKey.number("minimum-off", "minimumOffSeconds",
            NumberRule.NON_NEGATIVE).orElse(0.0);
    private static final FileKey<Action> ON_OFF_ACTION = FileKey.choice("action", "action", ACTIONS)
            .orElse(Action.REVERSE);
    private static final FileKey<Double> ON_OFF_PERIOD = FileKey.number("sample-period", "samplePeriodSeconds",
            NumberRule.POSITIVE);
    private static final List<FileKey<?>> ON_OFF_KEYS = List.of(OFF_OUTPUT, ON_OUTPUT, HYSTERESIS, MINIMUM_ON,
            MINIMUM_OFF, ON_OFF_ACTION, ON_OFF_PERIOD);

    private static final FileKey<Double> MIN = FileKey.number("min", "min", NumberRule.ANY)
            .orElse(Double.NEGATIVE_INFINITY);
    private static final FileKey<Double> MAX = FileKey.number("max", "max", NumberRule.ANY)
            .orElse(Double.POSITIVE_INFINITY);
    private static final FileKey<Double> SLEW = FileKey.number("slew-per-second", "slewPerSecond", NumberRule.ANY)
            .orElse(Double.POSITIVE_INFINITY);
    private static final FileKey<Double> DEAD_ZONE = FileKey.number("dead-zone", "deadZone", NumberRule.NON_NEGATIVE)
            .orElse(0.0);

    private static final FileKey<Double> NOISE = FileKey.number("noise-std-dev", "noiseStdDev",
            NumberRule.NON_NEGATIVE).orElse(0.0);
    private static final FileKey<Double> QUANTISATION = FileKey.number("quantisation-step", "quantisationStep",
            NumberRule.NON_NEGATIVE).orElse(0.0);
    private static final FileKey<Long> DELAY = FileKey.whole("delay-samples", "delaySamples", 0, Integer.MAX_VALUE)
            .orElse(0L);
    private static final FileKey<Double> JITTER = FileKey.number("jitter", "jitterSeconds", NumberRule.NON_NEGATIVE)
            .orElse(0.0);
    private static final FileKey<Double> DROPOUT = FileKey.number("dropout-probability", "dropoutProbability",
            NumberRule.FRACTION).orElse(0.0);

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
        FileMapping top = new FileMapping(doc, "", List.of(PLANT), "");
        return PlantType.read(doc, top.get(PLANT));
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

    /**
     * The files a scenario reads: itself and, when it names one by path, its controller file.
     *
     * @param file the scenario file
     * @return the files, the scenario first
     * @throws InputFileException when the scenario cannot be read
     */
    public static List<Path> inputFiles(Path file) {
        YamlDocument doc = YamlDocument.read(file);
        List<Path> files = new ArrayList<>(List.of(file));
        String pointer = CONTROLLER.pointer("");
        if (doc.node(pointer).isTextual()) {
            files.add(file.toAbsolutePath().getParent().resolve(doc.node(pointer).asText()));
        }
        return files;
    }

    /**
     * The scenario's controller in full, every key with its value, defaults included: a PID
     * controller's file keys, or the {@code on-off} keys.
     *
     * @param scenario the scenario
     * @return key to value text, in file order
     */
    public static Map<String, String> resolvedController(Scenario scenario) {
        if (scenario.controller().isPresent()) {
            return ControllerFile.resolved(scenario.controller().get());
        }
        OnOffSettings o = scenario.onOffController().orElseThrow();
        Map<String, String> all = new LinkedHashMap<>();
        all.put(OFF_OUTPUT.word(), OFF_OUTPUT.text(o.offOutput()));
        all.put(ON_OUTPUT.word(), ON_OUTPUT.text(o.onOutput()));
        all.put(HYSTERESIS.word(), HYSTERESIS.text(o.hysteresis()));
        all.put(MINIMUM_ON.word(), MINIMUM_ON.text(o.minimumOnSeconds()));
        all.put(MINIMUM_OFF.word(), MINIMUM_OFF.text(o.minimumOffSeconds()));
        all.put(ON_OFF_ACTION.word(), ON_OFF_ACTION.text(o.action()));
        all.put(ON_OFF_PERIOD.word(), ON_OFF_PERIOD.text(scenario.samplePeriodSeconds()));
        return all;
    }

    private static final class Reader {
        private final YamlDocument doc;
        private final Path directory;
        private ControllerSettings outerSettings;

        Reader(YamlDocument doc, Path directory) {
            this.doc = doc;
            this.directory = directory;
        }

        Scenario scenario() {
            FileMapping top = new FileMapping(doc, "", KEYS, "");
            Scenario.Builder b = Scenario.builder();
            List<FileMapping> parts = new ArrayList<>(List.of(top));
            controller(top, b, parts);
            FileMapping plant = PlantType.mapping(doc, top.get(PLANT));
            parts.add(plant);
            b.plant(PlantType.read(plant));
            top.find(INNER).ifPresent(p -> inner(top, p, b));
            top.find(SPLIT_RANGE).ifPresent(p -> {
                FileMapping split = new FileMapping(doc, p, List.of(SPLIT_AT, GAP, FIRST, SECOND), "");
                parts.add(split);
                b.splitRange(new SplitRangeSpec(split.get(SPLIT_AT), split.get(GAP), range(split.get(FIRST)),
                        range(split.get(SECOND))));
            });
            top.find(SETPOINT).ifPresent(list -> {
                for (String item : doc.items(list)) {
                    FileMapping change = new FileMapping(doc, item, List.of(AT, VALUE, RAMP), "");
                    b.setpoint(change.build(() -> new SetpointChange(change.get(AT), change.get(VALUE),
                            change.get(RAMP))));
                }
            });
            top.find(DISTURBANCES).ifPresent(list -> {
                for (String item : doc.items(list)) {
                    FileMapping load = new FileMapping(doc, item, List.of(AT, VALUE), "");
                    b.disturbance(load.build(() -> new LoadStep(load.get(AT), load.get(VALUE))));
                }
            });
            top.find(ACTUATOR).ifPresent(p -> {
                FileMapping actuator = new FileMapping(doc, p, List.of(MIN, MAX, SLEW, DEAD_ZONE), "");
                b.actuator(actuator.build(() -> new ActuatorModel(actuator.get(MIN), actuator.get(MAX),
                        actuator.get(SLEW), actuator.get(DEAD_ZONE))));
            });
            top.find(SENSOR).ifPresent(p -> {
                FileMapping sensor = new FileMapping(doc, p, List.of(NOISE, QUANTISATION, DELAY, JITTER, DROPOUT), "");
                parts.add(sensor);
                b.sensor(sensor.build(() -> new SensorModel(sensor.get(NOISE), sensor.get(QUANTISATION),
                        sensor.get(DELAY).intValue(), sensor.get(JITTER), sensor.get(DROPOUT))));
            });
            b.durationSeconds(top.get(DURATION));
            b.seed(top.get(SEED));
            top.find(UNITS).ifPresent(p -> {
                FileMapping units = new FileMapping(doc, p, List.of(PROCESS_UNIT, OUTPUT_UNIT), "");
                b.units(new Units(units.get(PROCESS_UNIT), units.get(OUTPUT_UNIT)));
            });
            try {
                return b.build();
            } catch (InvalidSettingException e) {
                // checks across parts (duration, jitter and the integration step against the sample period):
                // at the key of the part
                FileMapping part = parts.stream().filter(m -> m.declares(e.field())).findFirst().orElse(top);
                throw part.located(e);
            }
        }

        private void controller(FileMapping top, Scenario.Builder b, List<FileMapping> parts) {
            boolean pid = top.has(CONTROLLER);
            boolean onOff = top.has(ON_OFF);
            if (pid && onOff) {
                throw top.error(ON_OFF, "controller and on-off exclude each other; give one controller");
            }
            if (!pid && !onOff) {
                throw doc.error("", "missing key 'controller' (" + CONTROLLER.allowed() + ") or 'on-off' ("
                        + ON_OFF.allowed() + ")");
            }
            if (onOff) {
                FileMapping settings = new FileMapping(doc, top.get(ON_OFF), ON_OFF_KEYS, "");
                parts.add(settings);
                b.onOffController(settings.build(() -> new OnOffSettings(settings.get(OFF_OUTPUT),
                        settings.get(ON_OUTPUT), settings.get(HYSTERESIS), settings.get(MINIMUM_ON),
                        settings.get(MINIMUM_OFF), settings.get(ON_OFF_ACTION))), settings.get(ON_OFF_PERIOD));
                return;
            }
            String pointer = top.get(CONTROLLER);
            YamlDocument source = controllerDocument(pointer);
            String at = source == doc ? pointer : "";
            outerSettings = ControllerFile.read(source, at, List.of(SCHEDULE));
            b.controller(outerSettings);
            Optional<String> table = SCHEDULE.find(source, at);
            if (table.isPresent()) {
                b.schedule(schedule(source, at, table.get()));
            }
        }

        /** The document that holds the controller mapping at a pointer: this one, or the file it names. */
        private YamlDocument controllerDocument(String pointer) {
            if (!doc.node(pointer).isTextual()) {
                return doc;
            }
            String written = doc.requiredText(pointer);
            Path file = directory.resolve(written);
            if (!Files.isRegularFile(file)) {
                throw doc.error(pointer, "controller file not found: " + doc.keyName(pointer) + "=" + written
                        + " (looked for " + file + ")");
            }
            return YamlDocument.read(file);
        }

        /** The gain schedule at a pointer, its points in the form of the controller mapping it sits in. */
        private GainSchedule schedule(YamlDocument source, String controller, String pointer) {
            FileMapping table = new FileMapping(source, pointer, List.of(SCHEDULE_VARIABLE, SCHEDULE_POINTS), "");
            ControllerForm form = ControllerFile.FORM.read(source, controller);
            List<FileKey<?>> gainKeys = form == ControllerForm.PARALLEL
                    ? List.of(ControllerFile.PROPORTIONAL_GAIN, ControllerFile.INTEGRAL_GAIN, ControllerFile.DERIVATIVE_GAIN)
                    : List.of(ControllerFile.GAIN, ControllerFile.INTEGRAL_TIME, ControllerFile.DERIVATIVE_TIME);
            List<FileKey<?>> pointKeys = new ArrayList<>(List.of(POINT_AT));
            pointKeys.addAll(gainKeys);
            List<SchedulePoint> points = new ArrayList<>();
            List<String> items = source.items(table.get(SCHEDULE_POINTS));
            for (String item : items) {
                FileMapping point = new FileMapping(source, item, pointKeys, "");
                points.add(point.build(() -> new SchedulePoint(point.get(POINT_AT), gains(point, form))));
            }
            ScheduleVariable variable = table.get(SCHEDULE_VARIABLE);
            try {
                return new GainSchedule(variable, points);
            } catch (InvalidSettingException e) {
                // the table's complaint names points[i]: at that point, in the file's own names
                Matcher index = POINT_INDEX.matcher(e.field());
                String where = index.find() ? POINT_AT.pointer(items.get(Integer.parseInt(index.group(1))))
                        : table.get(SCHEDULE_POINTS);
                throw source.error(where, e.getMessage().replace("points", table.name(SCHEDULE_POINTS)));
            }
        }

        private static PidGains gains(FileMapping point, ControllerForm form) {
            return switch (form) {
                case PARALLEL -> new ParallelGains(point.get(ControllerFile.PROPORTIONAL_GAIN),
                        point.get(ControllerFile.INTEGRAL_GAIN), point.get(ControllerFile.DERIVATIVE_GAIN));
                case IDEAL -> new IdealGains(point.get(ControllerFile.GAIN), point.get(ControllerFile.INTEGRAL_TIME),
                        point.get(ControllerFile.DERIVATIVE_TIME));
                case SERIES -> new SeriesGains(point.get(ControllerFile.GAIN), point.get(ControllerFile.INTEGRAL_TIME),
                        point.get(ControllerFile.DERIVATIVE_TIME));
            };
        }

        private void inner(FileMapping top, String pointer, Scenario.Builder b) {
            if (top.has(ON_OFF)) {
                throw top.error(INNER, "inner needs a PID outer controller (the controller key), not on-off");
            }
            FileMapping inner = new FileMapping(doc, pointer, List.of(INNER_CONTROLLER, INNER_PLANT), "");
            String controllerPointer = inner.get(INNER_CONTROLLER);
            YamlDocument source = controllerDocument(controllerPointer);
            ControllerSettings innerSettings = ControllerFile.read(source, source == doc ? controllerPointer : "");
            ControllerSettings outer = outerSettings;
            try {
                Cascade.requireCompatible(outer, innerSettings);
            } catch (InvalidSettingException e) {
                String detail = e.field().equals("outerWindupProtection")
                        ? "controller.windup must be actuator-tracking for the outer controller of a cascade, so"
                                + " that it tracks what the inner loop achieves: controller.windup="
                                + ControllerFile.WINDUP.word(outer.windupProtection())
                        : "controller.sample-period must be a whole multiple (1, 2, 3, ...) of"
                                + " inner.controller.sample-period (inner.controller.sample-period="
                                + innerSettings.samplePeriodSeconds() + "): controller.sample-period="
                                + outer.samplePeriodSeconds();
                throw top.error(CONTROLLER, detail);
            }
            b.inner(new InnerLoop(innerSettings, PlantType.read(doc, inner.get(INNER_PLANT))));
        }

        private ActuatorRange range(String pointer) {
            FileMapping range = new FileMapping(doc, pointer, List.of(RANGE_MIN, RANGE_MAX), "");
            double min = range.get(RANGE_MIN);
            double max = range.get(RANGE_MAX);
            if (!(max > min)) {
                throw range.error(RANGE_MAX, range.name(RANGE_MAX) + " must be > " + range.name(RANGE_MIN) + " ("
                        + range.name(RANGE_MIN) + "=" + min + "): " + range.name(RANGE_MAX) + "=" + max);
            }
            return new ActuatorRange(min, max);
        }
    }
}
