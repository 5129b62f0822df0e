package org.loopwright.sim.assess;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.monitor.ConditionStatus;
import org.loopwright.pid.monitor.LoopCondition;
import org.loopwright.pid.monitor.LoopMonitor;
import org.loopwright.pid.monitor.MonitorSettings;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.MotorOutput;
import org.loopwright.sim.plant.Plant;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.replay.LoggedLoop;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.simulate.Simulation;

/**
 * The assessment on loops built from the harness's own plants, where the cause of the trouble is known
 * because we put it there.
 */
class LoopAssessmentTest {

    private static final TransferFunction FOPDT = TransferFunction.fopdt(1.0, 10.0, 2.0);
    private static final double H = 0.1;

    /** Load steps at irregular times (so the error has no period of their making), alternating in sign. */
    private static LoadStep[] loads(double size) {
        double[] at = {50, 170, 330, 420, 610, 700, 890, 1010, 1230, 1340};
        LoadStep[] steps = new LoadStep[at.length];
        for (int i = 0; i < at.length; i++) {
            steps[i] = new LoadStep(at[i], i % 2 == 0 ? size : -size);
        }
        return steps;
    }

    private static ControllerSettings pi(double gain, double integralTime, double h, double min, double max) {
        return ControllerSettings.builder().gains(IdealGains.pi(gain, integralTime)).samplePeriodSeconds(h)
                .outputRange(min, max).build();
    }

    /** Monitor settings as Hägglund (1995) suggests when Tu is not known: T = Ti. */
    private static MonitorSettings monitor(ControllerSettings c, double amplitude) {
        return MonitorSettings.builder().samplePeriodSeconds(c.samplePeriodSeconds())
                .timeScaleSeconds(c.gains().toParallel().toIdeal().integralTime()).acceptableAmplitude(amplitude)
                .outputRange(c.outputMin(), c.outputMax()).build();
    }

    private static Assessment assess(Scenario scenario, double amplitude, ProcessKind kind) {
        ControllerSettings c = scenario.controller().orElseThrow();
        return LoopAssessment.of(LoggedLoop.of("test", Simulation.run(scenario)),
                new AssessmentOptions(monitor(c, amplitude), Double.NaN, kind, false, List.of()));
    }

    /**
     * A DC motor position loop under PI whose static friction (0.02 N·m) exceeds its Coulomb friction
     * (0.01 N·m): stuck, the integral winds the voltage up until the torque breaks the static
     * friction; the motor then slips past the setpoint and sticks again — the stick-slip hunting of a
     * sticking drive (common practice). A little sensor noise, as any encoder reading through a filter has.
     */
    @Test
    void aStickingDriveHuntsAndIsFlaggedForOscillationAndStiction() {
        DcMotorModel motor = new DcMotorModel(1.0, 0.001, 0.1, 0.1, 0.001, 1e-4, 0.0, 0.01, 0.02,
                MotorOutput.POSITION, 1e-4);
        Scenario scenario = Scenario.builder().plant(motor).controller(pi(2.0, 1.0, 0.005, -12.0, 12.0))
                .setpoint(SetpointChange.step(0.1, 1.0)).sensor(new SensorModel(0.0005, 0.0, 0, 0.0, 0.0))
                .durationSeconds(200.0).build();
        Assessment a = assess(scenario, 0.005, ProcessKind.POSITION_DRIVE);
        assertThat(a.status("oscillation")).isEqualTo(FindingStatus.ALARM);
        assertThat(a.status("stiction")).isEqualTo(FindingStatus.ALARM);
        assertThat(a.status("frozen-measurement")).isEqualTo(FindingStatus.OK);
        // the same loop declared integrating: the test does not apply (Horch 1999 excludes it)
        ControllerSettings c = scenario.controller().orElseThrow();
        Assessment integrating = LoopAssessment.of(LoggedLoop.of("test", Simulation.run(scenario)),
                new AssessmentOptions(monitor(c, 0.005), Double.NaN, ProcessKind.INTEGRATING, false, List.of()));
        assertThat(integrating.status("stiction")).isEqualTo(FindingStatus.NOT_ASSESSED);
    }

    /**
     * PI with Ti = T on the FOPDT plant 1/(10s + 1)·e^−2s, its gain set for a gain margin of 1.1 on the
     * sampled loop, load steps to excite it: the loop rings at the frequency of its dominant closed-loop
     * poles z = r·e^(±jθ), period 2πh/θ (Åström &amp; Wittenmark 1997, ch. 2: a pole pair at angle θ is a
     * sampled oscillation of frequency θ/h). No friction anywhere: the stiction test must say even.
     */
    @Test
    void anAggressivePiOscillatesAtItsDominantPolesPeriodWithoutStiction() {
        ControllerSettings unit = pi(1.0, 10.0, H, -100.0, 100.0);
        double gainMargin = LoopAnalysis.sampled(SampledLoop.of(FOPDT, unit)).margins().phaseCrossover().orElseThrow().gainMargin();
        ControllerSettings aggressive = pi(gainMargin / 1.1, 10.0, H, -100.0, 100.0);
        Complex dominant = LoopAnalysis.sampled(SampledLoop.of(FOPDT, aggressive)).closedLoopPoles().stream()
                .filter(p -> p.getImaginary() > 1e-9).max((x, y) -> Double.compare(x.norm(), y.norm())).orElseThrow();
        double polePeriod = 2.0 * Math.PI * H / dominant.getArgument();

        Assessment a = assess(Scenario.builder().plant(FOPDT).controller(aggressive).setpoint(SetpointChange.step(0, 0))
                .disturbance(loads(1.0)).durationSeconds(1500.0).build(), 0.1, ProcessKind.SELF_REGULATING);
        assertThat(a.status("oscillation")).isEqualTo(FindingStatus.ALARM);
        assertThat(a.oscillationPeriodSeconds()).isCloseTo(polePeriod, within(0.05 * polePeriod));
        assertThat(a.status("stiction")).isEqualTo(FindingStatus.OK);
    }

    /** PI at a tenth of the SIMC gain (Skogestad 2003: Kc = T/(K(τc + θ)) = 2.5 with τc = θ; Ti = 10 s). */
    @Test
    void aVeryCautiousPiIsSluggishAfterLoadSteps() {
        Assessment a = assess(Scenario.builder().plant(FOPDT).controller(pi(0.25, 10.0, H, -100.0, 100.0))
                .setpoint(SetpointChange.step(0, 0)).disturbance(loads(1.0)).durationSeconds(1500.0).build(),
                0.1, ProcessKind.SELF_REGULATING);
        assertThat(a.status("sluggish")).isEqualTo(FindingStatus.ALARM);
        assertThat(a.finding("sluggish").orElseThrow().value()).isGreaterThan(0.4);
    }

    /** The SIMC PI itself (Skogestad 2003, τc = θ), load steps and white sensor noise: nothing to report. */
    @Test
    void aSimcTunedLoopWithLoadStepsAndNoiseFlagsNothing() {
        Assessment a = assess(Scenario.builder().plant(FOPDT).controller(pi(2.5, 10.0, H, -100.0, 100.0))
                .setpoint(SetpointChange.step(0, 0)).disturbance(loads(1.0))
                .sensor(new SensorModel(0.02, 0.0, 0, 0.0, 0.0)).durationSeconds(1500.0).build(),
                0.1, ProcessKind.SELF_REGULATING);
        assertThat(a.flagged()).isEmpty();
        assertThat(a.status("sluggish")).isEqualTo(FindingStatus.OK);
        assertThat(a.finding("noise").orElseThrow().value()).isCloseTo(0.02, within(0.004));
    }

    /** The SIMC PI held against a limit: the output cannot reach what the setpoint needs (8 > 5). */
    @Test
    void aLoopHeldAgainstItsOutputLimitIsFlaggedSaturated() {
        Assessment a = assess(Scenario.builder().plant(FOPDT).controller(pi(2.5, 10.0, H, 0.0, 5.0))
                .setpoint(SetpointChange.step(0, 8.0)).durationSeconds(500.0).build(), 0.1, ProcessKind.SELF_REGULATING);
        assertThat(a.status("saturation")).isEqualTo(FindingStatus.ALARM);
        assertThat(a.finding("saturation").orElseThrow().value()).isGreaterThan(90.0);
    }

    /**
     * The SIMC loop on the harness's FOPDT plant, stepped by hand so the sensor can freeze: from sample
     * 3000 the controller sees the last good reading, and at the same moment the setpoint rises, so the
     * output moves. The monitor must flag it within N samples of the freeze (common practice).
     */
    @Test
    void aSensorThatFreezesIsFlaggedWithinTheConfiguredSamples() {
        int n = 50;
        int freezeAt = 3000;
        ControllerSettings c = pi(2.5, 10.0, H, -100.0, 100.0);
        PidController controller = new PidController(c);
        Plant plant = FOPDT.newPlant();
        int length = 4000;
        double[] t = new double[length];
        double[] r = new double[length];
        double[] y = new double[length];
        double[] u = new double[length];
        boolean[] auto = new boolean[length];
        java.util.Random noise = new java.util.Random(3);
        LoopMonitor monitor = new LoopMonitor(MonitorSettings.builder().samplePeriodSeconds(H).timeScaleSeconds(10.0)
                .acceptableAmplitude(0.1).outputRange(-100.0, 100.0).frozenSamples(n).build());
        int flaggedAt = -1;
        for (int k = 0; k < length; k++) {
            t[k] = k * H;
            r[k] = k < freezeAt ? 1.0 : 2.0;
            y[k] = k < freezeAt ? plant.output() + 0.01 * noise.nextGaussian() : y[freezeAt - 1];
            u[k] = controller.update(r[k], y[k]);
            auto[k] = true;
            plant.advance(u[k], H);
            monitor.sample(r[k], y[k], u[k], true);
            if (flaggedAt < 0 && monitor.status(LoopCondition.FROZEN_MEASUREMENT) == ConditionStatus.ALARM) {
                flaggedAt = k;
            }
        }
        assertThat(flaggedAt - freezeAt + 1).isBetween(1, n);
        Assessment a = LoopAssessment.of(LoggedLoop.of("frozen", t, r, y, u, auto),
                new AssessmentOptions(monitor.settings(), Double.NaN, ProcessKind.SELF_REGULATING, false, List.of()));
        assertThat(a.status("frozen-measurement")).isEqualTo(FindingStatus.ALARM);
        assertThat(a.flagged()).doesNotContain("oscillation");
    }
}
