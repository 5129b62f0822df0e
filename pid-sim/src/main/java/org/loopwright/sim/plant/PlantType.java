package org.loopwright.sim.plant;

import static org.loopwright.sim.plant.PlantKeys.AMBIENT;
import static org.loopwright.sim.plant.PlantKeys.AREA;
import static org.loopwright.sim.plant.PlantKeys.BACK_EMF_CONSTANT;
import static org.loopwright.sim.plant.PlantKeys.COULOMB_FRICTION;
import static org.loopwright.sim.plant.PlantKeys.DAMPING;
import static org.loopwright.sim.plant.PlantKeys.DEAD_TIME;
import static org.loopwright.sim.plant.PlantKeys.DENOMINATOR;
import static org.loopwright.sim.plant.PlantKeys.GAIN;
import static org.loopwright.sim.plant.PlantKeys.HEAT_CAPACITY;
import static org.loopwright.sim.plant.PlantKeys.INDUCTANCE;
import static org.loopwright.sim.plant.PlantKeys.INERTIA;
import static org.loopwright.sim.plant.PlantKeys.INITIAL_LEVEL;
import static org.loopwright.sim.plant.PlantKeys.LINEAR_SPREAD;
import static org.loopwright.sim.plant.PlantKeys.LOAD_TORQUE;
import static org.loopwright.sim.plant.PlantKeys.LOSS_COEFFICIENT;
import static org.loopwright.sim.plant.PlantKeys.MAX_POWER;
import static org.loopwright.sim.plant.PlantKeys.MOTOR_INTEGRATION_STEP;
import static org.loopwright.sim.plant.PlantKeys.MOTOR_OUTPUT;
import static org.loopwright.sim.plant.PlantKeys.NATURAL_FREQUENCY;
import static org.loopwright.sim.plant.PlantKeys.NUMERATOR;
import static org.loopwright.sim.plant.PlantKeys.OUTLET_COEFFICIENT;
import static org.loopwright.sim.plant.PlantKeys.RESISTANCE;
import static org.loopwright.sim.plant.PlantKeys.STATIC_FRICTION;
import static org.loopwright.sim.plant.PlantKeys.TANK_INTEGRATION_STEP;
import static org.loopwright.sim.plant.PlantKeys.THERMAL_INTEGRATION_STEP;
import static org.loopwright.sim.plant.PlantKeys.TIME_CONSTANT;
import static org.loopwright.sim.plant.PlantKeys.TIME_CONSTANTS;
import static org.loopwright.sim.plant.PlantKeys.TORQUE_CONSTANT;
import static org.loopwright.sim.plant.PlantKeys.VISCOUS_FRICTION;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import java.util.stream.Collectors;

import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.config.FileMapping;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.config.YamlDocument;

/**
 * The kinds of plant a scenario file may describe: the word of {@code plant.type}, the keys each
 * takes (with their rules and defaults, declared in one place) and whether the model is linear
 * (analysable in the frequency domain) or not. The one list of plant types: readers, messages and
 * commands that need a linear plant all ask it.
 *
 * <p>Thread-safe: immutable.
 */
public enum PlantType {
    /** K/(Ts+1). */
    FIRST_ORDER("first-order", true, List.of(GAIN, TIME_CONSTANT), LINEAR_SPREAD,
            f -> TransferFunction.firstOrder(f.get(GAIN), f.get(TIME_CONSTANT))),
    /** K·e^(−Ls)/(Ts+1). */
    FOPDT("fopdt", true, List.of(GAIN, TIME_CONSTANT, DEAD_TIME), LINEAR_SPREAD,
            f -> TransferFunction.fopdt(f.get(GAIN), f.get(TIME_CONSTANT), f.get(DEAD_TIME))),
    /** Second order plus dead time, from two time constants or a natural frequency and damping. */
    SOPDT("sopdt", true, List.of(GAIN, TIME_CONSTANTS, NATURAL_FREQUENCY, DAMPING, DEAD_TIME), LINEAR_SPREAD,
            PlantType::sopdt),
    /** K·e^(−Ls)/s. */
    INTEGRATING("integrating", true, List.of(GAIN, DEAD_TIME), LINEAR_SPREAD,
            f -> TransferFunction.integrating(f.get(GAIN), f.get(DEAD_TIME))),
    /** N(s)/D(s)·e^(−Ls). */
    TRANSFER_FUNCTION("transfer-function", true, List.of(NUMERATOR, DENOMINATOR, DEAD_TIME), LINEAR_SPREAD,
            f -> new TransferFunction(f.get(NUMERATOR), f.get(DENOMINATOR), f.get(DEAD_TIME))),
    /** A DC motor with friction ({@link DcMotorModel}). */
    DC_MOTOR("dc-motor", false, List.of(RESISTANCE, INDUCTANCE, TORQUE_CONSTANT, BACK_EMF_CONSTANT, INERTIA,
            VISCOUS_FRICTION, LOAD_TORQUE, COULOMB_FRICTION, STATIC_FRICTION, MOTOR_OUTPUT,
            MOTOR_INTEGRATION_STEP), List.of(RESISTANCE, INDUCTANCE, TORQUE_CONSTANT, BACK_EMF_CONSTANT, INERTIA,
            VISCOUS_FRICTION, LOAD_TORQUE, COULOMB_FRICTION, STATIC_FRICTION), PlantType::motor),
    /** A heated zone ({@link ThermalZoneModel}). */
    THERMAL_ZONE("thermal-zone", false, List.of(HEAT_CAPACITY, LOSS_COEFFICIENT, AMBIENT, MAX_POWER,
            THERMAL_INTEGRATION_STEP), List.of(HEAT_CAPACITY, LOSS_COEFFICIENT, MAX_POWER),
            f -> new ThermalZoneModel(f.get(HEAT_CAPACITY), f.get(LOSS_COEFFICIENT), f.get(AMBIENT),
                    f.get(MAX_POWER), f.get(THERMAL_INTEGRATION_STEP))),
    /** A draining tank ({@link TankModel}). */
    TANK("tank", false, List.of(AREA, OUTLET_COEFFICIENT, INITIAL_LEVEL, TANK_INTEGRATION_STEP),
            List.of(AREA, OUTLET_COEFFICIENT, INITIAL_LEVEL),
            f -> new TankModel(f.get(AREA), f.get(OUTLET_COEFFICIENT), f.get(INITIAL_LEVEL),
                    f.get(TANK_INTEGRATION_STEP)));

    /** The words of {@code plant.type}. */
    public static final Keywords<PlantType> WORDS = Keywords.byWord(values(), PlantType::word);
    /** {@code plant.type}. */
    public static final FileKey<PlantType> TYPE = FileKey.choice("type", "type", WORDS);

    private final String word;
    private final boolean linear;
    private final List<FileKey<?>> keys;
    private final List<FileKey<Double>> spreadKeys;
    private final Function<FileMapping, PlantModel> make;

    PlantType(String word, boolean linear, List<FileKey<?>> keys, List<FileKey<Double>> spreadKeys,
            Function<FileMapping, PlantModel> make) {
        this.word = word;
        this.linear = linear;
        this.keys = keys;
        this.spreadKeys = spreadKeys;
        this.make = make;
    }

    /** @return the word a scenario file uses */
    public String word() {
        return word;
    }

    /** @return whether the model is a transfer function (analysable in the frequency domain) */
    public boolean linear() {
        return linear;
    }

    /** @return the keys this type takes besides {@code type}, in the order messages list them */
    public List<FileKey<?>> keys() {
        return keys;
    }

    /**
     * The keys a sweep may spread ({@code --spread KEY=P%}), in the order a sweep draws their factors.
     * A linear type's keys act on its transfer function as a whole: {@code gain} scales the numerator,
     * {@code time-constant} every time constant, {@code dead-time} the dead time (whatever keys its
     * file used). A nonlinear type's keys are its physical parameters, each scaling the model field
     * it fills; left out are the integration step (a numerical setting, not the plant), the motor's
     * output (a word) and the thermal zone's ambient (a Celsius temperature, whose zero is arbitrary,
     * so a percentage of it means nothing).
     *
     * @return the keys, in draw order
     */
    public List<FileKey<Double>> spreadKeys() {
        return spreadKeys;
    }

    /** @return the linear types' words, for a message: "first-order, fopdt, sopdt, integrating or transfer-function" */
    public static String linearWords() {
        List<String> words = Arrays.stream(values()).filter(PlantType::linear).map(PlantType::word).toList();
        return words.subList(0, words.size() - 1).stream().collect(Collectors.joining(", "))
                + " or " + words.get(words.size() - 1);
    }

    /**
     * Reads the plant mapping at a pointer.
     *
     * @param doc     the document
     * @param pointer the mapping's pointer
     * @return the model
     * @throws InputFileException naming the key, the value and what is allowed, at its line and column
     */
    public static PlantModel read(YamlDocument doc, String pointer) {
        return read(mapping(doc, pointer));
    }

    /**
     * The plant mapping at a pointer with the keys of its type, for reading it and for placing a
     * check made later (the integration step against the sample period) at its key.
     *
     * @param doc     the document
     * @param pointer the mapping's pointer
     * @return the mapping
     * @throws InputFileException when the plant or its type is missing or wrong, or a key does not belong to the type
     */
    public static FileMapping mapping(YamlDocument doc, String pointer) {
        if (!doc.has(pointer)) {
            throw doc.missing(pointer, "a plant mapping with a type: " + WORDS.describe());
        }
        if (!doc.node(pointer).isObject()) {
            doc.requireKeys(pointer, List.of());
        }
        PlantType type = TYPE.read(doc, pointer);
        List<FileKey<?>> allowed = new ArrayList<>();
        allowed.add(TYPE);
        allowed.addAll(type.keys);
        return new FileMapping(doc, pointer, allowed, "for plant type " + type.word);
    }

    /**
     * Reads a plant mapping made by {@link #mapping}.
     *
     * @param plant the mapping
     * @return the model
     * @throws InputFileException naming the key, the value and what is allowed, at its line and column
     */
    public static PlantModel read(FileMapping plant) {
        PlantType type = plant.get(TYPE);
        return plant.build(() -> type.make.apply(plant));
    }

    private static PlantModel sopdt(FileMapping f) {
        double gain = f.get(GAIN);
        double deadTime = f.get(DEAD_TIME);
        if (f.has(TIME_CONSTANTS)) {
            for (FileKey<Double> other : List.of(NATURAL_FREQUENCY, DAMPING)) {
                if (f.has(other)) {
                    throw f.error(other, other.word() + " excludes time-constants; give time-constants [T1, T2]"
                            + " or natural-frequency and damping");
                }
            }
            double[] t = f.get(TIME_CONSTANTS);
            if (t.length != 2) {
                String name = f.name(TIME_CONSTANTS);
                throw f.error(TIME_CONSTANTS, name + " must list two time constants [T1, T2]: " + name + " has "
                        + t.length);
            }
            return TransferFunction.sopdt(gain, t[0], t[1], deadTime);
        }
        if (!f.has(NATURAL_FREQUENCY) && !f.has(DAMPING)) {
            throw f.doc().missing(TIME_CONSTANTS.pointer(f.pointer()),
                    "[T1, T2] in seconds, or natural-frequency and damping");
        }
        return TransferFunction.sopdtOscillatory(gain, f.get(NATURAL_FREQUENCY), f.get(DAMPING), deadTime);
    }

    private static PlantModel motor(FileMapping f) {
        double resistance = f.get(RESISTANCE);
        double inductance = f.get(INDUCTANCE);
        double coulomb = f.get(COULOMB_FRICTION);
        return new DcMotorModel(resistance, inductance, f.get(TORQUE_CONSTANT), f.get(BACK_EMF_CONSTANT),
                f.get(INERTIA), f.get(VISCOUS_FRICTION), f.get(LOAD_TORQUE), coulomb,
                f.find(STATIC_FRICTION).orElse(coulomb), f.get(MOTOR_OUTPUT),
                f.find(MOTOR_INTEGRATION_STEP).orElse(0.1 * inductance / resistance));
    }
}
