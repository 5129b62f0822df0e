package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;

/**
 * Bumpless switching of a cascade over random operation: two first-order lags under random PID
 * controllers, a random whole ratio of periods, and a random sequence of switches to local and
 * back, inner manual and back, and operator moves of the local setpoint, one per inner sample.
 *
 * <p>The property: the inner setpoint changes only where the outer law or the operator moves it:
 * on an outer sample that follows an outer sample at which the outer controller was already in
 * control (cascade since the sample before, inner automatic, not tracking), on an outer sample while the inner controller is
 * outside automatic (its setpoint then follows its measurement), or by an operator move while local.
 * Everywhere else it stays put, to rounding: that is every switch and every hand-back bumpless.
 */
class CascadeProperties {

    private static final double ROUNDING = 1e-9;

    @Property
    void innerSetpointNeverStepsAtASwitch(
            @ForAll @IntRange(min = 1, max = 6) int ratio,
            @ForAll @DoubleRange(min = 0.05, max = 5.0) double outerGain,
            @ForAll @DoubleRange(min = 0.5, max = 50.0) double outerIntegralTime,
            @ForAll @DoubleRange(min = 0.0, max = 2.0) double outerDerivativeTime,
            @ForAll @DoubleRange(min = 0.0, max = 1.0) double outerSetpointWeight,
            @ForAll @DoubleRange(min = 0.1, max = 20.0) double innerGain,
            @ForAll @DoubleRange(min = 0.05, max = 5.0) double innerIntegralTime,
            @ForAll @DoubleRange(min = 0.2, max = 3.0) double actuatorMax,
            @ForAll @Size(min = 20, max = 200) List<@IntRange(min = 0, max = 11) Integer> operations,
            @ForAll @Size(min = 20, max = 200) List<@DoubleRange(min = -2.0, max = 2.0) Double> setpoints) {
        double innerPeriod = 0.02;
        PidController outer = new PidController(ControllerSettings.builder()
                .gains(new IdealGains(outerGain, outerIntegralTime, outerDerivativeTime))
                .samplePeriodSeconds(ratio * innerPeriod).setpointWeights(outerSetpointWeight, 0.0)
                .outputRange(-3.0, 3.0).windupProtection(WindupProtection.ACTUATOR_TRACKING).build());
        PidController inner = new PidController(ControllerSettings.builder()
                .gains(IdealGains.pi(innerGain, innerIntegralTime)).samplePeriodSeconds(innerPeriod)
                .outputRange(-actuatorMax, actuatorMax).build());
        Cascade cascade = new Cascade(outer, inner);
        FirstOrderLag innerPlant = new FirstOrderLag(1.0, 0.5, innerPeriod);
        FirstOrderLag outerPlant = new FirstOrderLag(1.0, 5.0, innerPeriod);
        boolean inControlAtLastOuterSample = true;
        boolean localSinceLastOuterSample = false;
        for (int k = 0; k < operations.size(); k++) {
            double setpoint = setpoints.get(k % setpoints.size());
            switch (operations.get(k)) {
                case 0 -> cascade.switchToLocal();
                case 1 -> cascade.switchToCascade();
                case 2 -> inner.switchToManual();
                case 3 -> inner.switchToAutomatic();
                case 4 -> cascade.localSetpoint(setpoint);
                default -> {
                    // an ordinary sample
                }
            }
            localSinceLastOuterSample |= cascade.mode() == CascadeMode.LOCAL;
            boolean outerSample = k % ratio == 0;
            boolean innerAutomatic = inner.mode() == Mode.AUTOMATIC;
            boolean inControl = !cascade.outerTracking() && !localSinceLastOuterSample && innerAutomatic;
            boolean followsMeasurement = cascade.mode() == CascadeMode.CASCADE && !innerAutomatic;
            boolean mayMove = outerSample && (inControl && inControlAtLastOuterSample || followsMeasurement);
            double before = cascade.innerSetpoint();
            double y2 = innerPlant.output();
            innerPlant.step(cascade.update(setpoint, outerPlant.output(), y2));
            outerPlant.step(y2);
            if (!mayMove) {
                assertThat(cascade.innerSetpoint()).as("inner setpoint at sample %d", k)
                        .isCloseTo(before, org.assertj.core.api.Assertions.within(ROUNDING * (1.0 + Math.abs(before))));
            }
            if (outerSample) {
                inControlAtLastOuterSample = inControl;
                localSinceLastOuterSample = cascade.mode() == CascadeMode.LOCAL;
            }
        }
    }
}
