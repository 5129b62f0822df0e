package org.loopwright.bench;

import java.util.concurrent.TimeUnit;

import org.loopwright.pid.PidController;
import org.loopwright.pid.monitor.LoopCondition;
import org.loopwright.pid.monitor.LoopMonitor;
import org.loopwright.pid.monitor.MonitorSettings;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The loop monitor's cost per sample beside the controller update it watches (target: no more than
 * the update), and the two together as a loop would run them. The monitor watches the bath heater's
 * workload: setpoint steps, a measurement swinging around them and the outputs the full-featured
 * controller gave, so excursions open and close, idle evaluations run and the output hits its limits.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Thread)
public class MonitorBenchmark {

    private PidController controller;
    private LoopMonitor monitor;
    private double[] setpoints;
    private double[] measurements;
    private double[] outputs;
    private int k;

    /** Builds the controller, the monitor and the recorded outputs. */
    @Setup
    public void setUp() {
        setpoints = Workloads.setpoints();
        measurements = Workloads.measurements(3);
        PidController recorder = new PidController(Workloads.fullFeatured());
        outputs = new double[Workloads.LENGTH];
        for (int i = 0; i < outputs.length; i++) {
            outputs[i] = recorder.update(setpoints[i], measurements[i]);
        }
        controller = new PidController(Workloads.fullFeatured());
        monitor = new LoopMonitor(MonitorSettings.builder().samplePeriodSeconds(Workloads.PERIOD_SECONDS)
                .timeScaleSeconds(Workloads.BATH_GAINS.integralTime()).acceptableAmplitude(0.5)
                .outputRange(0.0, 100.0).build());
    }

    /** The full-featured update alone: the yardstick. */
    @Benchmark
    public double update() {
        int i = k++ & Workloads.MASK;
        return controller.update(setpoints[i], measurements[i]);
    }

    /** One monitor sample with a recorded output. */
    @Benchmark
    public int monitorSample() {
        int i = k++ & Workloads.MASK;
        monitor.sample(setpoints[i], measurements[i], outputs[i], true);
        return monitor.status(LoopCondition.OSCILLATION).ordinal();
    }

    /** The update and the monitor sample of the same tick. */
    @Benchmark
    public double updateAndSample() {
        int i = k++ & Workloads.MASK;
        double u = controller.update(setpoints[i], measurements[i]);
        monitor.sample(setpoints[i], measurements[i], u, true);
        return u;
    }
}
