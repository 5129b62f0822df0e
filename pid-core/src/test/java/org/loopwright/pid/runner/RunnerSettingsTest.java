package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.function.UnaryOperator;
import java.util.stream.Stream;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.testing.VirtualClock;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class RunnerSettingsTest {

    private static RunnerSettings.Builder valid() {
        return RunnerSettings.builder();
    }

    static Stream<Arguments> invalidSettings() {
        return Stream.of(
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.waitStrategy(null),
                        "waitStrategy must be given: waitStrategy=null"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.spinMarginNanos(-1),
                        "spinMarginNanos must be >= 0: spinMarginNanos=-1"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.commandCapacity(0),
                        "commandCapacity must be between 1 and 1048576: commandCapacity=0"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.commandCapacity(1_048_577),
                        "commandCapacity must be between 1 and 1048576: commandCapacity=1048577"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.overrunPolicy(null),
                        "overrunPolicy must be given: overrunPolicy=null"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.periodMode(null),
                        "periodMode must be given: periodMode=null"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.maxConsecutiveFailures(0),
                        "maxConsecutiveFailures must be >= 1: maxConsecutiveFailures=0"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.threadName(" "),
                        "threadName must not be blank: threadName=\" \""),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.threadName(null),
                        "threadName must not be blank: threadName=null"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.clock(null),
                        "clock must be given: clock=null"));
    }

    @ParameterizedTest
    @MethodSource("invalidSettings")
    void rejectsInvalidSettingsNamingFieldRuleAndValue(UnaryOperator<RunnerSettings.Builder> change, String message) {
        assertThatThrownBy(() -> change.apply(valid()).build())
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage(message);
    }

    @Test
    void defaultsAreDocumented() {
        RunnerSettings s = valid().build();
        assertThat(s.waitStrategy()).isEqualTo(WaitStrategy.PARK_THEN_SPIN);
        assertThat(s.spinMarginNanos()).isEqualTo(RunnerSettings.DEFAULT_SPIN_MARGIN_NANOS);
        assertThat(s.overrunPolicy()).isEqualTo(OverrunPolicy.SKIP_MISSED);
        assertThat(s.periodMode()).isEqualTo(PeriodMode.FIXED);
        assertThat(s.maxConsecutiveFailures()).isEqualTo(RunnerSettings.DEFAULT_MAX_CONSECUTIVE_FAILURES);
        assertThat(s.threadName()).isEqualTo(RunnerSettings.DEFAULT_THREAD_NAME);
        assertThat(s.daemon()).isFalse();
        assertThat(s.clock()).isSameAs(LoopClock.SYSTEM);
        assertThat(s.commandCapacity()).isEqualTo(RunnerSettings.DEFAULT_COMMAND_CAPACITY);
    }

    @Test
    void toBuilderKeepsEverySetting() {
        VirtualClock clock = new VirtualClock(0);
        RunnerSettings s = valid().waitStrategy(WaitStrategy.SPIN).spinMarginNanos(7).commandCapacity(5).overrunPolicy(OverrunPolicy.RUN_LATE)
                .periodMode(PeriodMode.MEASURED).maxConsecutiveFailures(3).threadName("pump").daemon(true)
                .clock(clock).build();
        RunnerSettings copy = s.toBuilder().build();
        assertThat(copy).usingRecursiveComparison().isEqualTo(s);
    }
}
