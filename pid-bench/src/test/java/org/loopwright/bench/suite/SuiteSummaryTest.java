package org.loopwright.bench.suite;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.List;

import org.junit.jupiter.api.Test;

/** How figures meet their baselines and how a missed target is reported (the figures are made up). */
class SuiteSummaryTest {

    private static final Machine MACHINE = new Machine(2, "test cpu", "test os", "test jvm", 0.5, 0.6);

    private static List<JmhFigure> figures(double full, double bank, double step, double bytes) {
        return List.of(new JmhFigure(SuiteSummary.BARE, 10.0, 0.5, 0.0),
                new JmhFigure(SuiteSummary.FULL, full, 0.5, bytes),
                new JmhFigure(SuiteSummary.BANK, bank, 0.5, 0.0),
                new JmhFigure(SuiteSummary.SIMULATION_STEP, step, 0.5, 0.0),
                new JmhFigure("FormBenchmark.update[form=IDEAL]", 12.0, 0.5, 0.0));
    }

    @Test
    void everyFigureStandsBesideItsBaseline() {
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, figures(12.0, 11.0, 20.0, 0.0), List.of());
        assertThat(s.benchmarks()).extracting(c -> c.figure().name() + "/" + c.baseline().name() + "=" + c.ratio())
                .containsExactly(
                        SuiteSummary.BARE + "/" + SuiteSummary.BARE + "=1.0",
                        SuiteSummary.FULL + "/" + SuiteSummary.BARE + "=1.2",
                        SuiteSummary.BANK + "/" + SuiteSummary.FULL + "=" + (11.0 / 12.0),
                        SuiteSummary.SIMULATION_STEP + "/" + SuiteSummary.FULL + "=" + (20.0 / 12.0),
                        "FormBenchmark.update[form=IDEAL]/" + SuiteSummary.BARE + "=1.2");
        assertThat(s.targets()).allMatch(TargetCheck::met);
    }

    @Test
    void missedTargetsAreReportedAsMissed() {
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, figures(14.0, 16.0, 30.0, 24.0), List.of());
        assertThat(s.targets()).noneMatch(TargetCheck::met);
        assertThat(SummaryWriter.markdown(s)).contains("**NO: target missed**");
    }

    @Test
    void aBankSlowerByLessThanTheErrorStillMeetsItsTarget() {
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, figures(12.0, 12.8, 20.0, 0.0), List.of());
        assertThat(s.targets().get(2).met()).isTrue();
        assertThat(s.targets().get(2).measured()).contains("less than the measurement error");
    }

    @Test
    void aMissingBaselineIsNamed() {
        assertThatThrownBy(() -> SuiteSummary.of("cmd", "full", MACHINE, List.of(), List.of()))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("benchmark UpdateBenchmark.bareRecurrence is missing from the results");
    }
}
