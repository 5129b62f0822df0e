package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.function.Consumer;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;

/**
 * Behaviours a mutation run found unpinned (issue 11): each has one small worked example, the
 * numbers worked out by hand from the control law of Åström &amp; Hägglund, <i>Advanced PID
 * Control</i> (2006), ch. 3.
 */
class PinnedBehaviourTest {

    private static ControllerSettings.Builder proportional(double kp) {
        return ControllerSettings.builder().gains(new ParallelGains(kp, 0.0, 0.0)).samplePeriodSeconds(0.1);
    }

    @Test
    void proportionalSetpointWeightBelowOneWeighsOnlyTheSetpoint() {
        // P = Kp·(b·r − y) = 2·(0.5·10 − 4) = 2
        PidController c = new PidController(proportional(2.0).setpointWeights(0.5, 0.0).build());
        assertThat(c.update(10.0, 4.0)).isEqualTo(2.0);
        // direct action flips the sign of the whole bracket: −2·(0.5·10 − 4) = −2
        PidController direct = new PidController(proportional(2.0).setpointWeights(0.5, 0.0).action(Action.DIRECT).build());
        assertThat(direct.update(10.0, 4.0)).isEqualTo(-2.0);
    }

    static Stream<Arguments> badSamples() {
        return Stream.of(
                Arguments.of((Consumer<PidController>) c -> c.update(Double.NaN, 0.0), Fault.SETPOINT_NOT_FINITE),
                Arguments.of((Consumer<PidController>) c -> c.update(Double.POSITIVE_INFINITY, Double.NaN),
                        Fault.SETPOINT_NOT_FINITE),
                Arguments.of((Consumer<PidController>) c -> c.update(1.0, Double.NEGATIVE_INFINITY),
                        Fault.MEASUREMENT_NOT_FINITE),
                Arguments.of((Consumer<PidController>) c -> c.update(1.0, 0.0, 0.0), Fault.PERIOD_NOT_VALID),
                Arguments.of((Consumer<PidController>) c -> c.update(1.0, 0.0, -0.1), Fault.PERIOD_NOT_VALID),
                Arguments.of((Consumer<PidController>) c -> c.update(1.0, 0.0, Double.POSITIVE_INFINITY),
                        Fault.PERIOD_NOT_VALID),
                Arguments.of((Consumer<PidController>) c -> c.update(Double.NaN, 0.0, -1.0), Fault.SETPOINT_NOT_FINITE),
                Arguments.of((Consumer<PidController>) c -> {
                    c.feedforward(Double.NaN);
                    c.feedforwardOn(true);
                    c.update(1.0, 0.0);
                }, Fault.FEEDFORWARD_NOT_FINITE),
                Arguments.of((Consumer<PidController>) c -> c.update(Double.MAX_VALUE, -Double.MAX_VALUE),
                        Fault.ARITHMETIC_OVERFLOW));
    }

    @ParameterizedTest
    @MethodSource("badSamples")
    void eachFaultIsReportedByItsName(Consumer<PidController> sample, Fault expected) {
        PidController c = new PidController(proportional(1.0).build());
        c.update(1.0, 0.0);
        sample.accept(c);
        assertThat(c.fault()).isEqualTo(expected);
        assertThat(c.faultCount()).isEqualTo(1);
        c.feedforwardOn(false);
        c.update(1.0, 0.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
    }

    @Test
    void setpointSlewInTheVariablePeriodUpdateUsesThatPeriod() {
        // 10 units/s over a measured 0.5 s (the configured period is 0.1 s): the setpoint moves 5, and P = 1·(5 − 0)
        PidController c = new PidController(proportional(1.0).setpointSlewPerSecond(10.0).build());
        c.update(0.0, 0.0, 0.1);
        assertThat(c.update(100.0, 0.0, 0.5)).isEqualTo(5.0);
        assertThat(c.update(100.0, 0.0, 0.25)).isEqualTo(7.5);
    }

    @Test
    void defaultTrackingTimeIsTheGeometricMeanOfTiAndTdWhateverTheGain() {
        // Tt = √(Ti·Td) = √(16·1) = 4 for a PID (Åström & Hägglund 2006, §3.5), not scaled by Kc = 2
        ControllerSettings pid = ControllerSettings.builder().gains(new IdealGains(2.0, 16.0, 1.0))
                .samplePeriodSeconds(0.1).build();
        assertThat(pid.trackingTimeSeconds()).isEqualTo(4.0);
        // for a PI, Tt = Ti
        assertThat(pid.toBuilder().gains(IdealGains.pi(2.0, 16.0)).build().trackingTimeSeconds()).isEqualTo(16.0);
    }

    @Test
    void toBuilderKeepsAnExplicitTrackingTime() {
        ControllerSettings s = ControllerSettings.builder().gains(new IdealGains(2.0, 16.0, 1.0))
                .samplePeriodSeconds(0.1).trackingTimeSeconds(7.0).build();
        assertThat(s.toBuilder().build().trackingTimeSeconds()).isEqualTo(7.0);
        assertThat(s.toBuilder().gains(new IdealGains(3.0, 25.0, 1.0)).build().trackingTimeSeconds()).isEqualTo(7.0);
    }

    @Test
    void retuneFromPdToPIsBumplessAtUnchangedInputs() {
        // no integral action in either: the output after the retune at the same inputs is the last one
        // exactly, the derivative folded into the bias, where a bound by the controller's own increment
        // would allow a step of |1 − ad|·|D|
        ControllerSettings pd = ControllerSettings.builder().gains(new IdealGains(2.0, Double.POSITIVE_INFINITY, 1.0))
                .samplePeriodSeconds(0.1).build();
        PidController c = new PidController(pd);
        c.update(1.0, 0.0);
        double last = c.update(1.0, 0.5);
        assertThat(c.derivativeTerm()).isNotZero();
        c.retune(pd.toBuilder().gains(new IdealGains(2.0, Double.POSITIVE_INFINITY, 0.0)).build());
        assertThat(c.update(1.0, 0.5)).isCloseTo(last, within(1e-12));
        assertThat(c.update(1.0, 0.5)).isCloseTo(last, within(1e-12));
    }

    @Test
    void overflowGuardHoldsInTrackingToo() {
        // tracking follows the tracked value whatever the law's terms; a finite sample that overflows them
        // neither faults nor leaves a term that is not finite
        PidController c = new PidController(ControllerSettings.builder().gains(new ParallelGains(1.0, 0.1, 0.5))
                .samplePeriodSeconds(0.1).build());
        c.update(0.0, 0.0);
        c.trackValue(3.0);
        c.switchToTracking();
        assertThat(c.update(Double.MAX_VALUE, -Double.MAX_VALUE)).isEqualTo(3.0);
        assertThat(c.fault()).isEqualTo(Fault.NONE);
        assertThat(StateSnapshot.parse(c.snapshot().toText())).isEqualTo(c.snapshot());
    }
}
