package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.stream.Stream;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.form.IdealGains;

/** The snapshot's text form, the warm restart it gives, and its errors. */
class StateSnapshotTest {

    private static ControllerSettings.Builder bath() {
        return ControllerSettings.builder()
                .gains(new IdealGains(4.0, 120.0, 10.0))
                .samplePeriodSeconds(1.0)
                .outputRange(0.0, 100.0)
                .outputSlewPerSecond(20.0);
    }

    /** A controller that has run a while: water bath from 20 °C towards 60 °C. */
    private static PidController warmedUp(ControllerSettings s) {
        PidController c = new PidController(s);
        double temperature = 20.0;
        for (int k = 0; k < 300; k++) {
            double power = c.update(60.0, temperature);
            temperature += 0.01 * power - 0.005 * (temperature - 20.0);
        }
        return c;
    }

    @Provide
    Arbitrary<ControllerSettings> settings() {
        return SettingsArbitraries.settings();
    }

    /** Samples of setpoint, measurement (NaN now and then) and whether to switch to manual first. */
    @Provide
    Arbitrary<List<double[]>> samples() {
        Arbitrary<Double> measurement = Arbitraries.frequencyOf(Tuple.of(5, Arbitraries.doubles().between(-30.0, 30.0)),
                Tuple.of(1, Arbitraries.just(Double.NaN)));
        return Combinators.combine(Arbitraries.doubles().between(-30.0, 30.0), measurement,
                Arbitraries.integers().between(0, 4)).as((r, y, k) -> new double[] {r, y, k}).list().ofMaxSize(20);
    }

    @Property
    void textFormRoundTripsExactly(@ForAll("settings") ControllerSettings s, @ForAll("samples") List<double[]> samples) {
        PidController c = new PidController(s);
        for (double[] sample : samples) {
            if (sample[2] == 0.0) {
                c.switchToManual();
            }
            c.update(sample[0], sample[1]);
        }
        StateSnapshot snapshot = c.snapshot();
        assertThat(StateSnapshot.parse(snapshot.toText())).isEqualTo(snapshot);
    }

    @Test
    void textFormIsOneKeyPerLineInTheDocumentedOrder() {
        String text = warmedUp(bath().build()).snapshot().toText();
        assertThat(text.lines().map(line -> line.substring(0, line.indexOf('='))))
                .containsExactly("loopwright-state", "action", "output-kind", "output-min", "output-max", "wrap-span",
                        "mode", "started", "integral", "derivative-state", "previous-error", "previous-setpoint",
                        "previous-measurement", "previous-unlimited", "previous-output", "previous-feedforward",
                        "feedforward-applied", "manual-value", "fault-count");
        assertThat(text).startsWith("loopwright-state=1\naction=reverse\noutput-kind=position\noutput-min=0.0\n");
        // comments and blank lines are ignored
        assertThat(StateSnapshot.parse("# saved at shutdown\n\n" + text)).isEqualTo(StateSnapshot.parse(text));
    }

    @Test
    void restoreGivesABumplessRestart() {
        PidController running = warmedUp(bath().build());
        double last = running.position();
        String saved = running.snapshot().toText();

        PidController restarted = new PidController(bath().build());
        restarted.restore(StateSnapshot.parse(saved));
        assertThat(restarted.snapshot()).isEqualTo(running.snapshot());
        // the bath cooled a little while the device restarted: still no bump
        assertThat(restarted.update(60.0, 58.7)).isCloseTo(last, within(1e-9));
        // and it goes on regulating the bath to its setpoint
        double temperature = 58.7;
        for (int k = 0; k < 2000; k++) {
            double power = restarted.update(60.0, temperature);
            temperature += 0.01 * power - 0.005 * (temperature - 20.0);
        }
        assertThat(temperature).isCloseTo(60.0, within(0.01));
    }

    @Test
    void restoreUnderNewGainsIsBumplessToo() {
        PidController running = warmedUp(bath().build());
        double last = running.position();
        PidController restarted = new PidController(bath().gains(new IdealGains(8.0, 60.0, 0.0)).build());
        restarted.restore(running.snapshot());
        assertThat(restarted.update(60.0, 58.0)).isCloseTo(last, within(1e-9));
    }

    static Stream<Arguments> incompatibleSettings() {
        return Stream.of(
                Arguments.of(bath().outputRange(0.0, 50.0),
                        "snapshot taken under another configuration: output-max=100.0 in the snapshot, output-max=50.0 in this controller"),
                Arguments.of(bath().outputRange(-100.0, 100.0),
                        "snapshot taken under another configuration: output-min=0.0 in the snapshot, output-min=-100.0 in this controller"),
                Arguments.of(bath().action(Action.DIRECT),
                        "snapshot taken under another configuration: action=reverse in the snapshot, action=direct in this controller"),
                Arguments.of(bath().outputKind(OutputKind.INCREMENT),
                        "snapshot taken under another configuration: output-kind=position in the snapshot, output-kind=increment in this controller"),
                Arguments.of(bath().wrapSpan(360.0),
                        "snapshot taken under another configuration: wrap-span=0.0 in the snapshot, wrap-span=360.0 in this controller"));
    }

    @ParameterizedTest
    @MethodSource("incompatibleSettings")
    void incompatibleSnapshotIsRejected(ControllerSettings.Builder other, String message) {
        StateSnapshot saved = warmedUp(bath().build()).snapshot();
        PidController c = new PidController(other.build());
        StateSnapshot untouched = c.snapshot();
        assertThatThrownBy(() -> c.restore(saved)).isInstanceOf(IllegalArgumentException.class).hasMessage(message);
        assertThat(c.snapshot()).isEqualTo(untouched);
    }

    private static String valid() {
        return warmedUp(bath().build()).snapshot().toText();
    }

    private static String replaced(String key, String line) {
        return valid().replaceFirst("(?m)^" + key + "=.*$", line);
    }

    static Stream<Arguments> malformedTexts() {
        return Stream.of(
                Arguments.of(replaced("action", "sideways"), "state line 2: expected key=value, found 'sideways'"),
                Arguments.of(replaced("action", "action=sideways"),
                        "state line 2: action must be one of reverse | direct: action=sideways"),
                Arguments.of(replaced("loopwright-state", "loopwright-state=2"),
                        "state line 1: format version must be 1: loopwright-state=2"),
                Arguments.of(replaced("output-max", "output-max=lots"),
                        "state line 5: output-max must be a number: output-max=lots"),
                Arguments.of(replaced("mode", "mode=cruise"),
                        "state line 7: mode must be one of automatic | manual | tracking: mode=cruise"),
                Arguments.of(replaced("started", "started=yes"), "state line 8: started must be true or false: started=yes"),
                Arguments.of(replaced("integral", "integral=NaN"), "state line 9: integral must be a number: integral=NaN"),
                Arguments.of(replaced("integral", "integral=Infinity"),
                        "state line 9: integral must be finite: integral=Infinity"),
                Arguments.of(replaced("fault-count", "fault-count=-1"),
                        "state line 19: fault-count must be a whole number >= 0: fault-count=-1"),
                Arguments.of(replaced("manual-value", "manual-value=1.0\nmanual-value=2.0"),
                        "state line 19: key 'manual-value' given twice"),
                Arguments.of(valid() + "colour=blue\n", "state line 20: unknown key 'colour'"),
                Arguments.of(replaced("previous-error", "# previous-error removed"), "state: key 'previous-error' is missing"));
    }

    @ParameterizedTest
    @MethodSource("malformedTexts")
    void malformedTextNamesTheLine(String text, String message) {
        assertThatThrownBy(() -> StateSnapshot.parse(text)).isInstanceOf(IllegalArgumentException.class)
                .hasMessage(message);
    }
}
