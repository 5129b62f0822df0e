package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.metrics.ResponseState;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.PlantParameters;
import org.loopwright.sim.plant.PlantType;
import org.loopwright.sim.plant.TankModel;
import org.loopwright.sim.plant.ThermalZoneModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

/** Sweeps of nonlinear plants: spread by their file keys, judged by the simulation alone. */
class NonlinearSweepTest {

    private static Scenario shipped(String name) throws Exception {
        return ScenarioFile.read(Path.of(NonlinearSweepTest.class.getResource("/scenarios/" + name).toURI()));
    }

    /**
     * Zero spread on every key named gives the nominal plant, and each run is the nominal {@code simulate}
     * run bit for bit: the same figures and the same measurement at every plotted sample. One shipped
     * scenario per nonlinear plant type: a motor with stick-slip friction, sensor noise and quantisation; the
     * tank behind a late sensor; a thermal zone under on-off control.
     */
    @ParameterizedTest
    @CsvSource(delimiter = ';', value = {
        "gimbal-axis.yaml; static-friction=0%,inertia=0%,coulomb-friction=0%",
        "tank-level-late-sensor.yaml; area=0%,outlet-coefficient=0%",
        "bath-thermostat.yaml; heat-capacity=0%,loss-coefficient=0%,max-power=0%"})
    void zeroSpreadRepeatsTheNominalSimulationExactly(String file, String spread) throws Exception {
        Scenario nominal = shipped(file);
        Trajectory expected = Simulation.run(nominal);
        ResponseMetrics expectedMetrics = ResponseMetrics.of(nominal, expected);

        SweepResult result = new Sweep(nominal, Spread.parse(spread), 5L).run(3, 2, index -> { });

        assertThat(result.stabilityBasis()).isEqualTo(StabilityBasis.SIMULATION);
        for (SweepRun run : result.runs()) {
            SweepTest.assertRepeatsTheNominal(run, nominal, expected, expectedMetrics);
            assertThat(run.stability()).isEqualTo(result.nominal().stability());
        }
        assertThat(result.nominal().metrics()).isEqualTo(expectedMetrics);
    }

    /**
     * The tank behind a late sensor, its area spread ±40 %: a smaller tank is faster against the same
     * delay and, past some area, the loop hunts (the pump's limits hold it to a limit cycle). Each run's
     * verdict, from the simulation alone, is checked against the poles of the loop linearised at the
     * setpoint level r = 1 m: A·dh/dt = q − k·√h gives K = 2√r/k and T = 2A√r/k (a first-order lag, the
     * same linearisation as tank-level-scheduled.yaml), with the scenario's PI controller, period and
     * 10-sample sensor delay. By Lyapunov's indirect method (e.g. Khalil, Nonlinear Systems, 3rd ed.,
     * Thm 4.7, from memory) a pole outside the unit circle makes the level's equilibrium unstable, so
     * the run must not settle: it is named oscillating. Poles well inside (below 0.99) make it locally
     * stable and the run settles. Between 0.99 and 1, a mode that loses less than a tenth of its swing
     * per cycle, the rule may call it oscillating by design (decay ratio ≥ 0.9).
     */
    @Test
    void aSpreadThatMakesTheLoopHuntIsNamedOscillatingWhereTheLinearisedPolesSaySo() throws Exception {
        Scenario nominal = shipped("tank-level-late-sensor.yaml");
        SweepResult result = new Sweep(nominal, Spread.parse("area=40%"), 7L).run(40, 2, index -> { });
        int oscillating = 0;
        int stable = 0;
        for (SweepRun run : result.runs()) {
            TankModel tank = (TankModel) run.plant();
            double level = 1.0;
            double gain = 2.0 * Math.sqrt(level) / tank.outletCoefficient();
            double timeConstant = 2.0 * tank.areaSquareMetres() * Math.sqrt(level) / tank.outletCoefficient();
            double pole = largestPoleMagnitude(nominal.withPlant(TransferFunction.fopdt(gain, timeConstant, 0.0)));
            String why = "area " + tank.areaSquareMetres() + ", linearised pole " + pole;
            if (pole > 1.0) {
                assertThat(run.stability()).as(why).isEqualTo(LoopStability.OSCILLATING);
            } else if (pole < 0.99) {
                assertThat(run.stability()).as(why).isEqualTo(LoopStability.STABLE);
            }
            if (run.stability() == LoopStability.OSCILLATING) {
                assertThat(run.decayRatio()).as(why).isGreaterThanOrEqualTo(SustainedOscillation.DECAY_RATIO_LIMIT);
                assertThat(run.settled()).as(why).isFalse();
                oscillating++;
            } else {
                stable++;
            }
        }
        assertThat(result.nominal().stability()).isEqualTo(LoopStability.STABLE);
        assertThat(oscillating).as("runs that hunt").isBetween(3, 37);
        assertThat(stable).as("runs that settle").isBetween(3, 37);
        assertThat(result.unstableShare()).isEqualTo(oscillating / 40.0);
        assertThat(result.worst().stability()).isEqualTo(LoopStability.OSCILLATING);
    }

    /**
     * A motor's speed loop, Coulomb friction and a 4-sample sensor delay, PI tuned near the edge, its inertia
     * spread ±50 %: a lighter rotor raises the loop gain and, past some inertia, the loop grows without bound.
     * While the speed keeps its sign the friction is a constant torque, so each run is the frictionless motor's
     * linear loop plus a bounded input: its largest closed-loop pole (computed on the same motor with the
     * friction removed, a linear model) says whether it grows. A pole beyond 1.015 grows by 10⁶ within ~930
     * samples (4.6 s of the 10 s run), past the divergence bound (10⁶ × the 50 rad/s setpoint, from 50 rad/s of
     * error): the run must be stopped as diverged. A pole below 0.99 decays: the run must settle, stable.
     * Diverged runs are counted as unstable and kept out of every distribution.
     */
    @Test
    void aNonlinearLoopThatGrowsWithoutBoundIsStoppedCountedAndKeptOutOfTheDistributions(@TempDir Path dir)
            throws Exception {
        Path file = dir.resolve("motor-speed.yaml");
        Files.writeString(file, """
                controller: {form: ideal, gain: 0.6, integral-time: 0.1, sample-period: 0.005}
                plant:
                  type: dc-motor
                  resistance: 1.0
                  inductance: 0.001
                  torque-constant: 0.1
                  back-emf-constant: 0.1
                  inertia: 0.001
                  viscous-friction: 0.0001
                  coulomb-friction: 0.01
                  static-friction: 0.01
                  output: speed
                  integration-step: 0.0005
                setpoint: [{at: 0.1, value: 50.0}]
                sensor: {delay-samples: 4}
                duration: 10
                """);
        Scenario nominal = ScenarioFile.read(file);
        SweepResult result = new Sweep(nominal, Spread.parse("inertia=50%"), 11L).run(40, 2, index -> { });

        assertThat(result.stabilityBasis()).isEqualTo(StabilityBasis.SIMULATION);
        int diverged = 0;
        List<SweepRun> kept = new ArrayList<>();
        for (SweepRun run : result.runs()) {
            DcMotorModel motor = (DcMotorModel) run.plant();
            DcMotorModel frictionless = new DcMotorModel(motor.resistanceOhms(), motor.inductanceHenries(),
                    motor.torqueConstant(), motor.backEmfConstant(), motor.inertia(), motor.viscousFriction(), 0.0,
                    0.0, 0.0, motor.output(), motor.integrationStepSeconds());
            double pole = Sweep.largestPoleMagnitude(nominal.withPlant(frictionless));
            String why = "inertia " + motor.inertia() + ", pole " + pole;
            if (pole > 1.015) {
                assertThat(run.stability()).as(why).isEqualTo(LoopStability.DIVERGED);
            } else if (pole < 0.99) {
                assertThat(run.stability()).as(why).isEqualTo(LoopStability.STABLE);
                assertThat(run.settled()).as(why).isTrue();
            }
            if (run.stability() == LoopStability.DIVERGED) {
                assertThat(run.metrics().state()).as(why).isEqualTo(ResponseState.DIVERGED);
                assertThat(run.metrics().overshootPercent()).as(why).isNaN();
                assertThat(run.metrics().iae()).as(why).isNaN();
                diverged++;
            } else {
                kept.add(run);
            }
        }
        assertThat(diverged).as("runs stopped as diverged").isBetween(5, 35);
        assertThat(result.divergedShare()).isEqualTo(diverged / 40.0);
        assertThat(result.unstableShare()).isGreaterThanOrEqualTo(diverged / 40.0);
        assertThat(result.worst().stability()).isEqualTo(LoopStability.DIVERGED);
        assertThat(result.nominal().stability()).isEqualTo(LoopStability.STABLE);
        // the distributions are those of the runs that were not stopped, as if the diverged ones were never drawn
        assertThat(result.iae()).isEqualTo(Distribution.of(kept.stream().mapToDouble(r -> r.metrics().iae()).toArray()));
        assertThat(result.iae().count()).isEqualTo(kept.size());
        assertThat(result.overshootPercent()).isEqualTo(Distribution.of(
                kept.stream().mapToDouble(r -> r.metrics().overshootPercent()).toArray()));
    }

    private static double largestPoleMagnitude(Scenario linear) {
        double largest = 0.0;
        for (Complex pole : LoopAnalysis.closedLoopPoles(LoopAnalysis.sampledLoop(linear.sampledLoop().orElseThrow()))) {
            largest = Math.max(largest, pole.norm());
        }
        return largest;
    }

    @Test
    void eachRunScalesTheNominalParametersByItsDrawnFactors() throws Exception {
        Scenario nominal = shipped("gimbal-axis.yaml");
        Sweep sweep = new Sweep(nominal, Spread.parse("inertia=10%,viscous-friction=50%"), 3L);
        for (int i = 0; i < 20; i++) {
            PlantDraw draw = sweep.draw(i);
            assertThat(draw.factor("inertia")).isBetween(0.9, 1.1);
            assertThat(draw.factor("viscous-friction")).isBetween(0.5, 1.5);
            assertThat(draw.factors().keySet()).containsOnly("inertia", "viscous-friction");
            var drawn = sweep.scenario(i).plant();
            for (var key : PlantType.DC_MOTOR.spreadKeys()) {
                assertThat(PlantParameters.value(drawn, key)).as(key.word())
                        .isEqualTo(PlantParameters.value(nominal.plant(), key) * draw.factor(key.word()));
            }
        }
    }

    @Test
    void aSpreadWhoseExtremesTheModelRefusesIsNamedBeforeAnyRun() throws Exception {
        // the gimbal's static friction equals its Coulomb friction: any lower static friction is refused
        Scenario gimbal = shipped("gimbal-axis.yaml");
        assertThatThrownBy(() -> new Sweep(gimbal, Spread.parse("static-friction=30%"), 1L))
                .isInstanceOf(InputException.class)
                .hasMessage("--spread static-friction=30% can draw a dc-motor the model refuses: static-friction must"
                        + " be >= coulomb-friction (coulomb-friction=0.05): static-friction=" + 0.05 * 0.7
                        + ", at static-friction x0.7; narrow the spread or change the nominal values");
    }

    @Test
    void aParameterAFactorCannotMoveIsRefused() throws Exception {
        Scenario gimbal = shipped("gimbal-axis.yaml");
        assertThatThrownBy(() -> new Sweep(gimbal, Spread.parse("load-torque=10%"), 1L))
                .isInstanceOf(InputException.class)
                .hasMessage("--spread load-torque cannot vary on plant type dc-motor: its nominal value is 0.0 and a"
                        + " spread multiplies it; give the scenario a finite non-zero load-torque");
        ControllerSettings pi = ControllerSettings.builder().gains(IdealGains.pi(100.0, 600.0))
                .samplePeriodSeconds(1.0).build();
        Scenario unlimitedHeater = Scenario.setpointStep(
                new ThermalZoneModel(21_000, 5, 20, Double.POSITIVE_INFINITY, 1.0), pi, 40.0, 600.0);
        assertThatThrownBy(() -> new Sweep(unlimitedHeater, Spread.parse("max-power=10%"), 1L))
                .isInstanceOf(InputException.class)
                .hasMessage("--spread max-power cannot vary on plant type thermal-zone: its nominal value is Infinity"
                        + " and a spread multiplies it; give the scenario a finite non-zero max-power");
    }
}
