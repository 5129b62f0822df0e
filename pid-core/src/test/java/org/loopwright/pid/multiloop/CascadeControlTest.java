package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;

/**
 * What the cascade does while it is in control, what the operator's modes leave behind, and
 * {@code reset()} (issue 11: the mutation run found the outer law, the hand-back of the outer
 * mode and reset unpinned). The loops are the ones of {@link CascadeTest}: inner plant 1/(s + 1)
 * under PI (4, 1 s) every 10 ms, outer plant 1/(10·s + 1) under PI (1, 10 s) every 50 ms.
 */
class CascadeControlTest {

    private static final double INNER_PERIOD = 0.01;
    private static final int RATIO = 5;

    private static PidController inner() {
        // a range the step response never reaches, so the loops stay linear
        return new PidController(ControllerSettings.builder().gains(IdealGains.pi(4.0, 1.0))
                .samplePeriodSeconds(INNER_PERIOD).outputRange(-100.0, 100.0).build());
    }

    private static PidController outer() {
        return new PidController(ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0))
                .samplePeriodSeconds(RATIO * INNER_PERIOD).outputRange(-5.0, 5.0)
                .windupProtection(WindupProtection.ACTUATOR_TRACKING).build());
    }

    @Test
    void theOuterMeasurementFollowsTheAnalyticResponseOfTheTwoLoops() {
        // Analytic: PI with Ti = T cancels each plant's pole (Åström & Murray 2021, ch. 11), so the
        // inner loop closes to 1/(0.25·s + 1), the outer open loop is 1/(10·s)·1/(0.25·s + 1), and
        // the outer loop closes to 1/(2.5·s² + 10·s + 1), poles p1,2 = (−10 ± √90)/5. Its unit-step
        // response is y(t) = 1 + (p2·e^(p1·t) − p1·e^(p2·t))/(p1 − p2) (partial fractions).
        Cascade c = new Cascade(outer(), inner());
        FirstOrderLag innerPlant = new FirstOrderLag(1.0, 1.0, INNER_PERIOD);
        FirstOrderLag outerPlant = new FirstOrderLag(1.0, 10.0, INNER_PERIOD);
        double p1 = (-10.0 + Math.sqrt(90.0)) / 5.0;
        double p2 = (-10.0 - Math.sqrt(90.0)) / 5.0;
        for (int k = 0; k <= 6_000; k++) {
            double t = k * INNER_PERIOD;
            double y1 = outerPlant.output();
            double y2 = innerPlant.output();
            double analytic = 1.0 + (p2 * Math.exp(p1 * t) - p1 * Math.exp(p2 * t)) / (p1 - p2);
            // sampling (10 ms inner, 50 ms outer) delays the response by a few tens of milliseconds
            // on a 10 s time constant: 0.005 covers it
            assertThat(y1).as("outer measurement at %.2f s", t).isCloseTo(analytic, within(0.005));
            innerPlant.step(c.update(1.0, y1, y2));
            outerPlant.step(y2);
        }
        assertThat(c.outerTracking()).isFalse();
        assertThat(c.outer().mode()).isEqualTo(Mode.AUTOMATIC);
    }

    @Test
    void aLocalSpellHandsTheOuterControllerBackInAutomatic() {
        PidController outer = outer();
        Cascade c = new Cascade(outer, inner());
        runOuterSamples(c, 2);
        c.switchToLocal();
        runOuterSamples(c, 2);
        assertThat(c.outerTracking()).isTrue();
        assertThat(outer.mode()).isEqualTo(Mode.TRACKING);
        c.switchToCascade();
        runOuterSamples(c, 2);
        // common practice: tracking is an override of the outer controller, not a change of the
        // operator's choice of mode; once the cause has gone the outer controller is as it was
        assertThat(c.outerTracking()).isFalse();
        assertThat(outer.mode()).isEqualTo(Mode.AUTOMATIC);
    }

    @Test
    void anOuterControllerInManualSetsTheInnerSetpointAndIsInManualAgainAfterALocalSpell() {
        PidController outer = outer();
        Cascade c = new Cascade(outer, inner());
        outer.switchToManual();
        outer.manualOutput(0.7);
        runOuterSamples(c, 2);
        // the outer output is the inner setpoint (the definition of a cascade), here the operator's
        assertThat(c.innerSetpoint()).isEqualTo(0.7);
        c.switchToLocal();
        runOuterSamples(c, 2);
        c.switchToCascade();
        runOuterSamples(c, 2);
        // common practice, as above: the operator's manual survives the tracking spell
        assertThat(c.outerTracking()).isFalse();
        assertThat(outer.mode()).isEqualTo(Mode.MANUAL);
    }

    @Test
    void theLocalSetpointTakesFiniteValuesWithinTheOuterRangeOnly() {
        Cascade c = new Cascade(outer(), inner());
        c.switchToLocal();
        assertThat(c.localSetpoint(1.5)).isTrue();
        assertThat(c.innerSetpoint()).isEqualTo(1.5);
        // a bad value changes nothing and says so
        assertThat(c.localSetpoint(Double.NaN)).isFalse();
        assertThat(c.localSetpoint(Double.POSITIVE_INFINITY)).isFalse();
        assertThat(c.innerSetpoint()).isEqualTo(1.5);
        // the outer output range (−5..5) is the inner setpoint range
        assertThat(c.localSetpoint(9.0)).isTrue();
        assertThat(c.innerSetpoint()).isEqualTo(5.0);
    }

    @Test
    void resetGivesTheSameOutputsAsANewCascade() {
        PidController outer = outer();
        PidController inner = inner();
        Cascade used = new Cascade(outer, inner);
        // leave every state non-zero: a run in cascade, then a local spell that is still on, three
        // samples into an outer period
        for (int k = 0; k < 203; k++) {
            used.update(1.0, 0.2, 0.4);
        }
        used.switchToLocal();
        used.localSetpoint(2.0);
        for (int k = 0; k < 13; k++) {
            used.update(1.0, 0.3, 0.5);
        }
        assertThat(used.outerTracking()).isTrue();

        used.reset();
        Cascade fresh = new Cascade(outer(), inner());
        // the documented contract of reset: the state of a new cascade
        assertThat(used.mode()).isEqualTo(CascadeMode.CASCADE);
        assertThat(used.outerTracking()).isFalse();
        assertThat(outer.mode()).isEqualTo(Mode.AUTOMATIC);
        assertThat(used.innerSetpoint()).isEqualTo(fresh.innerSetpoint());
        for (int k = 0; k < 40; k++) {
            double y1 = 0.01 * k;
            double y2 = 0.5 * Math.sin(0.3 * k);
            assertThat(used.update(1.0, y1, y2)).as("output at sample %d", k).isEqualTo(fresh.update(1.0, y1, y2));
            assertThat(used.innerSetpoint()).isEqualTo(fresh.innerSetpoint());
        }
    }

    @Test
    void itGivesBackTheControllersAndTheRatioItWasBuiltWith() {
        PidController outer = outer();
        PidController inner = inner();
        Cascade c = new Cascade(outer, inner);
        assertThat(c.outer()).isSameAs(outer);
        assertThat(c.inner()).isSameAs(inner);
        assertThat(c.innerSamplesPerOuterSample()).isEqualTo(RATIO);
    }

    @Test
    void theLargestWholeRatioIsTheLargestInt() {
        // the ratio counts inner samples in an int: 2³¹ − 1 fits, 2³¹ does not
        assertThat(Cascade.samplesPerOuterSample(Integer.MAX_VALUE, 1.0)).isEqualTo(Integer.MAX_VALUE);
        assertThatThrownBy(() -> Cascade.samplesPerOuterSample(2147483648.0, 1.0))
                .isInstanceOf(InvalidSettingException.class)
                .hasMessageStartingWith("outerSamplePeriodSeconds must be a whole multiple");
    }

    @Test
    void theWholeRatioIsJudgedToARelativeTenToTheMinusNine() {
        // the documented tolerance is relative: at a ratio of 1000 it allows 10⁻⁶ absolute
        assertThat(Cascade.samplesPerOuterSample(1000.0 * (1.0 + 0.5e-9), 1.0)).isEqualTo(1000);
        assertThatThrownBy(() -> Cascade.samplesPerOuterSample(1000.0 * (1.0 + 2e-9), 1.0))
                .isInstanceOf(InvalidSettingException.class);
    }

    private static void runOuterSamples(Cascade c, int outerSamples) {
        for (int k = 0; k < outerSamples * RATIO; k++) {
            c.update(1.0, 0.2, 0.3);
        }
    }
}
