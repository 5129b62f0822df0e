package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;

/**
 * A cascade of two first-order lags, each stepped exactly inside the test: the inner plant
 * 1/(s + 1) from the actuator to the inner measurement, the outer plant 1/(10·s + 1) from the
 * inner measurement to the outer one. Both controllers are PI with Ti equal to their plant's time
 * constant.
 */
class CascadeTest {

    private static final double INNER_PERIOD = 0.01;
    private static final int RATIO = 5;
    private static final double INNER_TIME_CONSTANT = 1.0;
    private static final double OUTER_TIME_CONSTANT = 10.0;
    private static final double INNER_GAIN = 4.0;
    private static final double OUTER_GAIN = 1.0;

    private static ControllerSettings inner(double outputMax) {
        return ControllerSettings.builder().gains(IdealGains.pi(INNER_GAIN, INNER_TIME_CONSTANT))
                .samplePeriodSeconds(INNER_PERIOD).outputRange(0.0, outputMax).build();
    }

    private static ControllerSettings outer(WindupProtection scheme) {
        return ControllerSettings.builder().gains(IdealGains.pi(OUTER_GAIN, OUTER_TIME_CONSTANT))
                .samplePeriodSeconds(RATIO * INNER_PERIOD).outputRange(-5.0, 5.0).windupProtection(scheme).build();
    }

    @ParameterizedTest
    @CsvSource({"0.25, 0.1", "0.05, 0.1", "0.1000001, 0.1"})
    void refusesAnOuterPeriodThatIsNotAWholeMultipleOfTheInnerOne(double outerPeriod, double innerPeriod) {
        assertThatThrownBy(() -> Cascade.samplesPerOuterSample(outerPeriod, innerPeriod))
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage("outerSamplePeriodSeconds must be a whole multiple (1, 2, 3, ...) of innerSamplePeriodSeconds"
                        + " (innerSamplePeriodSeconds=" + innerPeriod + "): outerSamplePeriodSeconds=" + outerPeriod);
    }

    @Test
    void acceptsPeriodsWrittenInDecimalWhoseRatioIsWhole() {
        // 0.3 / 0.1 is 2.9999999999999996 in binary floating point
        assertThat(Cascade.samplesPerOuterSample(0.3, 0.1)).isEqualTo(3);
        assertThat(Cascade.samplesPerOuterSample(0.1, 0.1)).isEqualTo(1);
    }

    @Test
    void refusesAnOuterControllerWithoutActuatorTracking() {
        assertThatThrownBy(() -> new Cascade(new PidController(outer(WindupProtection.BACK_CALCULATION)),
                new PidController(inner(1.0))))
                .hasMessage("outerWindupProtection must be ACTUATOR_TRACKING, so that the outer loop tracks what the"
                        + " inner loop achieves: outerWindupProtection=BACK_CALCULATION");
    }

    @Test
    void innerLoopIsTheAnalyticFirstOrderLoop() {
        // PI with Ti = T on K/(T·s + 1) closes to a first-order loop with time constant T/(Kc·K)
        // (pole-zero cancellation; Åström & Murray 2021, ch. 11). Outer loop in local, inner setpoint 1.
        Cascade c = new Cascade(new PidController(outer(WindupProtection.ACTUATOR_TRACKING)),
                new PidController(inner(Double.POSITIVE_INFINITY)));
        c.switchToLocal();
        c.localSetpoint(1.0);
        FirstOrderLag plant = new FirstOrderLag(1.0, INNER_TIME_CONSTANT, INNER_PERIOD);
        double closedLoopTimeConstant = INNER_TIME_CONSTANT / INNER_GAIN;
        for (int k = 0; k < 200; k++) {
            double t = k * INNER_PERIOD;
            double y = plant.output();
            // sampling adds about h/2 of delay and a small gain error: 0.01 covers both at h = T/100
            assertThat(y).as("y(%f)", t).isCloseTo(1.0 - Math.exp(-t / closedLoopTimeConstant), within(0.01));
            plant.step(c.update(0.0, 0.0, y));
        }
    }

    /** Overshoot of the outer measurement above the setpoint after the load goes, and the largest outer integral. */
    private record Recovery(double overshoot, double largestOuterIntegral) {
    }

    /**
     * Setpoint 0.5 from rest; from 100 s to 300 s a load of −0.8 at the actuator needs 1.3, beyond
     * the actuator's 1.0 when it is limited: the inner loop saturates for 200 s. After the load goes,
     * the outer measurement overshoots.
     */
    private static Recovery loadAndRecovery(double actuatorMax, boolean cascadeProtection) {
        PidController outer = new PidController(outer(cascadeProtection ? WindupProtection.ACTUATOR_TRACKING
                : WindupProtection.NONE));
        PidController inner = new PidController(inner(actuatorMax));
        FirstOrderLag innerPlant = new FirstOrderLag(1.0, INNER_TIME_CONSTANT, INNER_PERIOD);
        FirstOrderLag outerPlant = new FirstOrderLag(1.0, OUTER_TIME_CONSTANT, INNER_PERIOD);
        Cascade cascade = cascadeProtection ? new Cascade(outer, inner) : null;
        double innerSetpoint = 0.0;
        double overshoot = 0.0;
        double largest = 0.0;
        for (int k = 0; k < 60_000; k++) {
            double t = k * INNER_PERIOD;
            double y2 = innerPlant.output();
            double y1 = outerPlant.output();
            double u;
            if (cascade != null) {
                u = cascade.update(0.5, y1, y2);
            } else {
                // the same two controllers wired by hand, with no protection of the outer loop
                if (k % RATIO == 0) {
                    innerSetpoint = outer.update(0.5, y1);
                }
                u = inner.update(innerSetpoint, y2);
            }
            double load = t >= 100.0 && t < 300.0 ? -0.8 : 0.0;
            innerPlant.step(u + load);
            outerPlant.step(y2);
            largest = Math.max(largest, Math.abs(outer.integralTerm()));
            if (t >= 300.0) {
                overshoot = Math.max(overshoot, y1 - 0.5);
            }
        }
        return new Recovery(overshoot, largest);
    }

    @Test
    void outerLoopDoesNotWindUpWhileTheInnerLoopIsSaturated() {
        Recovery unsaturated = loadAndRecovery(Double.POSITIVE_INFINITY, true);
        Recovery unprotected = loadAndRecovery(1.0, false);
        Recovery protectedCascade = loadAndRecovery(1.0, true);
        // common practice, as the single-loop windup test: without protection the outer integral
        // grows through the whole saturation and the recovery overshoots by most of the setpoint
        assertThat(unprotected.largestOuterIntegral()).as("unprotected integral").isGreaterThan(5.0);
        assertThat(unprotected.overshoot() - unsaturated.overshoot()).as("unprotected excess").isGreaterThan(0.3);
        // stated bounds: the integral stays within 20 % above the 0.5 the setpoint itself needs, and the
        // recovery overshoots by no more than 0.01 (2 % of the setpoint) beyond the unsaturated loop's
        assertThat(protectedCascade.largestOuterIntegral()).as("protected integral").isLessThan(0.6);
        assertThat(protectedCascade.overshoot()).as("protected overshoot")
                .isLessThanOrEqualTo(unsaturated.overshoot() + 0.01);
    }

    @Test
    void outerLoopTracksTheInnerMeasurementWhileTheInnerLoopIsInManual() {
        PidController outer = new PidController(outer(WindupProtection.ACTUATOR_TRACKING));
        PidController inner = new PidController(inner(1.0));
        Cascade c = new Cascade(outer, inner);
        FirstOrderLag innerPlant = new FirstOrderLag(1.0, INNER_TIME_CONSTANT, INNER_PERIOD);
        FirstOrderLag outerPlant = new FirstOrderLag(1.0, OUTER_TIME_CONSTANT, INNER_PERIOD);
        inner.switchToManual();
        inner.manualOutput(0.2);
        for (int k = 0; k < 20_000; k++) {
            double y2 = innerPlant.output();
            innerPlant.step(c.update(0.5, outerPlant.output(), y2));
            outerPlant.step(y2);
        }
        // the outer error is 0.3 for 200 s: a free integral would have grown by Ki·e·t = 6
        assertThat(c.outerTracking()).isTrue();
        assertThat(outer.position()).isCloseTo(innerPlant.output(), within(1e-3));
        assertThat(c.innerSetpoint()).isEqualTo(outer.position());
        assertThat(Math.abs(outer.integralTerm())).isLessThan(1.0);
    }
}
