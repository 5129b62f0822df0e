package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

class SweepTest {

    private static Scenario shipped(String name) throws Exception {
        return ScenarioFile.read(Path.of(SweepTest.class.getResource("/scenarios/" + name).toURI()));
    }

    private static ControllerSettings proportional(double kc, double periodSeconds) {
        return ControllerSettings.builder().gains(new ParallelGains(kc, 0.0, 0.0)).samplePeriodSeconds(periodSeconds)
                .build();
    }

    @Test
    void zeroSpreadRepeatsTheNominalSimulationExactly() throws Exception {
        // the booster pump has dead time, derivative action and a load step: every part of the loop is exercised
        Scenario nominal = shipped("booster-pump.yaml");
        Trajectory expected = Simulation.run(nominal);
        ResponseMetrics expectedMetrics = ResponseMetrics.of(nominal, expected);

        SweepResult result = new Sweep(nominal, Spread.NONE, 99L).run(6, 2, index -> { });

        assertThat(result.runs()).hasSize(6);
        for (SweepRun run : result.runs()) {
            assertRepeatsTheNominal(run, nominal, expected, expectedMetrics);
            assertThat(run.plot().time(run.plot().length() - 1)).isEqualTo(expected.time(expected.length() - 1));
        }
        assertThat(result.nominal().metrics()).isEqualTo(expectedMetrics);
    }

    @Test
    void sameSeedGivesTheSameRunsOnOneAndOnTwoThreads() throws Exception {
        Scenario nominal = shipped("booster-pump.yaml");
        Spread spread = Spread.parse("gain=30%,time-constant=20%,dead-time=40%");
        SweepResult one = new Sweep(nominal, spread, 42L).run(24, 1, index -> { });
        SweepResult two = new Sweep(nominal, spread, 42L).run(24, 2, index -> { });
        for (int i = 0; i < 24; i++) {
            SweepRun a = one.runs().get(i);
            SweepRun b = two.runs().get(i);
            assertThat(b.index()).isEqualTo(a.index()).isEqualTo(i);
            assertThat(b.draw()).isEqualTo(a.draw());
            assertThat(b.plant()).isEqualTo(a.plant());
            assertThat(b.metrics()).isEqualTo(a.metrics());
            assertThat(b.stability()).isEqualTo(a.stability());
            assertThat(b.largestPoleMagnitude()).isEqualTo(a.largestPoleMagnitude());
            assertThat(b.plot().measurements()).isEqualTo(a.plot().measurements());
        }
        assertThat(one.runs().stream().map(SweepRun::draw).distinct()).as("the draws differ from run to run")
                .hasSize(24);
        SweepResult otherSeed = new Sweep(nominal, spread, 43L).run(1, 1, index -> { });
        assertThat(otherSeed.runs().get(0).draw()).isNotEqualTo(one.runs().get(0).draw());
    }

    @Test
    void theSweepsControllerMadeOnceGivesEachRunThePolesOfItsOwnScenario() throws Exception {
        // a sweep makes C(z) once for all its runs; a run's figure must be the one its scenario alone gives
        Scenario nominal = shipped("booster-pump.yaml").withDuration(20.0);
        Sweep sweep = new Sweep(nominal, Spread.parse("gain=30%,time-constant=20%,dead-time=40%"), 11L);
        SweepResult result = sweep.run(20, 2, index -> { });
        for (SweepRun run : result.runs()) {
            assertThat(run.largestPoleMagnitude()).as("run %d", run.index())
                    .isEqualTo(Sweep.largestPoleMagnitude(sweep.scenario(run.index()))).isBetween(0.0, 1.0);
        }
        assertThat(result.nominal().largestPoleMagnitude()).isEqualTo(Sweep.largestPoleMagnitude(nominal));
    }

    @Test
    void runsOfOneRunnerShareTheirPlotInstants() throws Exception {
        Scenario nominal = shipped("booster-pump.yaml").withDuration(20.0);
        SweepResult result = new Sweep(nominal, Spread.parse("gain=30%,dead-time=40%"), 5L)
                .run(2 * Sweep.RUNS_PER_RUNNER - 1, 1, index -> { });
        List<PlotTrace> plots = new ArrayList<>();
        plots.add(result.nominal().plot());
        result.runs().forEach(run -> plots.add(run.plot()));
        for (int i = 0; i < plots.size(); i++) {
            assertThat(plots.get(i).times()).isEqualTo(plots.get(0).times());
            // the nominal run and the next 49 on the first runner, the rest on the second
            assertThat(plots.get(i).sharesTimesWith(plots.get(0))).as("run %d", i - 1)
                    .isEqualTo(i < Sweep.RUNS_PER_RUNNER);
            assertThat(plots.get(i).sharesTimesWith(plots.get(plots.size() - 1))).as("run %d", i - 1)
                    .isEqualTo(i >= Sweep.RUNS_PER_RUNNER);
        }
    }

    @Test
    void aThreadsFreshRunnersGiveTheSameRunsAsOneThread() throws Exception {
        // 2.5 runners' worth of runs on one thread, against three threads that renew their runners at other indices
        Scenario nominal = shipped("booster-pump.yaml").withDuration(20.0);
        Spread spread = Spread.parse("gain=30%,time-constant=20%,dead-time=40%");
        int runs = Sweep.RUNS_PER_RUNNER * 5 / 2;
        SweepResult one = new Sweep(nominal, spread, 5L).run(runs, 1, index -> { });
        SweepResult three = new Sweep(nominal, spread, 5L).run(runs, 3, index -> { });
        for (int i = 0; i < runs; i++) {
            SweepRun a = one.runs().get(i);
            SweepRun b = three.runs().get(i);
            assertThat(b.metrics()).isEqualTo(a.metrics());
            assertThat(b.largestPoleMagnitude()).isEqualTo(a.largestPoleMagnitude());
            assertThat(b.plot().measurements()).isEqualTo(a.plot().measurements());
        }
    }

    @Test
    void drawsStayWithinTheSpreadAndCoverIt() {
        Scenario nominal = Scenario.setpointStep(TransferFunction.fopdt(2.0, 10.0, 1.0), proportional(0.5, 0.1),
                1.0, 10.0);
        Sweep sweep = new Sweep(nominal, Spread.parse("gain=20%, dead-time=50%"), 5L);
        double lowest = Double.POSITIVE_INFINITY;
        double highest = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < 2_000; i++) {
            PlantDraw draw = sweep.draw(i);
            assertThat(draw.factor("gain")).isBetween(0.8, 1.2);
            assertThat(draw.factor("time-constant")).isEqualTo(1.0);
            assertThat(draw.factor("dead-time")).isBetween(0.5, 1.5);
            lowest = Math.min(lowest, draw.factor("gain"));
            highest = Math.max(highest, draw.factor("gain"));
        }
        // uniform on [0.8, 1.2]: 2000 draws come within 0.002 of each end unless P = (1 - 0.005)^2000 ~ 4e-5
        assertThat(lowest).isLessThan(0.802);
        assertThat(highest).isGreaterThan(1.198);
    }

    /**
     * P control Kc on K/(Ts+1) leaves a steady-state error of r/(1 + Kc·K) after a set-point step r (final
     * value theorem, e.g. Åström &amp; Murray, Feedback Systems, 2nd ed., 2021, §6.3; from memory). The
     * zero-order-hold equivalent keeps the static gain K, so the sampled loop settles at the same value.
     */
    @Test
    void steadyStateErrorOfPControlFollowsEachDrawnGain() {
        double kc = 2.0;
        Scenario nominal = Scenario.setpointStep(TransferFunction.firstOrder(1.0, 1.0), proportional(kc, 0.01),
                1.0, 30.0);
        SweepResult result = new Sweep(nominal, Spread.parse("gain=60%,time-constant=50%"), 11L)
                .run(40, 2, index -> { });
        for (SweepRun run : result.runs()) {
            double k = ((TransferFunction) run.plant()).staticGain();
            assertThat(k).isCloseTo(run.draw().factor("gain"), within(1e-15));
            assertThat(run.metrics().steadyStateError()).as("run %d, K = %s", run.index(), k)
                    .isCloseTo(1.0 / (1.0 + kc * k), within(1e-9));
            assertThat(run.stability()).isEqualTo(LoopStability.STABLE);
        }
        assertThat(result.unstableShare()).isZero();
        assertThat(result.notSettledShare()).isZero();
    }

    /**
     * P control with loop gain K on 1/(s+1)³: the characteristic polynomial s³ + 3s² + 3s + 1 + K is
     * Hurwitz iff 9 > 1 + K (Routh–Hurwitz), so the loop is unstable for K ≥ 8 (Åström &amp; Murray 2021,
     * the standard third-order-lag example; the margins test uses the same fact). Sampled at h = 0.001 s the
     * boundary moves just below 8 (7.988 by SciPy's matrix exponential and eigenvalues, computed when this
     * test was written), so runs with K within 0.05 of 8 are not judged.
     */
    @Test
    void unstableRunsAreExactlyThoseBeyondTheRouthHurwitzBoundary() {
        TransferFunction lag = new TransferFunction(new double[] {8.0}, new double[] {1.0, 3.0, 3.0, 1.0}, 0.0);
        Scenario nominal = Scenario.setpointStep(lag, proportional(1.0, 0.001), 1.0, 20.0);
        SweepResult result = new Sweep(nominal, Spread.parse("gain=60%"), 3L).run(60, 2, index -> { });
        int judged = 0;
        int analyticUnstable = 0;
        for (SweepRun run : result.runs()) {
            double loopGain = ((TransferFunction) run.plant()).staticGain();
            if (Math.abs(loopGain - 8.0) < 0.05) {
                continue;
            }
            judged++;
            boolean unstable = loopGain > 8.0;
            analyticUnstable += unstable ? 1 : 0;
            assertThat(run.stability()).as("run %d, loop gain %s", run.index(), loopGain)
                    .isEqualTo(unstable ? LoopStability.UNSTABLE : LoopStability.STABLE);
            if (unstable) {
                assertThat(run.settled()).isFalse();
            }
        }
        assertThat(judged).as("runs away from the boundary").isEqualTo(result.runs().size());
        assertThat(analyticUnstable).as("both sides are drawn").isBetween(10, 50);
        assertThat(result.unstableShare()).isEqualTo((double) analyticUnstable / result.runs().size());
        assertThat(result.worst().stability()).isEqualTo(LoopStability.UNSTABLE);
    }

    @Test
    void factorsScaleTheProcessModelsParameters() {
        PlantDraw draw = new PlantDraw(Map.of("gain", 1.5, "time-constant", 0.8, "dead-time", 1.25));
        assertClose(draw.apply(TransferFunction.fopdt(2.0, 10.0, 4.0)), TransferFunction.fopdt(3.0, 8.0, 5.0));
        assertClose(draw.apply(TransferFunction.sopdt(2.0, 10.0, 3.0, 1.0)),
                TransferFunction.sopdt(3.0, 8.0, 2.4, 1.25));
        assertClose(draw.apply(TransferFunction.sopdtOscillatory(2.0, 4.0, 0.3, 0.0)),
                TransferFunction.sopdtOscillatory(3.0, 5.0, 0.3, 0.0));
        // an integrator has no time constant: K/s keeps K; a lag beside it is scaled
        assertClose(draw.apply(TransferFunction.integrating(0.5, 2.0)), TransferFunction.integrating(0.75, 2.5));
        assertClose(draw.apply(new TransferFunction(new double[] {1.0}, new double[] {5.0, 1.0, 0.0}, 0.0)),
                new TransferFunction(new double[] {1.5}, new double[] {4.0, 1.0, 0.0}, 0.0));
    }

    private static void assertClose(TransferFunction actual, TransferFunction expected) {
        // compare after making the denominators monic, so equal models written differently agree
        double a = actual.denominator()[0];
        double e = expected.denominator()[0];
        assertThat(actual.denominator().length).isEqualTo(expected.denominator().length);
        assertThat(actual.numerator().length).isEqualTo(expected.numerator().length);
        for (int i = 0; i < actual.denominator().length; i++) {
            assertThat(actual.denominator()[i] / a).isCloseTo(expected.denominator()[i] / e, within(1e-12));
        }
        for (int i = 0; i < actual.numerator().length; i++) {
            assertThat(actual.numerator()[i] / a).isCloseTo(expected.numerator()[i] / e, within(1e-12));
        }
        assertThat(actual.deadTimeSeconds()).isCloseTo(expected.deadTimeSeconds(), within(1e-12));
    }

    @Test
    void aLinearPlantRefusesANonlinearPlantsKey() {
        Scenario nominal = Scenario.setpointStep(TransferFunction.firstOrder(1.0, 1.0), proportional(1.0, 0.1),
                1.0, 10.0);
        assertThatThrownBy(() -> new Sweep(nominal, Spread.parse("inertia=10%"), 1L))
                .isInstanceOf(InputException.class)
                .hasMessage("--spread key inertia is not a parameter of plant type transfer-function: use gain,"
                        + " time-constant or dead-time");
    }

    @Test
    void worstRunRanksUnstableThenUnsettledThenIae() {
        Scenario nominal = Scenario.setpointStep(TransferFunction.firstOrder(1.0, 1.0), proportional(1.0, 0.1),
                1.0, 10.0);
        SweepResult stable = new Sweep(nominal, Spread.parse("gain=50%"), 8L).run(20, 2, index -> { });
        double largestIae = stable.runs().stream().mapToDouble(r -> r.metrics().iae()).max().orElseThrow();
        assertThat(stable.worst().metrics().iae()).isEqualTo(largestIae);
        assertThat(stable.iae().max()).isEqualTo(largestIae);
    }

    /** A run at zero spread: the nominal plant, its metrics, and its plot the nominal trajectory thinned. */
    static void assertRepeatsTheNominal(SweepRun run, Scenario nominal, Trajectory expected,
            ResponseMetrics expectedMetrics) {
        assertThat(run.draw()).isEqualTo(PlantDraw.NOMINAL);
        assertThat(run.plant()).isEqualTo(nominal.plant());
        assertThat(run.metrics()).as("run %d", run.index()).isEqualTo(expectedMetrics);
        double[] times = run.plot().times();
        double[] measured = run.plot().measurements();
        int stride = (expected.length() + Sweep.PLOT_POINTS - 1) / Sweep.PLOT_POINTS;
        for (int i = 0; i < times.length; i++) {
            int k = Math.min(i * stride, expected.length() - 1);
            assertThat(times[i]).isEqualTo(expected.time(k));
            assertThat(measured[i]).isEqualTo(expected.measurement(k));
        }
    }
}
