package org.loopwright.bench;

import java.util.concurrent.TimeUnit;

import org.loopwright.pid.PidController;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * One full-featured update per discretisation of the integral and of the filtered derivative. The
 * coefficients are computed once at build, so every pair is expected to cost the same.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Thread)
public class DiscretisationBenchmark {

    /** The integral's discretisation. */
    @Param({"FORWARD_EULER", "BACKWARD_EULER", "TUSTIN"})
    public IntegralMethod integralMethod;

    /** The filtered derivative's discretisation (forward Euler is valid here: h = 0.1 s &lt; 2·Tf = 1 s). */
    @Param({"BACKWARD_EULER", "TUSTIN", "STEP_INVARIANT", "RAMP_INVARIANT", "FORWARD_EULER"})
    public DerivativeMethod derivativeMethod;

    private PidController controller;
    private double[] setpoints;
    private double[] measurements;
    private int k;

    /** Builds the controller and its inputs. */
    @Setup
    public void setUp() {
        controller = new PidController(Workloads.fullFeatured(Workloads.BATH_GAINS, integralMethod, derivativeMethod));
        setpoints = Workloads.setpoints();
        measurements = Workloads.measurements(2);
    }

    /** One update. */
    @Benchmark
    public double update() {
        int i = k++ & Workloads.MASK;
        return controller.update(setpoints[i], measurements[i]);
    }
}
