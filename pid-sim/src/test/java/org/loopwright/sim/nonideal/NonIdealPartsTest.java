package org.loopwright.sim.nonideal;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class NonIdealPartsTest {

    @Test
    void actuatorAppliesDeadZoneThenRangeThenSlew() {
        Actuator a = new Actuator(new ActuatorModel(-10.0, 10.0, 5.0, 1.0));
        assertThat(a.deliver(0.8, 1.0)).as("inside the dead zone").isZero();
        assertThat(a.deliver(3.0, 1.0)).as("shifted by the dead zone").isEqualTo(2.0);
        assertThat(a.limited()).isFalse();
        assertThat(a.deliver(50.0, 1.0)).as("range 10, but slew 5/s from 2").isEqualTo(7.0);
        assertThat(a.limited()).isTrue();
        assertThat(a.deliver(50.0, 1.0)).as("saturated").isEqualTo(10.0);
        assertThat(a.limited()).isTrue();
        assertThat(a.deliver(-3.0, 0.5)).as("slew 2.5 in half a second").isEqualTo(7.5);
    }

    @Test
    void idealActuatorPassesTheCommandThrough() {
        Actuator a = new Actuator(ActuatorModel.IDEAL);
        assertThat(a.deliver(-1234.5, 0.01)).isEqualTo(-1234.5);
        assertThat(a.limited()).isFalse();
    }

    @Test
    void sensorDelaysByWholeSamplesAndQuantises() {
        Sensor s = new Sensor(new SensorModel(0.0, 0.5, 2, 0.0, 0.0), 1L);
        s.reset(0.0);
        assertThat(s.read(1.1)).isZero();
        assertThat(s.read(2.2)).isZero();
        assertThat(s.read(3.3)).as("1.1 two samples late, to the nearest 0.5").isEqualTo(1.0);
        assertThat(s.read(4.4)).isEqualTo(2.0);
    }

    /** The sample mean and standard deviation of seeded Gaussian noise (law of large numbers). */
    @Test
    void noiseHasTheGivenSpreadAndRepeatsWithTheSeed() {
        Sensor s = new Sensor(new SensorModel(0.3, 0.0, 0, 0.0, 0.0), 42L);
        int n = 200_000;
        double sum = 0.0;
        double squares = 0.0;
        double[] first = new double[10];
        for (int i = 0; i < n; i++) {
            double e = s.read(5.0) - 5.0;
            if (i < first.length) {
                first[i] = e;
            }
            sum += e;
            squares += e * e;
        }
        double mean = sum / n;
        assertThat(mean).isCloseTo(0.0, within(4 * 0.3 / Math.sqrt(n)));
        assertThat(Math.sqrt(squares / n - mean * mean)).isCloseTo(0.3, within(0.003));
        s.reset(5.0);
        for (double e : first) {
            assertThat(s.read(5.0) - 5.0).isEqualTo(e);
        }
    }

    @Test
    void dropoutsReturnNaNAtTheGivenRate() {
        Sensor s = new Sensor(new SensorModel(0.0, 0.0, 0, 0.0, 0.1), 3L);
        int n = 100_000;
        int dropped = 0;
        for (int i = 0; i < n; i++) {
            dropped += Double.isNaN(s.read(1.0)) ? 1 : 0;
        }
        // binomial: mean 10 000, standard deviation about 95
        assertThat(dropped).isBetween(9_600, 10_400);
    }

    @Test
    void jitterDelaysSamplesOnItsGridWithinTheBound() {
        Sensor s = new Sensor(new SensorModel(0.0, 0.0, 0, 0.08, 0.0), 9L);
        boolean sawZero = false;
        boolean sawMax = false;
        for (int i = 0; i < 10_000; i++) {
            double d = s.nextSampleDelaySeconds();
            double level = d / 0.08 * SensorModel.JITTER_LEVELS;
            assertThat(level).isCloseTo(Math.rint(level), within(1e-9)).isBetween(0.0, 16.0);
            sawZero |= d == 0.0;
            sawMax |= d == 0.08;
        }
        assertThat(sawZero && sawMax).isTrue();
    }

    static Stream<Arguments> invalid() {
        return Stream.of(
                Arguments.of((Runnable) () -> new ActuatorModel(1, 0, 1, 0), "min must be <= max (max=0.0): min=1.0"),
                Arguments.of((Runnable) () -> new ActuatorModel(0, 1, 0, 0),
                        "slewPerSecond must be > 0 (infinity for no limit): slewPerSecond=0.0"),
                Arguments.of((Runnable) () -> new ActuatorModel(0, 1, 1, -1), "deadZone must be finite and >= 0: deadZone=-1.0"),
                Arguments.of((Runnable) () -> new SensorModel(-1, 0, 0, 0, 0),
                        "noiseStdDev must be finite and >= 0: noiseStdDev=-1.0"),
                Arguments.of((Runnable) () -> new SensorModel(0, 0, -2, 0, 0), "delaySamples must be >= 0: delaySamples=-2"),
                Arguments.of((Runnable) () -> new SensorModel(0, 0, 101, 0, 0),
                        "delaySamples must be <= 100 (a longer delay belongs in the plant's dead-time): delaySamples=101"),
                Arguments.of((Runnable) () -> new SensorModel(0, 0, 0, 0, 1.0),
                        "dropoutProbability must be >= 0 and < 1: dropoutProbability=1.0"));
    }

    @ParameterizedTest
    @MethodSource("invalid")
    void invalidPartsNameKeyValueAndRule(Runnable make, String message) {
        assertThatThrownBy(make::run).isInstanceOf(IllegalArgumentException.class).hasMessage(message);
    }
}
