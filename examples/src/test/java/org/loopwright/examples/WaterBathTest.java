package org.loopwright.examples;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.stream.Stream;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.Fault;
import org.loopwright.pid.StateSnapshot;

class WaterBathTest {

    private static WaterBath.Outcome outcome;
    private static String printed;

    @BeforeAll
    static void runTheExample() {
        ByteArrayOutputStream text = new ByteArrayOutputStream();
        try (PrintStream out = new PrintStream(text, true, StandardCharsets.UTF_8)) {
            outcome = WaterBath.run(WaterBath.DEFAULT_DURATION_SECONDS, out);
        }
        printed = text.toString(StandardCharsets.UTF_8);
    }

    @Test
    void printsTheSafetyCautionFirst() {
        assertThat(printed).startsWith(SafetyNotice.TEXT);
    }

    @Test
    void manualStartUpFollowsTheBathsAnalyticHeatingCurve() {
        // C·dT/dt = P − G·(T − Ta) at constant P: T(t) = Ta + (P/G)·(1 − exp(−t·G/C)) (analytic solution)
        double watts = WaterBath.MANUAL_PERCENT / 100.0 * WaterBath.BATH.maxPowerWatts();
        double gain = watts / WaterBath.BATH.lossWattsPerKelvin();
        double timeConstant = WaterBath.BATH.heatCapacityJoulesPerKelvin() / WaterBath.BATH.lossWattsPerKelvin();
        double[] time = outcome.timeSeconds();
        double[] bath = outcome.bathCelsius();
        for (int k = 0; time[k] < outcome.switchSeconds(); k++) {
            double analytic = WaterBath.BATH.ambientCelsius() + gain * (1.0 - Math.exp(-time[k] / timeConstant));
            assertThat(bath[k]).as("bath at %s s", time[k]).isCloseTo(analytic, within(1e-6));
        }
    }

    @Test
    void switchToAutomaticIsBumpless() {
        assertThat(outcome.switchSeconds()).isBetween(600.0, 800.0);
        assertThat(outcome.lastManualPercent()).isEqualTo(WaterBath.MANUAL_PERCENT);
        assertThat(outcome.firstAutomaticPercent()).isCloseTo(outcome.lastManualPercent(), within(1e-9));
    }

    @Test
    void bathSettlesWithinBandAndHoldsIt() {
        double[] time = outcome.timeSeconds();
        double[] bath = outcome.bathCelsius();
        for (int k = 0; k < time.length; k++) {
            if (time[k] >= 1300.0) {
                assertThat(bath[k]).as("bath at %s s", time[k]).isCloseTo(WaterBath.SETPOINT_CELSIUS, within(0.3));
            }
        }
        assertThat(bath[bath.length - 1]).isCloseTo(WaterBath.SETPOINT_CELSIUS, within(0.1));
    }

    @Test
    void settledHeaterPowerMatchesTheEnergyBalance() {
        // at steady state C·dT/dt = 0, so P = G·(T − Ta): 4 W/K · 40 K = 160 W = 16 % (energy balance)
        double[] time = outcome.timeSeconds();
        double[] heater = outcome.heaterPercent();
        double sum = 0.0;
        int count = 0;
        for (int k = 0; k < time.length; k++) {
            if (time[k] >= 2500.0) {
                sum += heater[k];
                count++;
            }
        }
        assertThat(WaterBath.steadyHeaterPercent()).isCloseTo(16.0, within(1e-12));
        assertThat(sum / count).isCloseTo(WaterBath.steadyHeaterPercent(), within(0.3));
    }

    @Test
    void probeFailureHoldsTheHeaterAndIsCounted() {
        assertThat(outcome.dropoutFault()).isEqualTo(Fault.MEASUREMENT_NOT_FINITE);
        assertThat(outcome.heldPercent()).isBetween(10.0, 25.0);
        assertThat(outcome.maxDropoutDeviationPercent()).isZero();
        assertThat(outcome.faultCount()).isEqualTo(WaterBath.DROPOUT_SAMPLES);
        assertThat(printed).contains("MEASUREMENT_NOT_FINITE", "the probe is back: fault NONE, fault count 5");
    }

    @Test
    void warmRestartResumesWithoutABump() {
        assertThat(outcome.afterRestartPercent()).isCloseTo(outcome.beforeRestartPercent(), within(1e-9));
        // without the snapshot the integral is lost and the heater drops to about Kc·e
        assertThat(Math.abs(outcome.coldStartPercent() - outcome.beforeRestartPercent())).isGreaterThan(5.0);
        String text = outcome.snapshotText();
        assertThat(StateSnapshot.parse(text).toText()).isEqualTo(text);
        assertThat(text.lines()).contains("fault-count=" + WaterBath.DROPOUT_SAMPLES,
                "previous-output=" + outcome.beforeRestartPercent());
    }

    @Test
    void shortRunStaysInManualAndSkipsLaterEvents() {
        WaterBath.Outcome shortRun = WaterBath.run(300.0, new PrintStream(PrintStream.nullOutputStream()));
        assertThat(shortRun.timeSeconds()).hasSize(301);
        assertThat(shortRun.heaterPercent()).containsOnly(WaterBath.MANUAL_PERCENT);
        assertThat(shortRun.switchSeconds()).isNaN();
        assertThat(shortRun.snapshotText()).isNull();
    }

    static Stream<Arguments> badDurations() {
        return Stream.of(
                Arguments.of(0.0, "duration must be finite and > 0: duration=0.0"),
                Arguments.of(-5.0, "duration must be finite and > 0: duration=-5.0"),
                Arguments.of(Double.NaN, "duration must be finite and > 0: duration=NaN"),
                Arguments.of(Double.POSITIVE_INFINITY, "duration must be finite and > 0: duration=Infinity"));
    }

    @ParameterizedTest
    @MethodSource("badDurations")
    void rejectsABadDuration(double duration, String message) {
        assertThatThrownBy(() -> WaterBath.run(duration, new PrintStream(PrintStream.nullOutputStream())))
                .isInstanceOf(IllegalArgumentException.class).hasMessage(message);
    }
}
