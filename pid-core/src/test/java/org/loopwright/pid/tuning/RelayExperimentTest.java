package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.function.UnaryOperator;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.Action;
import org.loopwright.pid.InvalidSettingException;

class RelayExperimentTest {

    static final double H = 0.002;
    /** Ultimate gain of 1/(s+1)³: |G(j√3)| = 1/(1 + 3)^(3/2) = 1/8 at the phase crossover ω = √3 (analytic). */
    private static final double KU = 8.0;
    /** Ultimate period 2π/√3 from the same analytic phase crossover. */
    private static final double PU = 2.0 * Math.PI / Math.sqrt(3.0);

    static RelaySettings.Builder thirdOrderLagSettings() {
        return RelaySettings.builder().setpoint(0.0).bias(0.0).relayAmplitude(1.0).hysteresis(0.0)
                .excursionLimit(1.0).timeoutSeconds(200.0).maxHalfPeriodSeconds(20.0);
    }

    /** Runs the experiment on g/(s+1)³ at H until it finishes; returns the last output. */
    private static double run(RelayExperiment relay, double plantGain) {
        ThirdOrderLag plant = new ThirdOrderLag(plantGain, H);
        double output = relay.step(H, plant.output());
        for (int i = 0; i < 100_000 && !relay.status().finished(); i++) {
            plant.step(output);
            output = relay.step(H, plant.output());
        }
        return output;
    }

    @Test
    void findsTheUltimatePointOfAThirdOrderLag() throws IOException {
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().build(), 0.25);

        double last = run(relay, 1.0);

        assertThat(relay.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(last).isEqualTo(0.25);
        // analytic ultimate point; Åström & Hägglund (1984): the relay oscillates near the phase
        // crossover and the describing function estimates Ku to within a few per cent for such
        // low-pass plants (from memory); we allow 5 % on both.
        assertThat(relay.ultimatePeriodSeconds()).isCloseTo(PU, within(0.05 * PU));
        assertThat(relay.ultimateGain()).isCloseTo(KU, within(0.05 * KU));
        // the exact limit cycle (relay_third_order_lag.py, SciPy, 1e-5 s steps): period 3.6798 s,
        // a = 0.16306; the sampled experiment must measure it within 1 %, so the only error left
        // is the describing function's own (Ku = 4/(π·0.16306) = 7.808, −2.4 %).
        double[] exact = exactLimitCycle();
        assertThat(relay.ultimatePeriodSeconds()).isCloseTo(exact[0], within(0.01 * exact[0]));
        assertThat(relay.oscillationAmplitude()).isCloseTo(exact[1], within(0.01 * exact[1]));
        assertThat(relay.ultimatePoint()).isEqualTo(new UltimatePoint(relay.ultimateGain(),
                relay.ultimatePeriodSeconds()));
        assertThat(relay.message()).startsWith("limit cycle measured over 3 cycles: period=3.6");
    }

    @Test
    void hysteresisMovesThePointAsTheDescribingFunctionPredicts() {
        // Describing function of a relay with hysteresis (Åström & Hägglund 1984, from memory):
        // the loop oscillates where G(jω) = −(π/4d)·(√(a² − ε²) + j·ε), so the relay finds the
        // frequency ω* with Im G(jω*) = −π·ε/(4d), and 4d/(π·√(a² − ε²)) = −1/Re G(jω*).
        // For G = 1/(1 + jω)³ = ((1 − 3ω²) + j(ω³ − 3ω))/(1 + ω²)³ (analytic), ω* by bisection.
        double d = 1.0;
        double epsilon = 0.02;
        double target = -Math.PI * epsilon / (4.0 * d);
        double lo = 1.0;
        double hi = Math.sqrt(3.0);
        for (int i = 0; i < 100; i++) {
            double mid = 0.5 * (lo + hi);
            if (imaginaryPart(mid) < target) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        double omega = 0.5 * (lo + hi);
        double predictedGain = -Math.pow(1.0 + omega * omega, 3) / (1.0 - 3.0 * omega * omega);
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().hysteresis(epsilon).build(), 0.0);

        run(relay, 1.0);

        assertThat(relay.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(relay.ultimatePeriodSeconds()).isCloseTo(2.0 * Math.PI / omega, within(0.05 * 2.0 * Math.PI / omega));
        assertThat(relay.ultimateGain()).isCloseTo(predictedGain, within(0.05 * predictedGain));
        assertThat(predictedGain).isLessThan(KU);
    }

    @Test
    void ultimateGainUsesTheHysteresisTermOfTheDescribingFunction() {
        // Ku = 4d/(π·√(a² − ε²)) for a relay of amplitude d and hysteresis ε (the describing function of
        // a relay with hysteresis; Åström & Hägglund 2006, §6.2): with the measured amplitude a, the
        // estimate must satisfy it exactly, and differ from the hysteresis-free 4d/(π·a)
        double epsilon = 0.05;
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().hysteresis(epsilon).build(), 0.0);
        run(relay, 1.0);
        assertThat(relay.status()).isEqualTo(RelayStatus.SUCCEEDED);
        double a = relay.oscillationAmplitude();
        assertThat(relay.ultimateGain())
                .isCloseTo(4.0 * 1.0 / (Math.PI * Math.sqrt(a * a - epsilon * epsilon)), within(1e-12));
        assertThat(relay.ultimateGain()).isGreaterThan(4.0 / (Math.PI * a) * (1.0 + 1e-4));
    }

    private static double imaginaryPart(double omega) {
        return (omega * omega * omega - 3.0 * omega) / Math.pow(1.0 + omega * omega, 3);
    }

    @Test
    void directActingProcessNeedsDirectAction() {
        // −1/(s+1)³ (a cooler): same ultimate point with the relay's action reversed
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().action(Action.DIRECT).build(), 0.0);

        run(relay, -1.0);

        assertThat(relay.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(relay.ultimateGain()).isCloseTo(KU, within(0.05 * KU));
    }

    @Test
    void abortsOnExcursionAndRestoresThePreviousOutput() {
        // the cycle's amplitude is about 0.163·d = 0.163: a band of 0.1 is left in the first swing
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().excursionLimit(0.1).build(), 0.37);

        double last = run(relay, 1.0);

        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_EXCURSION);
        assertThat(last).isEqualTo(0.37);
        assertThat(relay.step(H, 0.0)).isEqualTo(0.37);
        assertThat(relay.message()).matches("aborted: the process variable left the band setpoint \\+/- "
                + "excursionLimit: measurement=-?0\\.100\\d, setpoint=0\\.000, excursionLimit=0\\.1000");
        assertThatThrownBy(relay::ultimatePoint).isInstanceOf(IllegalStateException.class)
                .hasMessageStartingWith("no ultimate point: aborted: the process variable left the band");
    }

    @Test
    void abortsOnTimeoutBeforeEnoughCycles() {
        // the cycle grows from rest through short cycles (at 0.09, 0.58, 2.38, 5.55 s) before it
        // settles near 3.68 s: 8 s is too short for three agreeing cycles after two settling ones
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().timeoutSeconds(8.0)
                .maxHalfPeriodSeconds(8.0).build(), 0.5);

        double last = run(relay, 1.0);

        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_TIMEOUT);
        assertThat(last).isEqualTo(0.5);
        assertThat(relay.message()).isEqualTo("aborted: no stable limit cycle within timeoutSeconds=8.000 (4 cycles completed)");
    }

    @Test
    void abortsWhenTheRelayStopsSwitching() {
        // a process stuck above the setpoint (a sensor frozen at 0.5): the relay stays low
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().maxHalfPeriodSeconds(5.0).build(), 0.1);
        double output = 0.0;
        for (int i = 0; i < 10_000 && !relay.status().finished(); i++) {
            output = relay.step(H, 0.5);
        }

        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_NO_OSCILLATION);
        assertThat(output).isEqualTo(0.1);
        assertThat(relay.message()).isEqualTo("aborted: no oscillation, the relay did not switch for more than"
                + " maxHalfPeriodSeconds=5.000 (at 5.004 s)");
    }

    @Test
    void abortsOnAnInvalidSample() {
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().build(), 0.2);
        assertThat(relay.step(H, 0.0)).isEqualTo(1.0);

        assertThat(relay.step(H, Double.NaN)).isEqualTo(0.2);
        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_INVALID_SAMPLE);
        assertThat(relay.message()).isEqualTo("aborted: invalid sample, h must be finite and > 0 and the"
                + " measurement finite: h=0.002, measurement=NaN");
    }

    static Stream<Arguments> invalidSettings() {
        return Stream.of(
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.setpoint(Double.NaN),
                        "setpoint must be finite: setpoint=NaN"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.bias(Double.POSITIVE_INFINITY),
                        "bias must be finite: bias=Infinity"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.relayAmplitude(0.0),
                        "relayAmplitude must be finite and > 0: relayAmplitude=0.0"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.hysteresis(-0.1),
                        "hysteresis must be finite and >= 0: hysteresis=-0.1"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.excursionLimit(-1.0),
                        "excursionLimit must be finite and > 0: excursionLimit=-1.0"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.hysteresis(2.0),
                        "excursionLimit must be > hysteresis (2.0): excursionLimit=1.0"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.timeoutSeconds(Double.NaN),
                        "timeoutSeconds must be finite and > 0: timeoutSeconds=NaN"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.maxHalfPeriodSeconds(300.0),
                        "maxHalfPeriodSeconds must be <= timeoutSeconds (200.0): maxHalfPeriodSeconds=300.0"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.measuredCycles(1),
                        "measuredCycles must be >= 2: measuredCycles=1"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.settlingCycles(-1),
                        "settlingCycles must be >= 0: settlingCycles=-1"),
                Arguments.of((UnaryOperator<RelaySettings.Builder>) b -> b.cycleTolerance(1.0),
                        "cycleTolerance must be > 0 and < 1: cycleTolerance=1.0"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("invalidSettings")
    void invalidSettingIsRejectedWithFieldRuleAndValue(UnaryOperator<RelaySettings.Builder> change, String message) {
        assertThatThrownBy(() -> change.apply(thirdOrderLagSettings()).build())
                .isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }



    /**
     * Feeds the relay a measurement whose error is a train of triangle cycles (analytic: linear
     * between its corners), cycle n of period periods[n] and amplitude amplitudes[n]; each cycle
     * starts at e = 0 rising, peaks at a quarter of its period and bottoms at three quarters.
     * Stops when the relay finishes or the cycles run out.
     */
    static void feedTriangles(RelayExperiment relay, double h, double[] periods, double[] amplitudes) {
        double start = 0.0;
        int cycle = 0;
        for (long k = 0; cycle < periods.length && !relay.status().finished(); k++) {
            double t = k * h;
            while (cycle < periods.length && t >= start + periods[cycle]) {
                start += periods[cycle];
                cycle++;
            }
            if (cycle == periods.length) {
                return;
            }
            double phase = (t - start) / periods[cycle];
            double a = amplitudes[cycle];
            double error = phase < 0.25 ? 4.0 * a * phase : phase < 0.75 ? 2.0 * a - 4.0 * a * phase : 4.0 * a * phase - 4.0 * a;
            // setpoint 0, reverse action: e = r − y
            relay.step(h, -error);
        }
    }

    static double[] repeated(double value, int count) {
        double[] values = new double[count];
        java.util.Arrays.fill(values, value);
        return values;
    }

    @Test
    void switchingTimesAreInterpolatedBetweenSamples() {
        // Triangle cycles of period P = 1 + 0.37·h: the crossings of +ε fall at a different place
        // between samples in every cycle. On a linear segment the linear interpolation of the
        // crossing time is exact (analytic), so the measured period is P to rounding; without it each
        // switch would be late by up to h and the mean of three periods off by up to h/3.
        double h = 0.002;
        double period = 1.0 + 0.37 * h;
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().hysteresis(0.1).excursionLimit(2.0)
                .build(), 0.0);
        feedTriangles(relay, h, repeated(period, 20), repeated(1.0, 20));
        assertThat(relay.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(relay.ultimatePeriodSeconds()).isCloseTo(period, within(1e-9));
        // the sampled peaks miss the corners by at most the slope times h/2: 4·h/(2·P) = 0.4 %
        assertThat(relay.oscillationAmplitude()).isCloseTo(1.0, within(0.004));
    }

    @Test
    void theNoOscillationTimeoutCountsFromTheInterpolatedSwitch() {
        // e = 0.1, 0, −0.1 at t = 0.1, 0.2, 0.3 s, then −0.1 held, sampled every 0.01 s: it crosses
        // −ε = −0.05 at t = 0.25 s (linear interpolation, exact on this line). With
        // maxHalfPeriodSeconds = 1.005 the relay gives up at the first sample after 1.255 s: 1.26 s
        // (from the sample before the crossing it would be 1.21 s, from the one after it 1.31 s).
        RelayExperiment relay = new RelayExperiment(thirdOrderLagSettings().hysteresis(0.05)
                .maxHalfPeriodSeconds(1.005).build(), 0.0);
        relay.step(0.1, -0.1);
        relay.step(0.1, 0.0);
        relay.step(0.1, 0.1);
        while (!relay.status().finished()) {
            relay.step(0.01, 0.1);
        }
        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_NO_OSCILLATION);
        assertThat(relay.elapsedSeconds()).isCloseTo(1.26, within(1e-9));
    }

    @Test
    void cyclesAgreeWhenEachLiesWithinTheToleranceOfTheMeanBoundaryIncluded() {
        // h = 2⁻¹⁰ s and periods that are multiples of 4·h make every time and peak exact in binary:
        // periods 0.75 and 1.25 s alternate, mean 1 s, each 25 % from it; amplitude 1 throughout.
        // The rule (common practice for a relay test: accept a cycle train whose periods and
        // amplitudes all lie within a relative tolerance of their mean) accepts 25 % at a tolerance
        // of 25 % and refuses it at any tolerance below.
        double h = 1.0 / 1024.0;
        double[] periods = {1.0, 0.75, 1.25, 0.75, 1.25, 1.0, 1.0};
        RelaySettings.Builder settings = thirdOrderLagSettings().settlingCycles(0).measuredCycles(4).excursionLimit(2.0);

        RelayExperiment atTolerance = new RelayExperiment(settings.cycleTolerance(0.25).build(), 0.0);
        feedTriangles(atTolerance, h, periods, repeated(1.0, periods.length));
        assertThat(atTolerance.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(atTolerance.ultimatePeriodSeconds()).isEqualTo(1.0);
        assertThat(atTolerance.oscillationAmplitude()).isEqualTo(1.0);
        // ε = 0: Ku = 4d/(π·a)
        assertThat(atTolerance.ultimateGain()).isCloseTo(4.0 / Math.PI, within(1e-15));

        RelayExperiment belowTolerance = new RelayExperiment(settings.cycleTolerance(Math.nextDown(0.25)).build(), 0.0);
        feedTriangles(belowTolerance, h, periods, repeated(1.0, periods.length));
        assertThat(belowTolerance.status()).isEqualTo(RelayStatus.RUNNING);
        assertThat(belowTolerance.completedCycles()).isEqualTo(5);
    }

    @Test
    void amplitudesMustAgreeToo() {
        // equal periods of 1 s, amplitudes 0.75 and 1.25 alternating (mean 1, each 25 % from it)
        double h = 1.0 / 1024.0;
        double[] amplitudes = {1.0, 0.75, 1.25, 0.75, 1.25, 1.0, 1.0};
        RelaySettings.Builder settings = thirdOrderLagSettings().settlingCycles(0).measuredCycles(4).excursionLimit(2.0);

        RelayExperiment atTolerance = new RelayExperiment(settings.cycleTolerance(0.25).build(), 0.0);
        feedTriangles(atTolerance, h, repeated(1.0, amplitudes.length), amplitudes);
        assertThat(atTolerance.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(atTolerance.oscillationAmplitude()).isEqualTo(1.0);

        RelayExperiment belowTolerance = new RelayExperiment(settings.cycleTolerance(Math.nextDown(0.25)).build(), 0.0);
        feedTriangles(belowTolerance, h, repeated(1.0, amplitudes.length), amplitudes);
        assertThat(belowTolerance.status()).isEqualTo(RelayStatus.RUNNING);
    }

    @Test
    void settlingCyclesAreDiscardedBeforeTheMeasuredOnes() {
        // three short cycles (0.5 s, amplitude 0.5) then steady ones (1 s, amplitude 1): with the two
        // default settling cycles discarded, the result waits for three steady cycles in a row; with
        // none discarded, the three short ones agree and are taken
        double h = 1.0 / 1024.0;
        double[] periods = {1.0, 0.5, 0.5, 0.5, 1.0, 1.0, 1.0, 1.0};
        RelayExperiment discarding = new RelayExperiment(thirdOrderLagSettings().excursionLimit(2.0).build(), 0.0);
        feedTriangles(discarding, h, periods, periods);
        assertThat(discarding.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(discarding.completedCycles()).isEqualTo(6);
        assertThat(discarding.ultimatePeriodSeconds()).isEqualTo(1.0);
        assertThat(discarding.oscillationAmplitude()).isEqualTo(1.0);

        RelayExperiment keeping = new RelayExperiment(thirdOrderLagSettings().settlingCycles(0).excursionLimit(2.0)
                .build(), 0.0);
        feedTriangles(keeping, h, periods, periods);
        assertThat(keeping.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(keeping.completedCycles()).isEqualTo(3);
        assertThat(keeping.ultimatePeriodSeconds()).isEqualTo(0.5);
        assertThat(keeping.oscillationAmplitude()).isEqualTo(0.5);
    }

    private static double[] exactLimitCycle() throws IOException {
        try (InputStream in = RelayExperimentTest.class.getResourceAsStream("relay-third-order-lag.csv")) {
            String[] lines = new String(in.readAllBytes(), StandardCharsets.UTF_8).trim().split("\n");
            String[] cells = lines[1].split(",");
            return new double[] {Double.parseDouble(cells[0]), Double.parseDouble(cells[1])};
        }
    }
}
