package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;
import static org.loopwright.pid.tuning.RelayExperimentTest.feedTriangles;
import static org.loopwright.pid.tuning.RelayExperimentTest.repeated;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * Every limit of the relay experiment at its value and just past it, the relay amplitude in the
 * describing function, and the cycle count at which a steady train is accepted (issue 11: the
 * mutation run found these boundaries unpinned; the existing tests ran with d = 1, setpoint 0 and
 * mean period 1, where a product and a quotient, or a sum and a difference, agree). Sample periods
 * are powers of two so that every elapsed time is exact.
 */
class RelayLimitsTest {

    private static final double H = 0.25;

    private static RelaySettings.Builder settings() {
        return RelaySettings.builder().setpoint(3.0).bias(0.0).relayAmplitude(1.0).hysteresis(0.0)
                .excursionLimit(1.0).timeoutSeconds(100.0).maxHalfPeriodSeconds(50.0);
    }

    @Test
    void aSampleExactlyAtTheExcursionLimitIsStillInsideTheBand() {
        // the band is setpoint ± excursionLimit = 2..4, limits included; beyond it the experiment stops
        RelayExperiment relay = new RelayExperiment(settings().build(), 0.4);
        relay.step(H, 3.0);
        relay.step(H, 4.0);
        relay.step(H, 2.0);
        assertThat(relay.status()).isEqualTo(RelayStatus.RUNNING);
        assertThat(relay.step(H, Math.nextUp(4.0))).isEqualTo(0.4);
        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_EXCURSION);
    }

    @Test
    void theTimeoutAllowsExactlyTimeoutSeconds() {
        // four samples of 0.25 s reach 1 s, the timeout itself; the fifth passes it
        RelayExperiment relay = new RelayExperiment(settings().timeoutSeconds(1.0).maxHalfPeriodSeconds(1.0).build(), 0.4);
        for (int k = 0; k < 4; k++) {
            relay.step(H, 3.0);
        }
        assertThat(relay.status()).isEqualTo(RelayStatus.RUNNING);
        relay.step(H, 3.0);
        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_TIMEOUT);
    }

    @Test
    void theRelayMayHoldForExactlyMaxHalfPeriodSeconds() {
        // a measurement held at the setpoint never switches the relay: the last switch is the start
        // (0.25 s); at 0.75 s it has held 0.5 s, the limit itself; at 1 s it has held longer
        RelayExperiment relay = new RelayExperiment(settings().maxHalfPeriodSeconds(0.5).build(), 0.4);
        for (int k = 0; k < 3; k++) {
            relay.step(H, 3.0);
        }
        assertThat(relay.status()).isEqualTo(RelayStatus.RUNNING);
        relay.step(H, 3.0);
        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_NO_OSCILLATION);
    }

    @Test
    void aSampleOfZeroDurationIsInvalid() {
        // h must be > 0 (the class contract): no time has passed, so nothing can be measured
        RelayExperiment relay = new RelayExperiment(settings().build(), 0.4);
        relay.step(H, 3.0);
        assertThat(relay.step(0.0, 3.0)).isEqualTo(0.4);
        assertThat(relay.status()).isEqualTo(RelayStatus.ABORTED_INVALID_SAMPLE);
        assertThat(relay.previousOutput()).isEqualTo(0.4);
    }

    @Test
    void theRelaySwitchesOnlyWhenTheErrorPassesBeyondTheHysteresis() {
        // a relay with hysteresis ε (common practice): it stays where it is while the error is within
        // ±ε, the band's edges included, and switches once the error is beyond them. Reverse action,
        // setpoint 3, ε = 0.25: error = 3 − y; the output is bias ± d = ±1.
        RelayExperiment relay = new RelayExperiment(settings().hysteresis(0.25).build(), 0.0);
        assertThat(relay.step(H, 2.5)).as("error 0.5: starts high").isEqualTo(1.0);
        assertThat(relay.step(H, 3.25)).as("error −ε: holds").isEqualTo(1.0);
        assertThat(relay.step(H, 3.5)).as("error −0.5: switches low").isEqualTo(-1.0);
        assertThat(relay.step(H, 2.75)).as("error +ε: holds").isEqualTo(-1.0);
        assertThat(relay.step(H, 2.5)).as("error +0.5: switches high").isEqualTo(1.0);
    }

    @ParameterizedTest(name = "settling {0}, measured {1}")
    @CsvSource({"2, 3", "0, 2", "1, 4", "3, 2"})
    void aSteadyTrainIsAcceptedAtTheFirstCycleAfterTheSettlingAndMeasuredOnes(int settling, int measured) {
        // identical cycles agree at once: the result comes with cycle settling + measured, no sooner
        // (the class contract: the first settlingCycles are discarded, then measuredCycles must agree)
        RelayExperiment relay = new RelayExperiment(RelayExperimentTest.thirdOrderLagSettings().excursionLimit(2.0)
                .settlingCycles(settling).measuredCycles(measured).build(), 0.0);
        feedTriangles(relay, 1.0 / 1024.0, repeated(1.0, 12), repeated(1.0, 12));
        assertThat(relay.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(relay.completedCycles()).isEqualTo(settling + measured);
    }

    @Test
    void theUltimateGainScalesWithTheRelayAmplitude() {
        // Ku = 4d/(π·a) for ε = 0 (the describing function of an ideal relay; Åström & Hägglund 2006,
        // §6.2): d = 2 on triangle cycles of amplitude 1 (exact at h = 2⁻¹⁰) gives 8/π
        RelayExperiment relay = new RelayExperiment(RelayExperimentTest.thirdOrderLagSettings().relayAmplitude(2.0)
                .excursionLimit(2.0).build(), 0.0);
        feedTriangles(relay, 1.0 / 1024.0, repeated(1.0, 12), repeated(1.0, 12));
        assertThat(relay.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(relay.oscillationAmplitude()).isEqualTo(1.0);
        assertThat(relay.ultimateGain()).isCloseTo(8.0 / Math.PI, within(1e-14));
    }

    @Test
    void theCycleToleranceIsRelativeToTheMean() {
        // periods 1.5 and 2.5 s alternate around a mean of 2 s, each 0.5 s = 25 % from it: accepted at a
        // tolerance of 25 % (relative, the rule of RelayExperimentTest's boundary test), refused below it
        double h = 1.0 / 1024.0;
        double[] periods = {2.0, 1.5, 2.5, 1.5, 2.5, 2.0, 2.0};
        RelaySettings.Builder settings = RelayExperimentTest.thirdOrderLagSettings().settlingCycles(0).measuredCycles(4)
                .excursionLimit(2.0);
        RelayExperiment atTolerance = new RelayExperiment(settings.cycleTolerance(0.25).build(), 0.0);
        feedTriangles(atTolerance, h, periods, repeated(1.0, periods.length));
        assertThat(atTolerance.status()).isEqualTo(RelayStatus.SUCCEEDED);
        assertThat(atTolerance.ultimatePeriodSeconds()).isEqualTo(2.0);

        RelayExperiment belowTolerance = new RelayExperiment(settings.cycleTolerance(0.24).build(), 0.0);
        feedTriangles(belowTolerance, h, periods, repeated(1.0, periods.length));
        assertThat(belowTolerance.status()).isEqualTo(RelayStatus.RUNNING);
    }
}
