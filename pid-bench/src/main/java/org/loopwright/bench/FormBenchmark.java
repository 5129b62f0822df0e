package org.loopwright.bench;

import java.util.concurrent.TimeUnit;

import org.loopwright.pid.PidController;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ControllerForm;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/** One full-featured update with the bath gains given in each form (the same controller three ways). */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Thread)
public class FormBenchmark {

    /** The form the gains are given in. */
    @Param({"PARALLEL", "IDEAL", "SERIES"})
    public ControllerForm form;

    private PidController controller;
    private double[] setpoints;
    private double[] measurements;
    private int k;

    /** Builds the controller and its inputs. */
    @Setup
    public void setUp() {
        controller = new PidController(Workloads.fullFeatured(Workloads.gainsIn(form), IntegralMethod.TUSTIN,
                DerivativeMethod.BACKWARD_EULER));
        setpoints = Workloads.setpoints();
        measurements = Workloads.measurements(1);
    }

    /** One update. */
    @Benchmark
    public double update() {
        int i = k++ & Workloads.MASK;
        return controller.update(setpoints[i], measurements[i]);
    }
}
