package org.loopwright.pid.runner;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.function.UnaryOperator;
import java.util.stream.Stream;

import org.loopwright.pid.InvalidSettingException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

class RunnerSettingsTest {

    private static RunnerSettings.Builder valid() {
        return RunnerSettings.builder().periodNanos(1_000_000L);
    }

    static Stream<Arguments> invalidSettings() {
        return Stream.of(
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.periodNanos(0),
                        "periodNanos must be > 0: periodNanos=0"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.periodNanos(-5),
                        "periodNanos must be > 0: periodNanos=-5"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.waitStrategy(null),
                        "waitStrategy must be given: waitStrategy=null"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.spinMarginNanos(-1),
                        "spinMarginNanos must be between 0 and periodNanos (1000000): spinMarginNanos=-1"),
                Arguments.of((UnaryOperator<RunnerSettings.Builder>) b -> b.spinMarginNanos(1_000_001),
                        "spinMarginNanos must be between 0 and periodNanos (1000000): spinMarginNanos=1000001"),
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
        assertThat(s.waitStrategy()).isEqualTo(WaitStrategy.HYBRID);
        assertThat(s.spinMarginNanos()).isEqualTo(RunnerSettings.DEFAULT_SPIN_MARGIN_NANOS);
        assertThat(s.overrunPolicy()).isEqualTo(OverrunPolicy.SKIP_MISSED);
        assertThat(s.periodMode()).isEqualTo(PeriodMode.FIXED);
        assertThat(s.maxConsecutiveFailures()).isEqualTo(RunnerSettings.DEFAULT_MAX_CONSECUTIVE_FAILURES);
        assertThat(s.threadName()).isEqualTo(RunnerSettings.DEFAULT_THREAD_NAME);
        assertThat(s.daemon()).isFalse();
        assertThat(s.clock()).isSameAs(LoopClock.SYSTEM);
        assertThat(s.periodSeconds()).isEqualTo(1e-3);
    }

    @Test
    void defaultSpinMarginNeverExceedsAShortPeriod() {
        assertThat(RunnerSettings.builder().periodNanos(50_000).build().spinMarginNanos()).isEqualTo(50_000);
    }

    @Test
    void toBuilderKeepsEverySetting() {
        VirtualClock clock = new VirtualClock(0);
        RunnerSettings s = valid().waitStrategy(WaitStrategy.SPIN).spinMarginNanos(7).overrunPolicy(OverrunPolicy.RUN_LATE)
                .periodMode(PeriodMode.MEASURED).maxConsecutiveFailures(3).threadName("pump").daemon(true)
                .clock(clock).build();
        RunnerSettings copy = s.toBuilder().build();
        assertThat(copy).usingRecursiveComparison().isEqualTo(s);
    }
}
