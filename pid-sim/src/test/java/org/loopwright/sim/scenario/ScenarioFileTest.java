package org.loopwright.sim.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.Action;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.nonideal.ActuatorModel;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.MotorOutput;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.TankModel;
import org.loopwright.sim.plant.ThermalZoneModel;
import org.loopwright.sim.plant.TransferFunction;

class ScenarioFileTest {

    private static final String CONTROLLER = "controller: {form: ideal, gain: 2.0, integral-time: 30.0, sample-period: 0.5}\n";

    private static Scenario parse(String text) {
        return ScenarioFile.read(YamlDocument.parse("s.yaml", text), Path.of(""));
    }

    static Stream<Arguments> plants() {
        return Stream.of(
                Arguments.of("{type: first-order, gain: 2.0, time-constant: 30.0}", TransferFunction.firstOrder(2, 30)),
                Arguments.of("{type: fopdt, gain: 2.0, time-constant: 30.0, dead-time: 5.0}",
                        TransferFunction.fopdt(2, 30, 5)),
                Arguments.of("{type: sopdt, gain: 1.0, time-constants: [10.0, 3.0], dead-time: 1.0}",
                        TransferFunction.sopdt(1, 10, 3, 1)),
                Arguments.of("{type: sopdt, gain: 1.0, natural-frequency: 0.5, damping: 0.3}",
                        TransferFunction.sopdtOscillatory(1, 0.5, 0.3, 0)),
                Arguments.of("{type: integrating, gain: 0.1, dead-time: 2.0}", TransferFunction.integrating(0.1, 2)),
                Arguments.of("{type: transfer-function, numerator: [1.0], denominator: [1.0, 3.0, 3.0, 1.0], dead-time: 0.0}",
                        new TransferFunction(new double[] {1}, new double[] {1, 3, 3, 1}, 0)),
                Arguments.of("{type: dc-motor, resistance: 2, inductance: 0.01, torque-constant: 0.1, back-emf-constant: 0.1,"
                        + " inertia: 0.01, coulomb-friction: 0.04, output: speed}",
                        new DcMotorModel(2, 0.01, 0.1, 0.1, 0.01, 0, 0, 0.04, 0.04, MotorOutput.SPEED, 0.1 * 0.01 / 2)),
                Arguments.of("{type: thermal-zone, heat-capacity: 41800, loss-coefficient: 8}",
                        new ThermalZoneModel(41800, 8, 20, Double.POSITIVE_INFINITY, 1.0)),
                Arguments.of("{type: tank, area: 0.5, outlet-coefficient: 0.01, initial-level: 0.2}",
                        new TankModel(0.5, 0.01, 0.2, 0.1)));
    }

    @ParameterizedTest
    @MethodSource("plants")
    void readsEveryPlantType(String plant, PlantModel expected) {
        Scenario s = parse(CONTROLLER + "plant: " + plant + "\nduration: 10\n");
        assertThat(s.plant()).isEqualTo(expected);
    }

    @Test
    void readsEveryPartOfAScenario() {
        Scenario s = parse(CONTROLLER + """
                plant: {type: fopdt, gain: 2.0, time-constant: 30.0, dead-time: 5.0}
                setpoint: [{at: 0, value: 50}, {at: 300, value: 60, ramp-seconds: 60}]
                disturbances: [{at: 200, value: -5}]
                actuator: {min: 0, max: 100, slew-per-second: 20, dead-zone: 0.5}
                sensor: {noise-std-dev: 0.05, quantisation-step: 0.01, delay-samples: 2, jitter: 0.01,
                         dropout-probability: 0.001}
                duration: 400
                seed: 7
                """);
        assertThat(s.controller().orElseThrow().gains()).isEqualTo(new IdealGains(2.0, 30.0, 0.0));
        assertThat(s.samplePeriodSeconds()).isEqualTo(0.5);
        assertThat(s.setpoint()).containsExactly(SetpointChange.step(0, 50), new SetpointChange(300, 60, 60));
        assertThat(s.disturbances()).containsExactly(new LoadStep(200, -5));
        assertThat(s.actuator()).isEqualTo(new ActuatorModel(0, 100, 20, 0.5));
        assertThat(s.sensor()).isEqualTo(new SensorModel(0.05, 0.01, 2, 0.01, 0.001));
        assertThat(s.durationSeconds()).isEqualTo(400.0);
        assertThat(s.seed()).isEqualTo(7L);
        assertThat(s.linearPlant()).contains(TransferFunction.fopdt(2, 30, 5));
    }

    @Test
    void readsAnOnOffController() {
        Scenario s = parse("""
                on-off: {off-output: 0, on-output: 2000, hysteresis: 0.5, minimum-on: 20, sample-period: 1.0}
                plant: {type: thermal-zone, heat-capacity: 41800, loss-coefficient: 8}
                duration: 100
                """);
        assertThat(s.onOffController()).contains(new OnOffSettings(0, 2000, 0.5, 20, 0, Action.REVERSE));
        assertThat(s.controller()).isEmpty();
        assertThat(s.samplePeriodSeconds()).isEqualTo(1.0);
    }

    @Test
    void readsAControllerFileRelativeToTheScenario(@TempDir Path dir) throws IOException {
        Files.createDirectories(dir.resolve("tuning"));
        Files.writeString(dir.resolve("tuning/pi.yaml"), "form: ideal\ngain: 3.0\nintegral-time: 12.0\nsample-period: 0.2\n");
        Path scenario = dir.resolve("loop.yaml");
        Files.writeString(scenario, "controller: tuning/pi.yaml\nplant: {type: first-order, gain: 1, time-constant: 5}\n"
                + "duration: 20\n");
        Scenario s = ScenarioFile.read(scenario);
        assertThat(s.controller().orElseThrow().gains()).isEqualTo(IdealGains.pi(3.0, 12.0));
    }

    @Test
    void theBuiltInDemoReads() {
        Scenario demo = ScenarioFile.waterBathDemo();
        assertThat(demo.plant()).isInstanceOf(ThermalZoneModel.class);
        assertThat(ScenarioFile.waterBathDemoText()).contains("our own invention");
    }

    static Stream<Arguments> badScenarios() {
        String plant = "plant: {type: first-order, gain: 1, time-constant: 5}\n";
        return Stream.of(
                Arguments.of(plant + "duration: 10\n",
                        "s.yaml:1:1: missing key 'controller' (a controller mapping or a controller file's path)"
                                + " or 'on-off' (an on-off controller mapping)"),
                Arguments.of(CONTROLLER + plant + "duration: 10\ncolour: red\n",
                        "s.yaml:4:1: unknown key 'colour'; allowed: controller, on-off, plant, inner, setpoint, disturbances,"
                                + " actuator, split-range, sensor, duration, seed, units"),
                Arguments.of(CONTROLLER + plant,
                        "s.yaml:1:1: missing key 'duration' (a number (finite and > 0))"),
                Arguments.of(CONTROLLER + plant + "duration: -4\n",
                        "s.yaml:3:1: duration must be finite and > 0: duration=-4"),
                Arguments.of(CONTROLLER + "plant: {type: boiler}\nduration: 10\n",
                        "s.yaml:2:9: plant.type must be one of first-order, fopdt, sopdt, integrating,"
                                + " transfer-function, dc-motor, thermal-zone, tank: plant.type=boiler"),
                Arguments.of(CONTROLLER + "plant: {type: fopdt, gain: 1, time-constant: 0, dead-time: 1}\nduration: 10\n",
                        "s.yaml:2:31: plant.time-constant must be finite and > 0: plant.time-constant=0"),
                Arguments.of(CONTROLLER + "plant: {type: first-order, gain: 1, time-constant: 5, dead-time: 1}\nduration: 10\n",
                        "s.yaml:2:55: unknown key 'dead-time' for plant type first-order; allowed: type, gain,"
                                + " time-constant"),
                Arguments.of(CONTROLLER + "plant: {type: sopdt, gain: 1, time-constants: [3]}\nduration: 10\n",
                        "s.yaml:2:31: plant.time-constants must list two time constants [T1, T2]:"
                                + " plant.time-constants has 1"),
                Arguments.of(CONTROLLER + "plant: {type: transfer-function, numerator: [1, 2, 3], denominator: [1, 1]}\n"
                        + "duration: 10\n",
                        "s.yaml:2:34: plant.numerator must not have more coefficients than denominator"
                                + " (denominator=[1.0, 1.0]): plant.numerator=[1, 2, 3]"),
                Arguments.of(CONTROLLER + "plant: {type: dc-motor, resistance: 2, inductance: 0.01, torque-constant: 0.1,"
                        + " back-emf-constant: 0.1, inertia: 0.01, coulomb-friction: 0.05, static-friction: 0.01}\n"
                        + "duration: 10\n",
                        "s.yaml:2:143: plant.static-friction must be >= coulomb-friction (coulomb-friction=0.05):"
                                + " plant.static-friction=0.01"),
                Arguments.of(CONTROLLER + plant + "actuator: {min: 5, max: 1}\nduration: 10\n",
                        "s.yaml:3:12: actuator.min must be <= max (max=1.0): actuator.min=5"),
                Arguments.of(CONTROLLER + plant + "sensor: {delay-samples: 1.5}\nduration: 10\n",
                        "s.yaml:3:10: sensor.delay-samples must be a whole number >= 0 and <= 2147483647: sensor.delay-samples=1.5"),
                // the limits of issue 11: bounded work and memory from a small file
                Arguments.of(CONTROLLER + plant + "sensor: {delay-samples: 2147483647}\nduration: 10\n",
                        "s.yaml:3:10: sensor.delay-samples must be <= 100 (a longer delay belongs in the plant's"
                                + " dead-time): sensor.delay-samples=2147483647"),
                Arguments.of(CONTROLLER + "plant: {type: thermal-zone, heat-capacity: 100, loss-coefficient: 1,"
                        + " integration-step: 1e-12}\nduration: 10\n",
                        "s.yaml:2:70: plant.integration-step must give at most 10000 sub-steps per sample at the sample"
                                + " period 0.5 (>= 5.0E-5): plant.integration-step=1e-12"),
                Arguments.of(CONTROLLER + "plant: {type: transfer-function, numerator: [1], denominator: ["
                        + "1, ".repeat(21) + "1]}\nduration: 10\n",
                        "s.yaml:2:50: plant.denominator must be of order <= 20: plant.denominator=["
                                + "1, ".repeat(21) + "1]"),
                Arguments.of(CONTROLLER + plant + "sensor: {jitter: 0.5}\nduration: 10\n",
                        "s.yaml:3:10: sensor.jitter must be < the sample period (0.5): sensor.jitter=0.5"),
                Arguments.of(CONTROLLER + plant + "setpoint: [{at: -1, value: 3}]\nduration: 10\n",
                        "s.yaml:3:13: setpoint[0].at must be finite and >= 0: setpoint[0].at=-1"),
                Arguments.of(CONTROLLER + plant + "disturbances: [{at: 1, size: 3}]\nduration: 10\n",
                        "s.yaml:3:24: unknown key 'size' in disturbances[0]; allowed: at, value"),
                Arguments.of("controller: missing.yaml\n" + plant + "duration: 10\n",
                        "s.yaml:1:1: controller file not found: controller=missing.yaml (looked for missing.yaml)"),
                Arguments.of(CONTROLLER + "on-off: {off-output: 0, on-output: 1, hysteresis: 1, sample-period: 1}\n"
                        + plant + "duration: 10\n",
                        "s.yaml:2:1: controller and on-off exclude each other; give one controller"),
                Arguments.of("controller: {form: ideal, gain: -2.0, sample-period: 0.5}\n" + plant + "duration: 10\n",
                        "s.yaml:1:27: controller.gain must be finite and >= 0: controller.gain=-2.0"));
    }

    @ParameterizedTest
    @MethodSource("badScenarios")
    void badScenariosNameFileLineColumnAndWhatIsAllowed(String text, String message) {
        assertThatThrownBy(() -> parse(text)).isInstanceOf(InputFileException.class).hasMessage(message);
    }

    @Test
    void unitsAreReadAndDefaultToNone() {
        Scenario named = ScenarioFile.read(YamlDocument.parse("s.yaml", CONTROLLER
                + "plant: {type: first-order, gain: 1, time-constant: 1}\nduration: 5\n"
                + "units: {process: \"°C\", output: W}\n"), Path.of(""));
        assertThat(named.units()).isEqualTo(new Units("°C", "W"));
        assertThat(named.units().processSeconds()).isEqualTo("°C·s");
        Scenario none = ScenarioFile.read(YamlDocument.parse("s.yaml", CONTROLLER
                + "plant: {type: first-order, gain: 1, time-constant: 1}\nduration: 5\n"), Path.of(""));
        assertThat(none.units()).isEqualTo(Units.NONE);
        assertThat(none.units().processSeconds()).isEqualTo("PV·s");
    }
}
