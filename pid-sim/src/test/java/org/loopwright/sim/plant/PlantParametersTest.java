package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.Map;
import java.util.stream.Stream;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.sim.config.FileKey;

class PlantParametersTest {

    /** One model of each nonlinear type, every parameter a different non-zero value. */
    static Stream<PlantModel> nonlinearModels() {
        return Stream.of(
                new DcMotorModel(2.0, 1e-3, 0.05, 0.04, 1e-5, 2e-5, 0.003, 0.008, 0.01, MotorOutput.POSITION, 1e-5),
                new ThermalZoneModel(21_000, 5, 20, 2_000, 1.0),
                new TankModel(0.5, 0.01, 0.2, 0.05));
    }

    /** The file key names the model field (one source); scaling one parameter moves it alone, exactly. */
    @ParameterizedTest
    @MethodSource("nonlinearModels")
    void everySpreadKeyScalesItsOwnFieldAndNoOther(PlantModel model) {
        assertThat(model.type().spreadKeys()).isNotEmpty();
        assertThat(PlantParameters.scaled(model, Map.of())).isEqualTo(model);
        for (FileKey<Double> key : model.type().spreadKeys()) {
            assertThat(model.type().keys()).contains(key);
            assertThat(PlantParameters.scaled(model, Map.of(key, 1.0))).isEqualTo(model);
            // static friction is scaled up, so it stays at least the Coulomb friction; 0.5 and 2 are exact in binary
            double factor = key.word().equals("static-friction") ? 2.0 : 0.5;
            PlantModel scaled = PlantParameters.scaled(model, Map.of(key, factor));
            for (FileKey<Double> other : model.type().spreadKeys()) {
                double expected = PlantParameters.value(model, other) * (other.equals(key) ? factor : 1.0);
                assertThat(PlantParameters.value(scaled, other)).as("%s scaled, %s read", key.word(), other.word())
                        .isEqualTo(expected);
            }
        }
    }

    @ParameterizedTest
    @MethodSource("nonlinearModels")
    void aScaleTheModelRefusesIsReportedByTheModel(PlantModel model) {
        FileKey<Double> first = model.type().spreadKeys().get(0);
        assertThatThrownBy(() -> PlantParameters.scaled(model, Map.of(first, -1.0)))
                .isInstanceOf(InvalidSettingException.class)
                .satisfies(e -> assertThat(((InvalidSettingException) e).field()).isEqualTo(first.field()));
    }
}
