package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class PlantModelValidationTest {

    static Stream<Arguments> invalid() {
        return Stream.of(
                Arguments.of((Runnable) () -> TransferFunction.fopdt(Double.NaN, 1, 0), "gain must be finite: gain=NaN"),
                Arguments.of((Runnable) () -> TransferFunction.firstOrder(1, -3),
                        "timeConstantSeconds must be finite and > 0: timeConstantSeconds=-3.0"),
                Arguments.of((Runnable) () -> TransferFunction.fopdt(1, 3, -1), "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=-1.0"),
                Arguments.of((Runnable) () -> TransferFunction.sopdt(1, 3, 0, 0),
                        "timeConstantsSeconds must be finite and > 0: timeConstantsSeconds=0.0"),
                Arguments.of((Runnable) () -> TransferFunction.sopdtOscillatory(1, 1, 0, 0), "damping must be finite and > 0: damping=0.0"),
                Arguments.of((Runnable) () -> new TransferFunction(new double[] {1}, new double[] {0, 1}, 0),
                        "denominator must have a non-zero leading coefficient: denominator=[0.0, 1.0]"),
                Arguments.of((Runnable) () -> new ThermalZoneModel(0, 1, 20, 100, 1),
                        "heatCapacityJoulesPerKelvin must be finite and > 0: heatCapacityJoulesPerKelvin=0.0"),
                Arguments.of((Runnable) () -> new ThermalZoneModel(1, 1, 20, 0, 1),
                        "maxPowerWatts must be > 0 (infinity for no limit): maxPowerWatts=0.0"),
                Arguments.of((Runnable) () -> new TankModel(1, 0, 0, 1),
                        "outletCoefficient must be finite and > 0: outletCoefficient=0.0"),
                Arguments.of((Runnable) () -> new DcMotorModel(1, 1, 1, 1, 1, 0, 0, 0.2, 0.1, MotorOutput.SPEED, 1),
                        "staticFriction must be >= coulombFriction (coulombFriction=0.2): staticFriction=0.1"),
                Arguments.of((Runnable) () -> new DcMotorModel(1, 1, 1, 1, 1, 0, 0, 0, 0, MotorOutput.SPEED, 0),
                        "integrationStepSeconds must be finite and > 0: integrationStepSeconds=0.0"));
    }

    @ParameterizedTest
    @MethodSource("invalid")
    void invalidModelsNameKeyValueAndRule(Runnable make, String message) {
        assertThatThrownBy(make::run).isInstanceOf(IllegalArgumentException.class).hasMessage(message);
    }

    /** Standard forms: K/(Ts+1), K/((T1s+1)(T2s+1)), K·ωn²/(s² + 2ζωn·s + ωn²), K/s. */
    @Test
    void factoriesBuildTheStandardForms() {
        assertThat(TransferFunction.fopdt(2, 30, 5)).isEqualTo(new TransferFunction(new double[] {2},
                new double[] {30, 1}, 5));
        assertThat(TransferFunction.sopdt(1, 10, 3, 1)).isEqualTo(new TransferFunction(new double[] {1},
                new double[] {30, 13, 1}, 1));
        assertThat(TransferFunction.sopdtOscillatory(2, 0.5, 0.3, 0)).isEqualTo(new TransferFunction(
                new double[] {0.5}, new double[] {1, 0.3, 0.25}, 0));
        assertThat(TransferFunction.integrating(0.1, 2).staticGain()).isInfinite();
        assertThat(TransferFunction.fopdt(2, 30, 5).staticGain()).isEqualTo(2.0);
    }

    @Test
    void onlyLinearModelsOfferATransferFunction() {
        assertThat(new ThermalZoneModel(1, 1, 20, 100, 1).linear()).isEmpty();
        assertThat(new TankModel(1, 1, 0, 1).linear()).isEmpty();
        assertThat(new DcMotorModel(1, 1, 1, 1, 1, 0, 0, 0.1, 0.1, MotorOutput.SPEED, 1).linear()).isEmpty();
        assertThat(TransferFunction.firstOrder(1, 1).linear()).contains(TransferFunction.firstOrder(1, 1));
    }
}
