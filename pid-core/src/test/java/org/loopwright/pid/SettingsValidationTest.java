package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.function.Supplier;
import java.util.stream.Stream;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.pid.form.SeriesGains;

/** Every wrong value fails where it is given, with the message of the table, verbatim. */
class SettingsValidationTest {

    private static final double NAN = Double.NaN;
    private static final double INF = Double.POSITIVE_INFINITY;

    private static ControllerSettings.Builder valid() {
        return ControllerSettings.builder().gains(new IdealGains(2.0, 30.0, 5.0)).samplePeriodSeconds(0.1);
    }

    private static Arguments row(String message, Supplier<?> build) {
        return Arguments.of(message, build);
    }

    static Stream<Arguments> invalidValues() {
        return Stream.of(
                row("gain must be finite and >= 0: gain=-1.0", () -> new IdealGains(-1.0, 30.0, 5.0)),
                row("gain must be finite and >= 0: gain=NaN", () -> new IdealGains(NAN, 30.0, 5.0)),
                row("gain must be finite and >= 0: gain=Infinity", () -> new SeriesGains(INF, 30.0, 5.0)),
                row("integralTime must be > 0 (infinity for no integral action): integralTime=0.0",
                        () -> new IdealGains(2.0, 0.0, 5.0)),
                row("integralTime must be > 0 (infinity for no integral action): integralTime=-3.0",
                        () -> new SeriesGains(2.0, -3.0, 5.0)),
                row("integralTime must be > 0 (infinity for no integral action): integralTime=NaN",
                        () -> new IdealGains(2.0, NAN, 5.0)),
                row("derivativeTime must be finite and >= 0: derivativeTime=-0.5", () -> new IdealGains(2.0, 30.0, -0.5)),
                row("derivativeTime must be finite and >= 0: derivativeTime=Infinity", () -> new SeriesGains(2.0, 30.0, INF)),
                row("proportionalGain must be finite and >= 0: proportionalGain=-2.0", () -> new ParallelGains(-2.0, 0.1, 0.0)),
                row("integralGain must be finite and >= 0: integralGain=Infinity", () -> new ParallelGains(2.0, INF, 0.0)),
                row("derivativeGain must be finite and >= 0: derivativeGain=NaN", () -> new ParallelGains(2.0, 0.1, NAN)),
                row("proportionalGain must be > 0 to express integral or derivative action in ideal form: proportionalGain=0.0",
                        () -> new ParallelGains(0.0, 0.1, 0.0).toIdeal()),
                row("integralTime must be >= 4 * derivativeTime for a series form to exist (derivativeTime=5.0): integralTime=19.0",
                        () -> new IdealGains(2.0, 19.0, 5.0).toSeries()),
                row("gains must be given: gains=null", () -> ControllerSettings.builder().samplePeriodSeconds(0.1).build()),
                row("samplePeriodSeconds must be finite and > 0: samplePeriodSeconds=NaN",
                        () -> ControllerSettings.builder().gains(IdealGains.pi(1.0, 2.0)).build()),
                row("samplePeriodSeconds must be finite and > 0: samplePeriodSeconds=0.0", () -> valid().samplePeriodSeconds(0.0).build()),
                row("samplePeriodSeconds must be finite and > 0: samplePeriodSeconds=-0.1", () -> valid().samplePeriodSeconds(-0.1).build()),
                row("samplePeriodSeconds must be finite and > 0: samplePeriodSeconds=Infinity", () -> valid().samplePeriodSeconds(INF).build()),
                row("proportionalSetpointWeight must be between 0 and 1: proportionalSetpointWeight=-0.1",
                        () -> valid().setpointWeights(-0.1, 0.0).build()),
                row("derivativeSetpointWeight must be between 0 and 1: derivativeSetpointWeight=1.5",
                        () -> valid().setpointWeights(1.0, 1.5).build()),
                row("derivativeSetpointWeight must be between 0 and 1: derivativeSetpointWeight=NaN",
                        () -> valid().setpointWeights(1.0, NAN).build()),
                row("derivativeFilterRatio must be finite and > 0: derivativeFilterRatio=0.0", () -> valid().derivativeFilterRatio(0.0).build()),
                row("derivativeFilterRatio must be finite and > 0: derivativeFilterRatio=-8.0", () -> valid().derivativeFilterRatio(-8.0).build()),
                row("derivativeFilterRatio must be finite and > 0: derivativeFilterRatio=Infinity", () -> valid().derivativeFilterRatio(INF).build()),
                row("derivativeFilterTimeSeconds must be finite and > 0: derivativeFilterTimeSeconds=0.0",
                        () -> valid().derivativeFilterTimeSeconds(0.0).build()),
                row("derivativeFilterTimeSeconds must be finite and > 0: derivativeFilterTimeSeconds=-1.0",
                        () -> valid().derivativeFilterTimeSeconds(-1.0).build()),
                row("derivativeFilterTimeSeconds must be given when proportionalGain = 0, since Td/N is undefined: derivativeFilterTimeSeconds=NaN",
                        () -> valid().gains(new ParallelGains(0.0, 0.0, 1.0)).build()),
                row("samplePeriodSeconds must be < 2 * derivativeFilterTimeSeconds for the forward-Euler derivative"
                        + " (derivativeFilterTimeSeconds=0.5): samplePeriodSeconds=1.0",
                        () -> valid().samplePeriodSeconds(1.0).derivativeMethod(DerivativeMethod.FORWARD_EULER).build()),
                row("samplePeriodSeconds must be < 2 * derivativeFilterTimeSeconds for the forward-Euler derivative"
                        + " (derivativeFilterTimeSeconds=0.25): samplePeriodSeconds=0.6",
                        () -> valid().samplePeriodSeconds(0.6).derivativeFilterTimeSeconds(0.25)
                                .derivativeMethod(DerivativeMethod.FORWARD_EULER).build()),
                row("outputMin must be <= outputMax (outputMax=1.0): outputMin=5.0", () -> valid().outputRange(5.0, 1.0).build()),
                row("outputMin must be a number below +infinity: outputMin=NaN", () -> valid().outputRange(NAN, 1.0).build()),
                row("outputMin must be a number below +infinity: outputMin=Infinity", () -> valid().outputRange(INF, INF).build()),
                row("outputMax must be a number above -infinity: outputMax=NaN", () -> valid().outputRange(0.0, NAN).build()),
                row("outputMax must be a number above -infinity: outputMax=-Infinity", () -> valid().outputRange(-INF, -INF).build()),
                row("outputSlewPerSecond must be > 0 (infinity for no limit): outputSlewPerSecond=0.0",
                        () -> valid().outputSlewPerSecond(0.0).build()),
                row("outputSlewPerSecond must be > 0 (infinity for no limit): outputSlewPerSecond=NaN",
                        () -> valid().outputSlewPerSecond(NAN).build()),
                row("setpointSlewPerSecond must be > 0 (infinity for no limit): setpointSlewPerSecond=-5.0",
                        () -> valid().setpointSlewPerSecond(-5.0).build()),
                row("safeOutput must be finite: safeOutput=NaN", () -> valid().faultPolicy(FaultPolicy.SAFE_OUTPUT, NAN).build()),
                row("safeOutput must be finite: safeOutput=-Infinity", () -> valid().faultPolicy(FaultPolicy.SAFE_OUTPUT, -INF).build()),
                row("errorDeadband must be finite and >= 0: errorDeadband=-0.1", () -> valid().errorDeadband(-0.1).build()),
                row("wrapSpan must be finite and >= 0: wrapSpan=Infinity", () -> valid().wrapSpan(INF).build()),
                row("proportionalSetpointWeight must be 1 on a circular process variable (wrapSpan=360.0):"
                        + " proportionalSetpointWeight=0.5", () -> valid().wrapSpan(360.0).setpointWeights(0.5, 0.0).build()),
                row("trackingTimeSeconds must be finite and > 0: trackingTimeSeconds=0.0", () -> valid().trackingTimeSeconds(0.0).build()),
                row("trackingTimeSeconds must be finite and > 0: trackingTimeSeconds=Infinity",
                        () -> valid().trackingTimeSeconds(INF).build()),
                row("periodSeconds must be finite and > 0: periodSeconds=0.0", () -> valid().build().discretePid(0.0)));
    }

    @ParameterizedTest
    @MethodSource("invalidValues")
    void rejectsWithAMessageNamingFieldValueAndRule(String message, Supplier<?> build) {
        assertThatThrownBy(build::get).isInstanceOf(InvalidSettingException.class).hasMessage(message);
    }
}
