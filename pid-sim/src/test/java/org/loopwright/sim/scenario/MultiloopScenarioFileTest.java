package org.loopwright.sim.scenario;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.multiloop.ActuatorRange;
import org.loopwright.pid.multiloop.ScheduleVariable;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

/** The two-loop, schedule and split-range keys of the scenario file, and the shipped scenarios that use them. */
class MultiloopScenarioFileTest {

    private static final String OUTER = "controller: {form: ideal, gain: 2.0, integral-time: 30.0, sample-period: 0.5,"
            + " windup: actuator-tracking}\n";
    private static final String INNER = "inner:\n  controller: {form: ideal, gain: 1.0, integral-time: 3.0,"
            + " sample-period: 0.1}\n  plant: {type: first-order, gain: 1, time-constant: 2}\n";
    private static final String PLANT = "plant: {type: first-order, gain: 1, time-constant: 5}\nduration: 10\n";

    private static Scenario parse(String text) {
        return ScenarioFile.read(YamlDocument.parse("s.yaml", text), Path.of(""));
    }

    private static Path example(String name) throws URISyntaxException {
        return Path.of(MultiloopScenarioFileTest.class.getResource("/scenarios/" + name).toURI());
    }

    @Test
    void readsACascade() {
        Scenario s = parse(OUTER + INNER + PLANT);
        assertThat(s.inner()).isPresent();
        assertThat(s.inner().get().plant()).isEqualTo(TransferFunction.firstOrder(1, 2));
        assertThat(s.samplePeriodSeconds()).isEqualTo(0.1);
        assertThat(s.controller().orElseThrow().samplePeriodSeconds()).isEqualTo(0.5);
    }

    @Test
    void readsAScheduleInTheControllersOwnForm() {
        Scenario s = parse("controller: {form: ideal, gain: 2.0, integral-time: 30.0, sample-period: 0.5, schedule:"
                + " {variable: setpoint, points: [{at: 20, gain: 2.0, integral-time: 30}, {at: 80, gain: 0.8,"
                + " integral-time: 45}]}}\n" + PLANT);
        assertThat(s.schedule().orElseThrow().variable()).isEqualTo(ScheduleVariable.SETPOINT);
        assertThat(s.schedule().get().gainsAt(80.0).integralGain()).isEqualTo(0.8 / 45.0);
    }

    @Test
    void readsASplitRange() {
        Scenario s = parse("controller: {form: ideal, gain: 2.0, integral-time: 30.0, sample-period: 0.5,"
                + " output-min: 0, output-max: 100}\nsplit-range: {split-at: 50, gap: 0, first: {min: 0, max: 100},"
                + " second: {min: 0, max: 100}}\n" + PLANT);
        assertThat(s.splitRange().orElseThrow())
                .isEqualTo(new SplitRangeSpec(50.0, 0.0, new ActuatorRange(0, 100), new ActuatorRange(0, 100)));
    }

    static Stream<Arguments> badFiles() {
        return Stream.of(
                Arguments.of(OUTER.replace("0.5", "0.25") + INNER + PLANT,
                        "s.yaml:1:1: controller.sample-period must be a whole multiple (1, 2, 3, ...) of"
                                + " inner.controller.sample-period (inner.controller.sample-period=0.1):"
                                + " controller.sample-period=0.25"),
                Arguments.of(OUTER.replace("actuator-tracking", "back-calculation") + INNER + PLANT,
                        "s.yaml:1:1: controller.windup must be actuator-tracking for the outer controller of a"
                                + " cascade, so that it tracks what the inner loop achieves: controller.windup="
                                + "back-calculation"),
                Arguments.of(OUTER + "inner: {controller: {form: ideal, gain: 1, sample-period: 0.1}}\n" + PLANT,
                        "s.yaml:2:1: missing key 'plant' in inner (a plant mapping with a type: one of first-order, fopdt,"
                                + " sopdt, integrating, transfer-function, dc-motor, thermal-zone, tank)"),
                Arguments.of("controller: {form: ideal, gain: 2.0, sample-period: 0.5, schedule: {variable: level,"
                        + " points: [{at: 1, gain: 1}]}}\n" + PLANT,
                        "s.yaml:1:69: controller.schedule.variable must be one of measurement, setpoint, external:"
                                + " controller.schedule.variable=level"),
                Arguments.of("controller: {form: ideal, gain: 2.0, sample-period: 0.5, schedule: {variable: setpoint,"
                        + " points: [{at: 20, gain: 1}, {at: 10, gain: 2}]}}\n" + PLANT,
                        "s.yaml:1:118: controller.schedule.points[1].at must be greater than the previous point's"
                                + " (controller.schedule.points[0].at=20.0): controller.schedule.points[1].at=10.0"),
                Arguments.of("controller: {form: ideal, gain: 2.0, sample-period: 0.5, schedule: {variable: setpoint,"
                        + " points: [{at: 20, proportional-gain: 1}]}}\n" + PLANT,
                        "s.yaml:1:107: unknown key 'proportional-gain' in controller.schedule.points[0]; allowed: at,"
                                + " gain, integral-time, derivative-time"),
                Arguments.of("controller: {form: ideal, gain: 2.0, sample-period: 0.5, output-min: 0, output-max: 100}\n"
                        + "split-range: {split-at: 50, first: {min: 0, max: 100}, second: {min: 5, max: 5}}\n" + PLANT,
                        "s.yaml:2:73: split-range.second.max must be > split-range.second.min"
                                + " (split-range.second.min=5.0): split-range.second.max=5.0"),
                Arguments.of("controller: {form: ideal, gain: 2.0, sample-period: 0.5, output-min: 0, output-max: 100}\n"
                        + "split-range: {split-at: 100, first: {min: 0, max: 100}, second: {min: 0, max: 1}}\n" + PLANT,
                        "s.yaml:2:15: split-range.split-at must leave each actuator part of the output range:"
                                + " outputMin < split-at - gap/2 and split-at + gap/2 < outputMax (outputMin=0.0,"
                                + " outputMax=100.0, gap=0.0): split-range.split-at=100"));
    }

    @ParameterizedTest
    @MethodSource("badFiles")
    void badMultiloopKeysNameFileLineColumnAndWhatIsAllowed(String text, String message) {
        assertThatThrownBy(() -> parse(text)).isInstanceOf(InputFileException.class).hasMessage(message);
    }

    @Test
    void shippedScenariosReadAndRun() throws URISyntaxException {
        for (String name : new String[] {"conveyor-axis-cascade.yaml", "jacketed-vessel.yaml",
                "tank-level-scheduled.yaml", "bath-heat-cool.yaml"}) {
            Trajectory t = Simulation.run(ScenarioFile.read(example(name)));
            // common practice: each demo loop ends at its last setpoint
            double last = t.setpoint(t.length() - 1);
            assertThat(t.process(t.length() - 1)).as(name).isCloseTo(last,
                    org.assertj.core.api.Assertions.within(0.02 * Math.max(1.0, Math.abs(last))));
        }
    }

    @Test
    void bathSplitRangeKeepsEachActuatorInItsRangeAndNeverRunsBoth() throws URISyntaxException {
        Trajectory t = Simulation.run(ScenarioFile.read(example("bath-heat-cool.yaml")));
        assertThat(t.hasSplitRange()).isTrue();
        boolean cooled = false;
        boolean heated = false;
        for (int k = 0; k < t.length(); k++) {
            assertThat(t.firstActuator(k)).isBetween(0.0, 1500.0);
            assertThat(t.secondActuator(k)).isBetween(0.0, 2000.0);
            assertThat(t.firstActuator(k) == 0.0 || t.secondActuator(k) == 0.0).isTrue();
            cooled |= t.firstActuator(k) > 0.0;
            heated |= t.secondActuator(k) > 0.0;
        }
        assertThat(cooled).isTrue();
        assertThat(heated).isTrue();
    }
}
