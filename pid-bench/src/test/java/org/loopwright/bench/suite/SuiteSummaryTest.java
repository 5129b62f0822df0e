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
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, figures(12.0, 11.0, 20.0, 0.0), List.of(), List.of(), 48);
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
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, figures(14.0, 16.0, 30.0, 24.0), List.of(), List.of(), 48);
        assertThat(s.targets()).noneMatch(TargetCheck::met);
        assertThat(SummaryWriter.markdown(s)).contains("**NO: target missed**");
    }

    @Test
    void aBankSlowerByLessThanTheErrorStillMeetsItsTarget() {
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, figures(12.0, 12.8, 20.0, 0.0), List.of(), List.of(), 48);
        assertThat(s.targets().get(2).met()).isTrue();
        assertThat(s.targets().get(2).measured()).contains("less than the measurement error");
    }

    @Test
    void aMissingBaselineIsNamed() {
        assertThatThrownBy(() -> SuiteSummary.of("cmd", "full", MACHINE, List.of(), List.of(), List.of(), 48))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessage("benchmark UpdateBenchmark.bareRecurrence is missing from the results");
    }

    @Test
    void sweepTargetsReadTheMarginalStepAndTheSpeedUp() {
        List<JmhFigure> withSweep = new java.util.ArrayList<>(figures(12.0, 11.0, 20.0, 0.0));
        // 48 runs 9,000 steps longer cost 48 × 9,000 × 30 ns more: 30 ns per step against a 20 ns step, 1.5×
        withSweep.add(new JmhFigure(SuiteSummary.sweep(1_000, 1), 1e6, 1e3, 0.0));
        withSweep.add(new JmhFigure(SuiteSummary.sweep(10_000, 1), 1e6 + 48 * 9_000 * 30.0, 1e3, 0.0));
        withSweep.add(new JmhFigure(SuiteSummary.sweep(10_000, 2), (1e6 + 48 * 9_000 * 30.0) / 1.7, 1e3, 0.0));
        withSweep.add(new JmhFigure(SuiteSummary.SWEEP_STEP, 20.0, 0.5, 0.0));
        // the machine's ceiling: bare runs on the same pool pattern, 1.75× from 1 to 2 threads
        withSweep.add(new JmhFigure(SuiteSummary.bareRuns(1), 7e6, 1e3, 0.0));
        withSweep.add(new JmhFigure(SuiteSummary.bareRuns(2), 4e6, 1e3, 0.0));
        CommandTiming sweep = new CommandTiming("CLI sweep", 5.0, "sweep pump.yaml --runs 10000", 4.2, 0, 1.5);
        CommandTiming design = new CommandTiming("design with its defaults", 10.0, "design ...", 12.5, 0, 1.5);
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, withSweep, List.of(), List.of(sweep, design), 48);
        List<TargetCheck> targets = s.targets();
        assertThat(targets).hasSize(8);
        assertThat(targets.get(4).measured()).startsWith("30.00 ns per step");
        assertThat(targets.get(4).met()).isTrue();
        assertThat(targets.get(5).measured()).endsWith(": 1.70×; bare plant + controller runs on the same pool: 1.75×");
        assertThat(targets.get(5).met()).isFalse();
        assertThat(targets.get(6).met()).isTrue();
        assertThat(targets.get(7).target()).isEqualTo("design with its defaults under 10.0 s wall time, JVM start included");
        assertThat(targets.get(7).met()).isFalse();
        assertThat(s.benchmarks()).filteredOn(c -> c.figure().name().equals(SuiteSummary.sweep(10_000, 2)))
                .singleElement().extracting(Comparison::baseline).extracting(JmhFigure::name)
                .isEqualTo(SuiteSummary.sweep(10_000, 1));
    }

    @Test
    void aCommandThatFailsReadsAsFailedNotAsATiming() {
        CommandTiming broken = new CommandTiming("CLI sweep", 5.0, "sweep pump.yaml --runs 10000", 0.15, 1, 1.1);
        SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, figures(12.0, 11.0, 20.0, 0.0), List.of(),
                List.of(broken), 48);
        TargetCheck sweep = s.targets().stream().filter(t -> t.target().startsWith("CLI sweep")).findFirst().orElseThrow();
        assertThat(sweep.measured()).startsWith("FAILED with exit 1, so not a timing; 0.15 s");
        assertThat(sweep.met()).isFalse();
    }

    @Test
    void theSweepsFilesStandAloneAndAreReadInSeconds() {
        for (double seconds : new double[] {0.4, 1.1}) {
            List<JmhFigure> withFiles = new java.util.ArrayList<>(figures(12.0, 11.0, 20.0, 0.0));
            withFiles.add(new JmhFigure(SuiteSummary.SWEEP_FILES, seconds * 1e9, 0.05e9, Double.NaN));
            SuiteSummary s = SuiteSummary.of("cmd", "full", MACHINE, withFiles, List.of(), List.of(), 48);
            assertThat(s.benchmarks()).filteredOn(c -> c.figure().name().equals(SuiteSummary.SWEEP_FILES))
                    .singleElement().satisfies(c -> assertThat(c.ratio()).isEqualTo(1.0));
            TargetCheck files = s.targets().stream().filter(t -> t.target().startsWith("sweep: CSV, PNG and SVG"))
                    .findFirst().orElseThrow();
            assertThat(files.measured()).startsWith(String.format("%.3f s ± 0.050 s", seconds));
            assertThat(files.met()).isEqualTo(seconds < SuiteSummary.SWEEP_FILES_SECONDS);
        }
    }
}
