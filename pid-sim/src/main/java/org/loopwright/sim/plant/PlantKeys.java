package org.loopwright.sim.plant;

import static java.util.Map.entry;

import java.util.List;

import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.config.NumberRule;

/**
 * The keys of a scenario file's {@code plant} mapping, each declared once with its word, the model
 * field it fills, its rule and its default. {@link PlantType} says which keys each type takes.
 */
final class PlantKeys {

    /** The words of {@code output} for a dc-motor. */
    static final Keywords<MotorOutput> MOTOR_OUTPUTS = Keywords.of(entry("speed", MotorOutput.SPEED),
            entry("position", MotorOutput.POSITION));

    static final FileKey<Double> GAIN = FileKey.number("gain", "gain", NumberRule.FINITE);
    static final FileKey<Double> TIME_CONSTANT = FileKey.number("time-constant", "timeConstantSeconds",
            NumberRule.POSITIVE);
    static final FileKey<double[]> TIME_CONSTANTS = FileKey.numbers("time-constants", "timeConstantsSeconds",
            NumberRule.POSITIVE);
    static final FileKey<Double> NATURAL_FREQUENCY = FileKey.number("natural-frequency",
            "naturalFrequencyRadPerSecond", NumberRule.POSITIVE);
    static final FileKey<Double> DAMPING = FileKey.number("damping", "damping", NumberRule.POSITIVE);
    static final FileKey<Double> DEAD_TIME = FileKey.number("dead-time", "deadTimeSeconds", NumberRule.NON_NEGATIVE)
            .orElse(0.0);
    static final FileKey<double[]> NUMERATOR = FileKey.numbers("numerator", "numerator", NumberRule.FINITE);
    static final FileKey<double[]> DENOMINATOR = FileKey.numbers("denominator", "denominator", NumberRule.FINITE);

    /** What a sweep spreads on every linear type: its transfer function's gain, time constants and dead time. */
    static final List<FileKey<Double>> LINEAR_SPREAD = List.of(GAIN, TIME_CONSTANT, DEAD_TIME);

    static final FileKey<Double> RESISTANCE = FileKey.number("resistance", "resistanceOhms", NumberRule.POSITIVE);
    static final FileKey<Double> INDUCTANCE = FileKey.number("inductance", "inductanceHenries", NumberRule.POSITIVE);
    static final FileKey<Double> TORQUE_CONSTANT = FileKey.number("torque-constant", "torqueConstant",
            NumberRule.POSITIVE);
    static final FileKey<Double> BACK_EMF_CONSTANT = FileKey.number("back-emf-constant", "backEmfConstant",
            NumberRule.NON_NEGATIVE);
    static final FileKey<Double> INERTIA = FileKey.number("inertia", "inertia", NumberRule.POSITIVE);
    static final FileKey<Double> VISCOUS_FRICTION = FileKey.number("viscous-friction", "viscousFriction",
            NumberRule.NON_NEGATIVE).orElse(0.0);
    static final FileKey<Double> LOAD_TORQUE = FileKey.number("load-torque", "loadTorque", NumberRule.FINITE)
            .orElse(0.0);
    static final FileKey<Double> COULOMB_FRICTION = FileKey.number("coulomb-friction", "coulombFriction",
            NumberRule.NON_NEGATIVE).orElse(0.0);
    /** Absent: equal to the Coulomb friction. */
    static final FileKey<Double> STATIC_FRICTION = FileKey.number("static-friction", "staticFriction",
            NumberRule.NON_NEGATIVE).optional();
    static final FileKey<MotorOutput> MOTOR_OUTPUT = FileKey.choice("output", "output", MOTOR_OUTPUTS)
            .orElse(MotorOutput.POSITION);
    /** Absent: a tenth of L/R. */
    static final FileKey<Double> MOTOR_INTEGRATION_STEP = FileKey.number("integration-step",
            "integrationStepSeconds", NumberRule.POSITIVE).optional();

    static final FileKey<Double> HEAT_CAPACITY = FileKey.number("heat-capacity", "heatCapacityJoulesPerKelvin",
            NumberRule.POSITIVE);
    static final FileKey<Double> LOSS_COEFFICIENT = FileKey.number("loss-coefficient", "lossWattsPerKelvin",
            NumberRule.NON_NEGATIVE);
    static final FileKey<Double> AMBIENT = FileKey.number("ambient", "ambientCelsius", NumberRule.FINITE).orElse(20.0);
    static final FileKey<Double> MAX_POWER = FileKey.number("max-power", "maxPowerWatts", NumberRule.ANY)
            .orElse(Double.POSITIVE_INFINITY);
    static final FileKey<Double> THERMAL_INTEGRATION_STEP = FileKey.number("integration-step",
            "integrationStepSeconds", NumberRule.POSITIVE).orElse(1.0);

    static final FileKey<Double> AREA = FileKey.number("area", "areaSquareMetres", NumberRule.POSITIVE);
    static final FileKey<Double> OUTLET_COEFFICIENT = FileKey.number("outlet-coefficient", "outletCoefficient",
            NumberRule.POSITIVE);
    static final FileKey<Double> INITIAL_LEVEL = FileKey.number("initial-level", "initialLevelMetres",
            NumberRule.NON_NEGATIVE).orElse(0.0);
    static final FileKey<Double> TANK_INTEGRATION_STEP = FileKey.number("integration-step", "integrationStepSeconds",
            NumberRule.POSITIVE).orElse(0.1);

    private PlantKeys() {
    }
}
