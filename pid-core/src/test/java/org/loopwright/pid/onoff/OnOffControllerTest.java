package org.loopwright.pid.onoff;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.Action;
import org.loopwright.pid.InvalidSettingException;

class OnOffControllerTest {

    private static final OnOffSettings HEATER = new OnOffSettings(0.0, 2000.0, 1.0, 0.0, 0.0, Action.REVERSE);

    @Test
    void switchesOnBelowTheBandAndOffAboveItWithHysteresis() {
        OnOffController c = new OnOffController(HEATER);
        assertThat(c.update(60.0, 59.6, 0.0)).as("inside the band, from off").isEqualTo(0.0);
        assertThat(c.update(60.0, 59.4, 1.0)).as("below 59.5").isEqualTo(2000.0);
        assertThat(c.update(60.0, 60.4, 2.0)).as("inside the band, stays on").isEqualTo(2000.0);
        assertThat(c.update(60.0, 60.6, 3.0)).as("above 60.5").isEqualTo(0.0);
        assertThat(c.update(60.0, 59.6, 4.0)).as("inside the band, stays off").isEqualTo(0.0);
    }

    @Test
    void directActionSwitchesOnAboveTheBand() {
        OnOffController cooler = new OnOffController(new OnOffSettings(0.0, 1.0, 1.0, 0.0, 0.0, Action.DIRECT));
        assertThat(cooler.update(5.0, 5.6, 0.0)).isEqualTo(1.0);
        assertThat(cooler.update(5.0, 4.6, 1.0)).isEqualTo(1.0);
        assertThat(cooler.update(5.0, 4.4, 2.0)).isEqualTo(0.0);
    }

    @Test
    void minimumOnAndOffTimesDelayTheSwitch() {
        OnOffController c = new OnOffController(new OnOffSettings(0.0, 1.0, 0.0, 10.0, 30.0, Action.REVERSE));
        assertThat(c.update(1.0, 0.0, 100.0)).as("first switch is free").isEqualTo(1.0);
        assertThat(c.update(1.0, 2.0, 109.9)).as("on for less than 10 s").isEqualTo(1.0);
        assertThat(c.update(1.0, 2.0, 110.0)).as("on for 10 s").isEqualTo(0.0);
        assertThat(c.update(1.0, 0.0, 139.9)).as("off for less than 30 s").isEqualTo(0.0);
        assertThat(c.update(1.0, 0.0, 140.0)).as("off for 30 s").isEqualTo(1.0);
    }

    @Test
    void nonFiniteInputSwitchesOffAtOnceAndCountsAFault() {
        OnOffController c = new OnOffController(new OnOffSettings(0.0, 1.0, 0.0, 100.0, 0.0, Action.REVERSE));
        assertThat(c.update(1.0, 0.0, 0.0)).isEqualTo(1.0);
        assertThat(c.update(1.0, Double.NaN, 1.0)).isEqualTo(0.0);
        assertThat(c.update(Double.POSITIVE_INFINITY, 0.0, 2.0)).isEqualTo(0.0);
        assertThat(c.faultCount()).isEqualTo(2);
        assertThat(c.on()).isFalse();
    }

    static Stream<Arguments> invalidSettings() {
        return Stream.of(
                Arguments.of(new double[] {Double.NaN, 1, 0, 0, 0}, "offOutput must be finite: offOutput=NaN"),
                Arguments.of(new double[] {0, Double.POSITIVE_INFINITY, 0, 0, 0},
                        "onOutput must be finite: onOutput=Infinity"),
                Arguments.of(new double[] {0, 1, -0.5, 0, 0}, "hysteresis must be finite and >= 0: hysteresis=-0.5"),
                Arguments.of(new double[] {0, 1, 0, -1, 0},
                        "minimumOnSeconds must be finite and >= 0: minimumOnSeconds=-1.0"),
                Arguments.of(new double[] {0, 1, 0, 0, Double.NaN},
                        "minimumOffSeconds must be finite and >= 0: minimumOffSeconds=NaN"));
    }

    @ParameterizedTest
    @MethodSource("invalidSettings")
    void invalidSettingsNameFieldValueAndRule(double[] v, String message) {
        assertThatThrownBy(() -> new OnOffSettings(v[0], v[1], v[2], v[3], v[4], Action.REVERSE))
                .isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }
}
