package org.loopwright.bench;

import java.util.concurrent.TimeUnit;

import org.loopwright.pid.PidController;
import org.loopwright.sim.plant.LinearPlant;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.simulate.ClosedLoop;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * One closed-loop simulation step: the bath as first order plus dead time (K = 0.5 °C/%, T = 60 s,
 * L = 3 s, stepped exactly by its zero-order-hold discretisation) advanced one period with the held
 * output, then the full-featured controller updated on the new temperature. Beside it, one step of
 * the harness's {@link ClosedLoop} (setpoint profile, sensor, actuator and trajectory included).
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Thread)
public class SimulationStepBenchmark {

    /** The bath plant: K = 0.5 °C per % heater power, T = 60 s, L = 3 s. */
    public static final TransferFunction BATH = TransferFunction.fopdt(0.5, 60.0, 3.0);

    private LinearPlant plant;
    private PidController controller;
    private ClosedLoop harness;
    private double[] setpoints;
    private double output;
    private int k;

    /** Builds the plant, the controller and the harness loop. */
    @Setup
    public void setUp() {
        plant = new LinearPlant(BATH);
        controller = new PidController(Workloads.fullFeatured());
        setpoints = Workloads.setpoints();
        harness = new ClosedLoop(Scenario.builder().plant(BATH).controller(Workloads.fullFeatured())
                .setpoint(SetpointChange.step(0.0, 50.0), new SetpointChange(3000.0, 60.0, 0.0))
                .durationSeconds(6000.0).build());
    }

    /** Plant advanced one period, then the controller updated: one sample of the loop. */
    @Benchmark
    public double plantAndController() {
        plant.advance(output, Workloads.PERIOD_SECONDS);
        output = controller.update(setpoints[k++ & Workloads.MASK], plant.output());
        return output;
    }

    /** One step of the harness's closed loop, rewound to sample 0 when its scenario ends. */
    @Benchmark
    public double harnessStep() {
        if (!harness.step()) {
            harness.rewind();
            harness.step();
        }
        return harness.samplesTaken();
    }
}
