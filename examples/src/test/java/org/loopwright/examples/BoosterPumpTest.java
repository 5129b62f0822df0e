package org.loopwright.examples;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.stream.Stream;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

class BoosterPumpTest {

    private static BoosterPump.Outcome outcome;
    private static String printed;

    @BeforeAll
    static void runTheExample() {
        ByteArrayOutputStream text = new ByteArrayOutputStream();
        try (PrintStream out = new PrintStream(text, true, StandardCharsets.UTF_8)) {
            outcome = BoosterPump.run(BoosterPump.DEFAULT_DURATION_SECONDS, out);
        }
        printed = text.toString(StandardCharsets.UTF_8);
    }

    @Test
    void printsTheSafetyCautionFirst() {
        assertThat(printed).startsWith(SafetyNotice.TEXT);
    }

    @Test
    void feedbackOnlyLoopIsTheHarnessLoop() {
        // the example steps its own loop (the harness has no feedforward input); without feedforward it
        // must reproduce the harness's closed loop sample for sample
        Trajectory harness = Simulation.run(BoosterPump.scenarioWithoutFeedforward(BoosterPump.DEFAULT_DURATION_SECONDS));
        double[] pressure = outcome.feedbackOnly().pressureBar();
        double[] drive = outcome.feedbackOnly().drivePercent();
        assertThat(pressure).hasSize(harness.length());
        for (int k = 0; k < pressure.length; k++) {
            assertThat(pressure[k]).as("pressure at sample %d", k).isCloseTo(harness.process(k), within(1e-12));
            assertThat(drive[k]).as("drive at sample %d", k).isCloseTo(harness.output(k), within(1e-10));
        }
        assertThat(outcome.feedbackOnly().iaeBarSeconds()).isCloseTo(outcome.harnessIaeBarSeconds(), within(1e-9));
        assertThat(printed).contains(String.format(Locale.ROOT, "measures IAE %.4f bar·s",
                outcome.harnessIaeBarSeconds()));
    }

    @Test
    void pressureRecoversAfterEachDemandStep() {
        for (BoosterPump.Response r : new BoosterPump.Response[] {outcome.feedbackOnly(), outcome.withFeedforward()}) {
            assertThat(r.recoverySeconds()).hasSize(2);
            for (double seconds : r.recoverySeconds()) {
                assertThat(seconds).isBetween(0.0, 10.0);
            }
            double[] pressure = r.pressureBar();
            assertThat(pressure[pressure.length - 1]).isCloseTo(BoosterPump.SETPOINT_BAR, within(1e-3));
        }
    }

    @Test
    void feedforwardCutsTheErrorAfterDemandSteps() {
        BoosterPump.Response without = outcome.feedbackOnly();
        BoosterPump.Response with = outcome.withFeedforward();
        assertThat(with.iaeBarSeconds()).isLessThan(0.25 * without.iaeBarSeconds());
        assertThat(with.peakDeviationBar()).isLessThan(0.5 * without.peakDeviationBar());
        for (int i = 0; i < 2; i++) {
            assertThat(with.recoverySeconds()[i]).isLessThan(without.recoverySeconds()[i]);
        }
    }

    @Test
    void settledDriveMatchesThePumpsStaticGain() {
        // with integral action the error goes to 0, so u = r/K + 0.8·q at steady state (static gain of
        // the linear model, analytic): 4/0.06 + 0.8·q % before each demand step and at the end
        double gain = BoosterPump.PUMP.staticGain();
        assertThat(gain).isCloseTo(0.06, within(1e-15));
        for (BoosterPump.Response r : new BoosterPump.Response[] {outcome.feedbackOnly(), outcome.withFeedforward()}) {
            double[] time = r.timeSeconds();
            double[] drive = r.drivePercent();
            double[] demand = r.demandCubicMetresPerHour();
            for (double at : new double[] {30.0, 60.0, 90.0}) {
                int k = (int) Math.round(at / BoosterPump.SAMPLE_PERIOD_SECONDS);
                assertThat(time[k]).isCloseTo(at, within(1e-9));
                double expected = BoosterPump.SETPOINT_BAR / gain + BoosterPump.DRIVE_PERCENT_PER_FLOW * demand[k];
                assertThat(drive[k]).as("drive at %s s", at).isCloseTo(expected, within(0.01));
            }
        }
    }

    @Test
    void driveNeverRampsFasterThanItsSlewLimit() {
        double maxStep = BoosterPump.DRIVE_SLEW_PERCENT_PER_SECOND * BoosterPump.SAMPLE_PERIOD_SECONDS;
        for (BoosterPump.Response r : new BoosterPump.Response[] {outcome.feedbackOnly(), outcome.withFeedforward()}) {
            double[] drive = r.drivePercent();
            for (int k = 1; k < drive.length; k++) {
                assertThat(Math.abs(drive[k] - drive[k - 1])).as("drive step at sample %d", k)
                        .isLessThanOrEqualTo(maxStep + 1e-9);
            }
        }
        // the feedforward asks for 0.8 %/(m³/h) · 20 m³/h = 16 % at once: the drive ramps at the limit
        double[] drive = outcome.withFeedforward().drivePercent();
        int step = (int) Math.ceil(BoosterPump.DEMAND_AT_SECONDS[1] / BoosterPump.SAMPLE_PERIOD_SECONDS);
        for (int k = step; k < step + 6; k++) {
            assertThat(drive[k] - drive[k - 1]).as("drive step at sample %d", k).isCloseTo(maxStep, within(1e-9));
        }
    }

    @Test
    void shorterRunJudgesOnlyTheStepsItContains() {
        BoosterPump.Outcome shortRun = BoosterPump.run(45.0, new PrintStream(PrintStream.nullOutputStream()));
        assertThat(shortRun.feedbackOnly().timeSeconds()).hasSize(451);
        assertThat(shortRun.feedbackOnly().recoverySeconds()).hasSize(1);
        assertThat(shortRun.withFeedforward().recoverySeconds()).hasSize(1);
        assertThat(shortRun.feedbackOnly().iaeBarSeconds()).isCloseTo(shortRun.harnessIaeBarSeconds(), within(1e-9));
    }

    static Stream<Arguments> badDurations() {
        return Stream.of(
                Arguments.of(30.0, "duration must be finite and > 30.05 (the first demand step): duration=30.0"),
                Arguments.of(-1.0, "duration must be finite and > 30.05 (the first demand step): duration=-1.0"),
                Arguments.of(Double.NaN, "duration must be finite and > 30.05 (the first demand step): duration=NaN"),
                Arguments.of(Double.POSITIVE_INFINITY,
                        "duration must be finite and > 30.05 (the first demand step): duration=Infinity"));
    }

    @ParameterizedTest
    @MethodSource("badDurations")
    void rejectsABadDuration(double duration, String message) {
        assertThatThrownBy(() -> BoosterPump.run(duration, new PrintStream(PrintStream.nullOutputStream())))
                .isInstanceOf(IllegalArgumentException.class).hasMessage(message);
    }
}
