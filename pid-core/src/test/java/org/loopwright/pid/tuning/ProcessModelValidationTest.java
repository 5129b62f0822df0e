package org.loopwright.pid.tuning;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.assertThatCode;

import java.util.stream.Stream;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.InvalidSettingException;

/**
 * Every rule of the process models and the ultimate point, from both sides of its limit (issue 11:
 * the mutation run found the validations unpinned). Messages verbatim, in the shape
 * {@code "<field> <rule>: <field>=<value>"}.
 */
class ProcessModelValidationTest {

    static Stream<Arguments> invalid() {
        return Stream.of(
                Arguments.of((Executable) () -> new FopdtModel(0.0, 1.0, 0.0),
                        "processGain must be finite and non-zero: processGain=0.0"),
                Arguments.of((Executable) () -> new FopdtModel(Double.NaN, 1.0, 0.0),
                        "processGain must be finite and non-zero: processGain=NaN"),
                Arguments.of((Executable) () -> new FopdtModel(1.0, 0.0, 0.0),
                        "timeConstantSeconds must be finite and > 0: timeConstantSeconds=0.0"),
                Arguments.of((Executable) () -> new FopdtModel(1.0, Double.POSITIVE_INFINITY, 0.0),
                        "timeConstantSeconds must be finite and > 0: timeConstantSeconds=Infinity"),
                Arguments.of((Executable) () -> new FopdtModel(1.0, 1.0, -Double.MIN_VALUE),
                        "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=-4.9E-324"),
                Arguments.of((Executable) () -> new FopdtModel(1.0, 1.0, Double.NaN),
                        "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=NaN"),
                Arguments.of((Executable) () -> new SopdtModel(Double.NEGATIVE_INFINITY, 2.0, 1.0, 0.0),
                        "processGain must be finite and non-zero: processGain=-Infinity"),
                Arguments.of((Executable) () -> new SopdtModel(0.0, 2.0, 1.0, 0.0),
                        "processGain must be finite and non-zero: processGain=0.0"),
                Arguments.of((Executable) () -> new SopdtModel(1.0, 0.0, 0.0, 0.0),
                        "timeConstantSeconds must be finite and > 0: timeConstantSeconds=0.0"),
                Arguments.of((Executable) () -> new SopdtModel(1.0, Double.NaN, 1.0, 0.0),
                        "timeConstantSeconds must be finite and > 0: timeConstantSeconds=NaN"),
                Arguments.of((Executable) () -> new SopdtModel(1.0, 2.0, 0.0, 0.0),
                        "secondTimeConstantSeconds must be finite, > 0 and <= the first time constant (2.0):"
                                + " secondTimeConstantSeconds=0.0"),
                Arguments.of((Executable) () -> new SopdtModel(1.0, 2.0, Math.nextUp(2.0), 0.0),
                        "secondTimeConstantSeconds must be finite, > 0 and <= the first time constant (2.0):"
                                + " secondTimeConstantSeconds=2.0000000000000004"),
                Arguments.of((Executable) () -> new SopdtModel(1.0, 2.0, Double.NaN, 0.0),
                        "secondTimeConstantSeconds must be finite, > 0 and <= the first time constant (2.0):"
                                + " secondTimeConstantSeconds=NaN"),
                Arguments.of((Executable) () -> new SopdtModel(1.0, 2.0, 1.0, -Double.MIN_VALUE),
                        "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=-4.9E-324"),
                Arguments.of((Executable) () -> new SopdtModel(1.0, 2.0, 1.0, Double.POSITIVE_INFINITY),
                        "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=Infinity"),
                Arguments.of((Executable) () -> new IntegratingModel(0.0, 0.0, 0.0),
                        "processGain must be finite and non-zero: processGain=0.0"),
                Arguments.of((Executable) () -> new IntegratingModel(1.0, -Double.MIN_VALUE, 0.0),
                        "lagSeconds must be finite and >= 0: lagSeconds=-4.9E-324"),
                Arguments.of((Executable) () -> new IntegratingModel(1.0, Double.NaN, 0.0),
                        "lagSeconds must be finite and >= 0: lagSeconds=NaN"),
                Arguments.of((Executable) () -> new IntegratingModel(1.0, 0.0, -Double.MIN_VALUE),
                        "deadTimeSeconds must be finite and >= 0: deadTimeSeconds=-4.9E-324"),
                Arguments.of((Executable) () -> new UltimatePoint(0.0, 1.0),
                        "ultimateGain must be finite and > 0: ultimateGain=0.0"),
                Arguments.of((Executable) () -> new UltimatePoint(Double.POSITIVE_INFINITY, 1.0),
                        "ultimateGain must be finite and > 0: ultimateGain=Infinity"),
                Arguments.of((Executable) () -> new UltimatePoint(1.0, 0.0),
                        "ultimatePeriodSeconds must be finite and > 0: ultimatePeriodSeconds=0.0"),
                Arguments.of((Executable) () -> new UltimatePoint(1.0, Double.NaN),
                        "ultimatePeriodSeconds must be finite and > 0: ultimatePeriodSeconds=NaN"));
    }

    @ParameterizedTest(name = "{1}")
    @MethodSource("invalid")
    void anInvalidParameterIsRefusedWithFieldRuleAndValue(Executable construct, String message) {
        assertThatThrownBy(construct::execute).isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }

    @Test
    void theLimitsThemselvesAreAccepted() {
        // a negative gain (a direct-acting process), no dead time, T2 = T1, no lag, the smallest positive values
        assertThatCode(() -> new FopdtModel(-1.0, Double.MIN_VALUE, 0.0)).doesNotThrowAnyException();
        assertThatCode(() -> new SopdtModel(-1.0, 2.0, 2.0, 0.0)).doesNotThrowAnyException();
        assertThatCode(() -> new SopdtModel(1.0, Double.MIN_VALUE, Double.MIN_VALUE, 0.0)).doesNotThrowAnyException();
        assertThatCode(() -> new IntegratingModel(-1.0, 0.0, 0.0)).doesNotThrowAnyException();
        assertThatCode(() -> new UltimatePoint(Double.MIN_VALUE, Double.MIN_VALUE)).doesNotThrowAnyException();
        // τ = L/(L + T): 1/(1 + 3) (the normalised dead time, Åström & Hägglund 2006, §2.7; from memory)
        assertThat(new FopdtModel(2.0, 3.0, 1.0).normalisedDeadTime()).isEqualTo(0.25);
        // Skogestad's half rule (2003): T1 + T2/2 and L + T2/2
        assertThat(new SopdtModel(0.8, 90.0, 12.0, 4.0).halfRule()).isEqualTo(new FopdtModel(0.8, 96.0, 10.0));
    }
}
