package org.loopwright.sim.config;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.OutputKind;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.form.SeriesGains;

class ControllerFileTest {

    private static final String IDEAL_PI = "form: ideal\ngain: 2.0\nintegral-time: 30.0\nsample-period: 0.1\n";

    private static ControllerSettings parse(String yaml) {
        return ControllerFile.read(YamlDocument.parse("bath.yaml", yaml), "");
    }

    @Test
    void readsEveryKeyOfTheIssuesExample() {
        ControllerSettings s = parse("""
                form: ideal
                gain: 2.0
                integral-time: 30.0
                derivative-time: 5.0
                sample-period: 0.1
                setpoint-weight-proportional: 1.0
                setpoint-weight-derivative: 0.5
                derivative-filter: 8
                integral-method: backward-euler
                derivative-method: ramp-invariant
                action: direct
                output-min: 0.0
                output-max: 100.0
                windup: clamping
                output-slew: 50.0
                setpoint-slew: 5.0
                fault-policy: safe-output
                safe-output: 10.0
                error-deadband: 0.2
                wrap-span: 360
                output-kind: increment
                """);
        assertThat(s.gains()).isEqualTo(new IdealGains(2.0, 30.0, 5.0));
        assertThat(s.samplePeriodSeconds()).isEqualTo(0.1);
        assertThat(s.proportionalSetpointWeight()).isEqualTo(1.0);
        assertThat(s.derivativeSetpointWeight()).isEqualTo(0.5);
        assertThat(s.derivativeFilterRatio()).isEqualTo(8.0);
        assertThat(s.derivativeFilterTimeSeconds()).isEqualTo(5.0 / 8.0);
        assertThat(s.integralMethod()).isEqualTo(IntegralMethod.BACKWARD_EULER);
        assertThat(s.derivativeMethod()).isEqualTo(DerivativeMethod.RAMP_INVARIANT);
        assertThat(s.action()).isEqualTo(Action.DIRECT);
        assertThat(s.outputMin()).isEqualTo(0.0);
        assertThat(s.outputMax()).isEqualTo(100.0);
        assertThat(s.windupProtection()).isEqualTo(WindupProtection.CLAMPING);
        assertThat(s.outputSlewPerSecond()).isEqualTo(50.0);
        assertThat(s.setpointSlewPerSecond()).isEqualTo(5.0);
        assertThat(s.faultPolicy()).isEqualTo(FaultPolicy.SAFE_OUTPUT);
        assertThat(s.safeOutput()).isEqualTo(10.0);
        assertThat(s.errorDeadband()).isEqualTo(0.2);
        assertThat(s.wrapSpan()).isEqualTo(360.0);
        assertThat(s.outputKind()).isEqualTo(OutputKind.INCREMENT);
    }

    @Test
    void appliesTheBuildersDefaultsForOmittedKeys() {
        ControllerSettings s = parse("form: ideal\ngain: 1.5\nsample-period: 0.5\n");
        assertThat(s.gains()).isEqualTo(new IdealGains(1.5, Double.POSITIVE_INFINITY, 0.0));
        ControllerSettings defaults = ControllerSettings.builder().gains(new IdealGains(1.5, Double.POSITIVE_INFINITY, 0.0))
                .samplePeriodSeconds(0.5).build();
        assertThat(ControllerFile.toYaml(s)).isEqualTo(ControllerFile.toYaml(defaults));
    }

    @Test
    void yamlInfinityMeansNoLimitOrNoIntegralAction() {
        ControllerSettings s = parse("form: ideal\ngain: 1\nintegral-time: .inf\nsample-period: 1\n"
                + "output-min: -.inf\noutput-max: .inf\noutput-slew: .inf\n");
        assertThat(s.gains().hasIntegralAction()).isFalse();
        assertThat(s.outputMin()).isEqualTo(Double.NEGATIVE_INFINITY);
        assertThat(s.outputMax()).isEqualTo(Double.POSITIVE_INFINITY);
        assertThat(s.outputSlewPerSecond()).isEqualTo(Double.POSITIVE_INFINITY);
    }

    @Test
    void readsTheParallelAndSeriesForms() {
        assertThat(parse("form: parallel\nproportional-gain: 2\nintegral-gain: 0.1\nderivative-gain: 4\n"
                + "sample-period: 0.1\n").gains()).isEqualTo(new ParallelGains(2.0, 0.1, 4.0));
        assertThat(parse("form: series\ngain: 2\nintegral-time: 20\nderivative-time: 2\nsample-period: 0.1\n")
                .gains()).isEqualTo(new SeriesGains(2.0, 20.0, 2.0));
    }

    @Test
    void readsAControllerEmbeddedAtAPointer() {
        YamlDocument doc = YamlDocument.parse("scenario.yaml", """
                duration: 60
                controller:
                  form: ideal
                  gain: -1
                  sample-period: 0.1
                """);
        assertThatThrownBy(() -> ControllerFile.read(doc, "/controller"))
                .isInstanceOf(InputFileException.class)
                .hasMessage("scenario.yaml:4:3: controller.gain must be finite and >= 0: controller.gain=-1");
        YamlDocument good = YamlDocument.parse("scenario.yaml", "controller:\n  form: ideal\n  gain: 3\n"
                + "  sample-period: 0.2\n");
        assertThat(ControllerFile.read(good, "/controller").gains()).isEqualTo(
                new IdealGains(3.0, Double.POSITIVE_INFINITY, 0.0));
    }

    static Stream<Arguments> badFiles() {
        return Stream.of(
                Arguments.of("gain: 2\nsample-period: 0.1\n",
                        "bath.yaml:1:1: missing key 'form' (one of parallel, ideal, series)"),
                Arguments.of("form: pid\ngain: 2\nsample-period: 0.1\n",
                        "bath.yaml:1:1: form must be one of parallel, ideal, series: form=pid"),
                Arguments.of("form: ideal\nintegral-time: 30\nsample-period: 0.1\n",
                        "bath.yaml:1:1: missing key 'gain' for form ideal (a number (finite and >= 0))"),
                Arguments.of("form: parallel\nintegral-gain: 0.1\nsample-period: 0.1\n",
                        "bath.yaml:1:1: missing key 'proportional-gain' for form parallel (a number (finite and >= 0))"),
                Arguments.of("form: ideal\ngain: 2\nproportional-gain: 2\nsample-period: 0.1\n",
                        "bath.yaml:3:1: proportional-gain does not belong to form ideal;"
                                + " form ideal takes gain, integral-time, derivative-time"),
                Arguments.of("form: parallel\nproportional-gain: 2\nintegral-time: 30\nsample-period: 0.1\n",
                        "bath.yaml:3:1: integral-time does not belong to form parallel;"
                                + " form parallel takes proportional-gain, integral-gain, derivative-gain"),
                Arguments.of("form: ideal\ngain: -2\nsample-period: 0.1\n",
                        "bath.yaml:2:1: gain must be finite and >= 0: gain=-2"),
                Arguments.of("form: ideal\ngain: two\nsample-period: 0.1\n",
                        "bath.yaml:2:1: gain must be a number: gain=two"),
                Arguments.of("form: ideal\ngain:\nsample-period: 0.1\n",
                        "bath.yaml:2:1: gain must be a number: gain=(empty)"),
                Arguments.of("form: ideal\ngain: 2\nintegral-time: 0\nsample-period: 0.1\n",
                        "bath.yaml:3:1: integral-time must be > 0 (infinity for no integral action): integral-time=0"),
                Arguments.of("form: parallel\nproportional-gain: 2\nderivative-gain: -4\nsample-period: 0.1\n",
                        "bath.yaml:3:1: derivative-gain must be finite and >= 0: derivative-gain=-4"),
                Arguments.of("form: ideal\ngain: 2\n",
                        "bath.yaml:1:1: missing key 'sample-period' (a number)"),
                Arguments.of(IDEAL_PI.replace("0.1", "-0.1"),
                        "bath.yaml:4:1: sample-period must be finite and > 0: sample-period=-0.1"),
                Arguments.of(IDEAL_PI + "setpoint-weight-proportional: 1.5\n",
                        "bath.yaml:5:1: setpoint-weight-proportional must be between 0 and 1:"
                                + " setpoint-weight-proportional=1.5"),
                Arguments.of(IDEAL_PI + "setpoint-weight-derivative: -0.1\n",
                        "bath.yaml:5:1: setpoint-weight-derivative must be between 0 and 1:"
                                + " setpoint-weight-derivative=-0.1"),
                Arguments.of(IDEAL_PI + "derivative-time: 5\nderivative-filter: 0\n",
                        "bath.yaml:6:1: derivative-filter must be finite and > 0: derivative-filter=0"),
                Arguments.of(IDEAL_PI + "derivative-time: 5\nderivative-filter-time: -1\n",
                        "bath.yaml:6:1: derivative-filter-time must be finite and > 0: derivative-filter-time=-1"),
                Arguments.of(IDEAL_PI + "derivative-filter: 10\nderivative-filter-time: 0.5\n",
                        "bath.yaml:6:1: derivative-filter and derivative-filter-time exclude each other;"
                                + " give derivative-filter (N = Td/Tf) or derivative-filter-time (Tf in seconds)"),
                Arguments.of("form: parallel\nproportional-gain: 0\nintegral-gain: 1\nderivative-gain: 2\n"
                                + "sample-period: 0.1\n",
                        "bath.yaml:1:1: derivative-filter-time must be given when proportional-gain = 0,"
                                + " since Td/N is undefined (derivative-filter-time is not given)"),
                Arguments.of(IDEAL_PI + "derivative-time: 1\nderivative-method: forward-euler\n"
                                + "derivative-filter-time: 0.04\n",
                        "bath.yaml:4:1: sample-period must be < 2 * derivative-filter-time for the forward-Euler"
                                + " derivative (derivative-filter-time=0.04): sample-period=0.1"),
                Arguments.of(IDEAL_PI + "integral-method: trapezoid\n",
                        "bath.yaml:5:1: integral-method must be one of forward-euler, backward-euler, tustin:"
                                + " integral-method=trapezoid"),
                Arguments.of(IDEAL_PI + "derivative-method: zoh\n",
                        "bath.yaml:5:1: derivative-method must be one of backward-euler, tustin, step-invariant,"
                                + " ramp-invariant, forward-euler: derivative-method=zoh"),
                Arguments.of(IDEAL_PI + "action: forward\n",
                        "bath.yaml:5:1: action must be one of reverse, direct: action=forward"),
                Arguments.of(IDEAL_PI + "output-min: 100\noutput-max: 0\n",
                        "bath.yaml:5:1: output-min must be <= output-max (output-max=0.0): output-min=100"),
                Arguments.of(IDEAL_PI + "output-max: '100'\n",
                        "bath.yaml:5:1: output-max must be a number: output-max=100"),
                Arguments.of(IDEAL_PI + "windup: anti\n",
                        "bath.yaml:5:1: windup must be one of none, clamping, back-calculation, actuator-tracking:"
                                + " windup=anti"),
                Arguments.of(IDEAL_PI + "windup: clamping\ntracking-time: 12\n",
                        "bath.yaml:6:1: tracking-time applies only to windup: back-calculation or actuator-tracking"
                                + " (windup is clamping)"),
                Arguments.of(IDEAL_PI + "tracking-time: 0\n",
                        "bath.yaml:5:1: tracking-time must be finite and > 0: tracking-time=0"),
                Arguments.of(IDEAL_PI + "output-slew: 0\n",
                        "bath.yaml:5:1: output-slew must be > 0 (infinity for no limit): output-slew=0"),
                Arguments.of(IDEAL_PI + "setpoint-slew: -5\n",
                        "bath.yaml:5:1: setpoint-slew must be > 0 (infinity for no limit): setpoint-slew=-5"),
                Arguments.of(IDEAL_PI + "fault-policy: stop\n",
                        "bath.yaml:5:1: fault-policy must be one of hold, safe-output: fault-policy=stop"),
                Arguments.of(IDEAL_PI + "fault-policy: safe-output\n",
                        "bath.yaml:5:1: missing key 'safe-output' for fault-policy safe-output (a number (finite))"),
                Arguments.of(IDEAL_PI + "safe-output: 0\n",
                        "bath.yaml:5:1: safe-output applies only to fault-policy: safe-output (fault-policy is hold)"),
                Arguments.of(IDEAL_PI + "error-deadband: -1\n",
                        "bath.yaml:5:1: error-deadband must be finite and >= 0: error-deadband=-1"),
                Arguments.of(IDEAL_PI + "wrap-span: -360\n",
                        "bath.yaml:5:1: wrap-span must be finite and >= 0: wrap-span=-360"),
                Arguments.of(IDEAL_PI + "output-kind: velocity\n",
                        "bath.yaml:5:1: output-kind must be one of position, increment: output-kind=velocity"),
                Arguments.of(IDEAL_PI + "  gain: 3\n",
                        "bath.yaml:5:7: not valid YAML: mapping values are not allowed here"),
                Arguments.of(IDEAL_PI + "setpoint: 60\n",
                        "bath.yaml:5:1: unknown key 'setpoint'; allowed: form, gain, integral-time, derivative-time,"
                                + " proportional-gain, integral-gain, derivative-gain, sample-period,"
                                + " setpoint-weight-proportional, setpoint-weight-derivative, derivative-filter,"
                                + " derivative-filter-time, integral-method, derivative-method, action, output-min,"
                                + " output-max, windup, tracking-time, output-slew, setpoint-slew, fault-policy,"
                                + " safe-output, error-deadband, wrap-span, output-kind"),
                Arguments.of(IDEAL_PI + "gain: 3\n",
                        "bath.yaml:5:1: duplicate key 'gain' (first at line 2); each key may appear once"),
                Arguments.of("- form: ideal\n",
                        "bath.yaml:1:1: the document must be a mapping of keys to values: the document=[{\"form\":\"ideal\"}]"));
    }

    @ParameterizedTest
    @MethodSource("badFiles")
    void badFileIsRejectedWithItsLineColumnKeyAndWhatIsAllowed(String yaml, String message) {
        assertThatThrownBy(() -> parse(yaml))
                .isInstanceOf(InputFileException.class)
                .hasMessage(message);
    }

    @Test
    void errorCarriesItsLocationAsAccessors() {
        InputFileException e = (InputFileException) org.assertj.core.api.Assertions.catchThrowable(
                () -> parse(IDEAL_PI + "action: forward\n"));
        assertThat(e.file()).isEqualTo("bath.yaml");
        assertThat(e.line()).isEqualTo(5);
        assertThat(e.column()).isEqualTo(1);
        assertThat(e.detail()).isEqualTo("action must be one of reverse, direct: action=forward");
    }

    static Stream<ControllerSettings> variedSettings() {
        return Stream.of(
                ControllerSettings.builder().gains(IdealGains.pi(2.0, 30.0)).samplePeriodSeconds(0.1).build(),
                ControllerSettings.builder().gains(new IdealGains(2.0, 30.0, 5.0)).samplePeriodSeconds(0.1)
                        .derivativeFilterRatio(7.0).outputRange(0.0, 100.0).setpointWeights(0.6, 0.3).build(),
                ControllerSettings.builder().gains(new ParallelGains(0.7, 0.013, 1.9)).samplePeriodSeconds(0.01)
                        .derivativeFilterTimeSeconds(0.3).integralMethod(IntegralMethod.FORWARD_EULER)
                        .derivativeMethod(DerivativeMethod.STEP_INVARIANT).action(Action.DIRECT)
                        .outputRange(-12.5, Double.POSITIVE_INFINITY).windupProtection(WindupProtection.ACTUATOR_TRACKING)
                        .trackingTimeSeconds(4.0).outputSlewPerSecond(3.0).setpointSlewPerSecond(0.25)
                        .faultPolicy(FaultPolicy.SAFE_OUTPUT, -1.0).errorDeadband(0.05).wrapSpan(360.0)
                        .outputKind(OutputKind.INCREMENT).setpointWeights(1.0, 0.3).build(),
                ControllerSettings.builder().gains(new SeriesGains(1.1, 12.0, 3.0)).samplePeriodSeconds(1e-4)
                        .derivativeMethod(DerivativeMethod.TUSTIN).windupProtection(WindupProtection.NONE).build(),
                ControllerSettings.builder().gains(new ParallelGains(0.0, 0.5, 0.0)).samplePeriodSeconds(0.2)
                        .windupProtection(WindupProtection.CLAMPING).outputRange(Double.NEGATIVE_INFINITY, 1e6).build());
    }

    @ParameterizedTest
    @MethodSource("variedSettings")
    void writtenFileReadsBackToTheSameSettings(ControllerSettings original) {
        String yaml = ControllerFile.toYaml(original);
        ControllerSettings back = parse(yaml);
        assertThat(ControllerFile.toYaml(back)).isEqualTo(yaml);
        assertThat(back.gains()).isEqualTo(original.gains());
        assertThat(back.samplePeriodSeconds()).isEqualTo(original.samplePeriodSeconds());
        assertThat(back.derivativeFilterTimeSeconds()).isEqualTo(original.derivativeFilterTimeSeconds());
        assertThat(back.trackingTimeSeconds()).isEqualTo(original.trackingTimeSeconds());
        assertThat(back.outputMin()).isEqualTo(original.outputMin());
        assertThat(back.outputMax()).isEqualTo(original.outputMax());
        assertThat(back.discretePid()).usingRecursiveComparison().isEqualTo(original.discretePid());
        // the same settings drive the same outputs (checked on a short disturbed sequence)
        PidController a = new PidController(original);
        PidController b = new PidController(back);
        for (int k = 0; k < 50; k++) {
            double y = Math.sin(0.3 * k) + (k == 20 ? Double.NaN : 0.0);
            assertThat(b.update(1.0, y)).isEqualTo(a.update(1.0, y));
        }
    }

    @Test
    void readsAFileFromDisk(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("bath.yaml");
        Files.writeString(file, IDEAL_PI);
        assertThat(ControllerFile.read(file).gains()).isEqualTo(IdealGains.pi(2.0, 30.0));
        Path missing = dir.resolve("nowhere.yaml");
        assertThatThrownBy(() -> ControllerFile.read(missing))
                .isInstanceOf(InputFileException.class)
                .hasMessage(missing + ": cannot be read (no such file or directory)");
    }

    @Test
    void eachKeyIsDeclaredOnceWithItsOwnField() {
        Set<String> words = new HashSet<>();
        Set<String> fields = new HashSet<>();
        for (FileKey<?> key : ControllerFile.KEYS) {
            assertThat(words.add(key.word())).as(key.word()).isTrue();
            assertThat(fields.add(key.field())).as(key.field()).isTrue();
        }
    }

    /** The README's controller-file example lists every key the reader allows, with the declared defaults. */
    @Test
    void readmeListsEveryKey() throws IOException {
        String readme = Files.readString(Path.of("..", "README.md"));
        String section = readme.substring(readme.indexOf("### Controller file"), readme.indexOf("### Trace file"));
        for (FileKey<?> key : ControllerFile.KEYS) {
            assertThat(section).as(key.word()).containsPattern("[\\s:]" + key.word() + ":? [(A-Za-z0-9#]");
        }
        assertThat(ControllerFile.INTEGRAL_METHOD.defaultText()).isEqualTo("tustin");
        assertThat(readme).contains("# N = Td/Tf (default " + Math.round(ControllerFile.FILTER_RATIO.defaultValue()
                .orElseThrow()) + ")");
    }

    @Test
    void resolvedSettingsListEveryKeyThatAppliesWithDefaultsAndDerivedValues() {
        Map<String, String> resolved = ControllerFile.resolved(parse(IDEAL_PI));
        assertThat(resolved).containsEntry("form", "ideal").containsEntry("integral-method", "tustin")
                .containsEntry("tracking-time", "30.0").containsEntry("output-max", ".inf")
                .doesNotContainKeys("proportional-gain", "safe-output", "derivative-filter-time");
    }
}
