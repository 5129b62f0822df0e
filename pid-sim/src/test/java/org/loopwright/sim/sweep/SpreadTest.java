package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import static org.assertj.core.api.Assertions.entry;

import java.util.Map;
import java.util.stream.Collectors;
import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.EnumSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.plant.PlantType;

class SpreadTest {

    @Test
    void readsEveryKeyAndLeavesTheOthersAtZero() {
        Spread spread = Spread.parse("gain=20%,time-constant=10%,dead-time=30%");
        assertThat(spread.fractions()).containsExactly(entry("gain", 0.2), entry("time-constant", 0.1),
                entry("dead-time", 0.3));
        assertThat(Spread.parse(" dead-time = 12.5% ").fraction("dead-time")).isEqualTo(0.125);
        assertThat(Spread.parse(" dead-time = 12.5% ").fraction("gain")).isZero();
        assertThat(Spread.parse("gain=0%").nonZero()).isEmpty();
        assertThat(new Spread(Map.of("gain", 0.2)).text()).isEqualTo("gain=20%");
        assertThat(Spread.parse("static-friction=12.5%,inertia=10%").text())
                .isEqualTo("static-friction=12.5%,inertia=10%");
    }

    /** The keys are each plant type's declared spread keys; one not declared is named with the ones that are. */
    static Stream<Arguments> keysOfAnotherPlantType() {
        return Stream.of(
                Arguments.of("lag=20%", PlantType.TRANSFER_FUNCTION,
                        "--spread key lag is not a parameter of plant type transfer-function: use gain, time-constant"
                                + " or dead-time"),
                Arguments.of("outflow-coefficient=20%", PlantType.TANK,
                        "--spread key outflow-coefficient is not a parameter of plant type tank: use area,"
                                + " outlet-coefficient or initial-level"),
                Arguments.of("gain=20%", PlantType.DC_MOTOR,
                        "--spread key gain is not a parameter of plant type dc-motor: use resistance, inductance,"
                                + " torque-constant, back-emf-constant, inertia, viscous-friction, load-torque,"
                                + " coulomb-friction or static-friction"),
                Arguments.of("ambient=5%", PlantType.THERMAL_ZONE,
                        "--spread key ambient is not a parameter of plant type thermal-zone: use heat-capacity,"
                                + " loss-coefficient or max-power"));
    }

    @ParameterizedTest
    @MethodSource("keysOfAnotherPlantType")
    void aKeyThePlantTypeDoesNotTakeIsNamedWithTheKeysItTakes(String text, PlantType type, String message) {
        assertThatThrownBy(() -> Spread.parse(text).requireKeysOf(type)).isInstanceOf(InputException.class)
                .hasMessage(message);
    }

    @ParameterizedTest
    @EnumSource(PlantType.class)
    void everyDeclaredSpreadKeyOfEveryPlantTypeIsAccepted(PlantType type) {
        String all = type.spreadKeys().stream().map(k -> k.word() + "=10%").collect(Collectors.joining(","));
        Spread spread = Spread.parse(all);
        spread.requireKeysOf(type);
        assertThat(spread.fractions()).hasSize(type.spreadKeys().size());
    }

    static Stream<Arguments> badSpreads() {
        return Stream.of(
                Arguments.of("gain", "--spread entries must be key=P% with a plant parameter's key: --spread=gain"),
                Arguments.of("=10%", "--spread entries must be key=P% with a plant parameter's key: --spread==10%"),
                Arguments.of("gain=20", "--spread gain must be a percentage from 0% to below 100%: gain=20"),
                Arguments.of("gain=100%", "--spread gain must be a percentage from 0% to below 100%: gain=100%"),
                Arguments.of("dead-time=-5%", "--spread dead-time must be a percentage from 0% to below 100%:"
                        + " dead-time=-5%"),
                Arguments.of("time-constant=x%", "--spread time-constant must be a percentage from 0% to below 100%:"
                        + " time-constant=x%"),
                Arguments.of("gain=10%,gain=20%", "--spread must name gain once: --spread=gain=10%,gain=20%"),
                Arguments.of("gain=10%,", "--spread entries must be key=P% with a plant parameter's key:"
                        + " --spread=gain=10%,"));
    }

    @ParameterizedTest
    @MethodSource("badSpreads")
    void badSpreadNamesTheEntryAndWhatIsAllowed(String text, String message) {
        assertThatThrownBy(() -> Spread.parse(text)).isInstanceOf(InputException.class)
                .hasMessage(message);
    }
}
