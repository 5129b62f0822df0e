package org.loopwright.pid.monitor;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.function.Supplier;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.InvalidSettingException;

/** Every wrong value fails where it is given, with the message of the table, verbatim; defaults as documented. */
class MonitorSettingsTest {

    private static final double NAN = Double.NaN;
    private static final double INF = Double.POSITIVE_INFINITY;

    private static MonitorSettings.Builder valid() {
        return MonitorSettings.builder().samplePeriodSeconds(0.1).timeScaleSeconds(4.0).acceptableAmplitude(0.1)
                .outputRange(0.0, 100.0);
    }

    private static Arguments row(String message, Supplier<?> build) {
        return Arguments.of(message, build);
    }

    static Stream<Arguments> invalidValues() {
        return Stream.of(
                row("samplePeriodSeconds must be finite and > 0: samplePeriodSeconds=NaN",
                        () -> MonitorSettings.builder().timeScaleSeconds(4.0).acceptableAmplitude(0.1).build()),
                row("samplePeriodSeconds must be finite and > 0: samplePeriodSeconds=-0.1",
                        () -> valid().samplePeriodSeconds(-0.1).build()),
                row("timeScaleSeconds must be finite and > 0: timeScaleSeconds=Infinity",
                        () -> valid().timeScaleSeconds(INF).build()),
                row("timeScaleSeconds must be >= 2 sample periods (0.2): timeScaleSeconds=0.15",
                        () -> valid().timeScaleSeconds(0.15).build()),
                row("acceptableAmplitude must be finite and > 0: acceptableAmplitude=0.0",
                        () -> valid().acceptableAmplitude(0.0).build()),
                row("supervisionTimeSeconds must be finite and >= samplePeriodSeconds (0.1): supervisionTimeSeconds=0.05",
                        () -> valid().supervisionTimeSeconds(0.05).build()),
                row("oscillationAlarmEvents must be finite and > 0: oscillationAlarmEvents=NaN",
                        () -> valid().oscillationEvents(5.0, NAN).build()),
                row("oscillationWarnEvents must be > 0 and <= oscillationAlarmEvents (10.0): oscillationWarnEvents=12.0",
                        () -> valid().oscillationEvents(12.0, 10.0).build()),
                row("idleIndexAlarm must be > -1 and < 1: idleIndexAlarm=1.0", () -> valid().idleIndex(0.2, 1.0).build()),
                row("idleIndexWarn must be > -1 and <= idleIndexAlarm (0.4): idleIndexWarn=0.5",
                        () -> valid().idleIndex(0.5, 0.4).build()),
                row("outputMin must be finite or -Infinity: outputMin=NaN", () -> valid().outputRange(NAN, 1.0).build()),
                row("outputMax must be > outputMin (5.0) and finite or +Infinity: outputMax=5.0",
                        () -> valid().outputRange(5.0, 5.0).build()),
                row("saturationWindowSeconds must be finite and >= samplePeriodSeconds (0.1): saturationWindowSeconds=-1.0",
                        () -> valid().saturationWindowSeconds(-1.0).build()),
                row("saturationAlarmShare must be > 0 and <= 1: saturationAlarmShare=1.5",
                        () -> valid().saturationShares(0.1, 1.5).build()),
                row("saturationWarnShare must be > 0 and <= saturationAlarmShare (0.5): saturationWarnShare=0.6",
                        () -> valid().saturationShares(0.6, 0.5).build()),
                row("frozenSamples must be >= 2 (or 0 for the default): frozenSamples=1",
                        () -> valid().frozenSamples(1).build()),
                row("quantisationStep must be finite and >= 0: quantisationStep=-0.01",
                        () -> valid().quantisationStep(-0.01).build()),
                row("frozenOutputMove must be given when the output range is not finite: outputMin=0.0, outputMax=Infinity:"
                        + " frozenOutputMove=NaN", () -> valid().outputRange(0.0, INF).build()),
                row("frozenOutputMove must be finite and > 0: frozenOutputMove=0.0", () -> valid().frozenOutputMove(0.0).build()),
                row("noiseAlarm must be finite and > 0: noiseAlarm=-1.0", () -> valid().noiseLevels(0.01, -1.0).build()),
                row("noiseWarn must be > 0 and <= noiseAlarm (0.1): noiseWarn=0.2", () -> valid().noiseLevels(0.2, 0.1).build()));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("invalidValues")
    void rejectsWithTheMessageOfTheTable(String message, Supplier<?> build) {
        assertThatThrownBy(build::get).isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }

    @Test
    void eachLimitItselfIsAcceptedAndEveryValueKept() {
        // the edges each rule allows: a time scale of exactly two periods, a supervision time of one,
        // warn equal to alarm, an idle alarm just under 1 and a warn just above −1, shares of 1,
        // two frozen samples, a zero quantisation step
        MonitorSettings s = MonitorSettings.builder().samplePeriodSeconds(0.5).timeScaleSeconds(1.0)
                .acceptableAmplitude(0.25).outputRange(-50.0, 50.0).supervisionTimeSeconds(0.5)
                .oscillationEvents(3.0, 3.0).idleIndex(Math.nextUp(-1.0), Math.nextDown(1.0)).saturationShares(1.0, 1.0)
                .frozenSamples(2).quantisationStep(0.0).build();
        assertThat(s.samplePeriodSeconds()).isEqualTo(0.5);
        assertThat(s.timeScaleSeconds()).isEqualTo(1.0);
        assertThat(s.acceptableAmplitude()).isEqualTo(0.25);
        assertThat(s.outputMin()).isEqualTo(-50.0);
        assertThat(s.outputMax()).isEqualTo(50.0);
        assertThat(s.supervisionTimeSeconds()).isEqualTo(0.5);
        assertThat(s.oscillationWarnEvents()).isEqualTo(3.0);
        assertThat(s.oscillationAlarmEvents()).isEqualTo(3.0);
        assertThat(s.idleIndexWarn()).isEqualTo(Math.nextUp(-1.0));
        assertThat(s.idleIndexAlarm()).isEqualTo(Math.nextDown(1.0));
        assertThat(s.saturationWarnShare()).isEqualTo(1.0);
        assertThat(s.saturationAlarmShare()).isEqualTo(1.0);
        assertThat(s.frozenSamples()).isEqualTo(2);
        assertThat(s.quantisationStep()).isZero();
        // the default move is 1 % of the span, 100 here
        assertThat(s.frozenOutputMove()).isEqualTo(1.0);
        assertThat(valid().idleIndex(0.3, 0.3).build().idleIndexWarn()).isEqualTo(0.3);
        assertThatThrownBy(() -> valid().idleIndex(-1.0, -1.0).build()).isInstanceOf(InvalidSettingException.class)
                .hasMessage("idleIndexAlarm must be > -1 and < 1: idleIndexAlarm=-1.0");
        assertThatThrownBy(() -> valid().idleIndex(-1.0, 0.4).build()).isInstanceOf(InvalidSettingException.class)
                .hasMessage("idleIndexWarn must be > -1 and <= idleIndexAlarm (0.4): idleIndexWarn=-1.0");
        assertThatThrownBy(() -> valid().saturationShares(0.0, 0.5).build()).isInstanceOf(InvalidSettingException.class)
                .hasMessage("saturationWarnShare must be > 0 and <= 1: saturationWarnShare=0.0");
    }

    @Test
    void defaultsFollowTheDocumentedRules() {
        MonitorSettings s = valid().build();
        // Hägglund 1995 (from memory): Tsup = 50 T, IAE limit 2a/ω = a·T/π, 10 disturbances mean oscillation
        assertThat(s.supervisionTimeSeconds()).isEqualTo(200.0);
        assertThat(s.iaeLimit()).isEqualTo(0.1 * 4.0 / Math.PI);
        assertThat(s.oscillationAlarmEvents()).isEqualTo(10.0);
        assertThat(s.idleIndexAlarm()).isEqualTo(0.4);
        assertThat(s.frozenSamples()).isEqualTo(40);
        assertThat(s.frozenOutputMove()).isEqualTo(1.0);
        assertThat(s.noiseAlarm()).isEqualTo(0.1);
        assertThat(s.noiseWarn()).isEqualTo(0.05);
        assertThat(s.saturationWindowSeconds()).isEqualTo(200.0);
        assertThat(valid().samplePeriodSeconds(1.0).build().frozenSamples()).isEqualTo(10);
    }
}
