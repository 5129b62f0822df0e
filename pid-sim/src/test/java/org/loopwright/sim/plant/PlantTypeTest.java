package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.HashSet;
import java.util.Set;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.loopwright.sim.config.FileKey;
import org.loopwright.sim.config.YamlDocument;

class PlantTypeTest {

    @Test
    void linearTypesAreTheTransferFunctionsAndListedInOrder() {
        assertThat(PlantType.linearWords()).isEqualTo("first-order, fopdt, sopdt, integrating or transfer-function");
    }

    @ParameterizedTest
    @EnumSource(PlantType.class)
    void eachTypeDeclaresEachKeyOnceAndEachFieldOnce(PlantType type) {
        Set<String> words = new HashSet<>();
        Set<String> fields = new HashSet<>();
        for (FileKey<?> key : type.keys()) {
            assertThat(words.add(key.word())).as(key.word()).isTrue();
            assertThat(fields.add(key.field())).as(key.field()).isTrue();
        }
        assertThat(words).doesNotContain("type");
    }

    @Test
    void aModelSaysItsTypeAndWhetherItIsLinear() {
        PlantModel tank = PlantType.read(YamlDocument.parse("s.yaml",
                "plant: {type: tank, area: 0.5, outlet-coefficient: 0.01}\n"), "/plant");
        assertThat(tank.type()).isEqualTo(PlantType.TANK);
        assertThat(tank.linear()).isEmpty();
        assertThat(tank.type().linear()).isFalse();
        PlantModel fopdt = PlantType.read(YamlDocument.parse("s.yaml",
                "plant: {type: fopdt, gain: 2, time-constant: 30, dead-time: 5}\n"), "/plant");
        assertThat(fopdt).isEqualTo(TransferFunction.fopdt(2, 30, 5));
        assertThat(fopdt.type().linear()).isTrue();
    }

    @Test
    void aDefaultComesFromTheDeclaration() {
        PlantModel tank = PlantType.read(YamlDocument.parse("s.yaml",
                "plant: {type: tank, area: 0.5, outlet-coefficient: 0.01}\n"), "/plant");
        assertThat(((TankModel) tank).integrationStepSeconds()).isEqualTo(PlantKeys.TANK_INTEGRATION_STEP
                .defaultValue().orElseThrow());
        assertThat(PlantKeys.TANK_INTEGRATION_STEP.defaultText()).isEqualTo("0.1");
        assertThat(PlantKeys.GAIN.defaultText()).isEqualTo("required");
        assertThat(PlantKeys.STATIC_FRICTION.defaultText()).isEqualTo("none");
    }
}
