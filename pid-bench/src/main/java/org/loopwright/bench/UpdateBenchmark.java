package org.loopwright.bench;

import java.util.concurrent.TimeUnit;

import org.loopwright.pid.PidController;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The full-featured update (filter, weights, limits, slew, back-calculation) beside its limit, the
 * {@link BareRecurrence} on the same inputs, and the variable-period update, in one run so the
 * ratios compare like with like.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Thread)
public class UpdateBenchmark {

    private PidController fixedPeriod;
    private PidController variablePeriod;
    private BareRecurrence bare;
    private double[] setpoints;
    private double[] measurements;
    private double[] periods;
    private int k;

    /** Builds the controllers and their inputs. */
    @Setup
    public void setUp() {
        fixedPeriod = new PidController(Workloads.fullFeatured());
        variablePeriod = new PidController(Workloads.fullFeatured());
        bare = new BareRecurrence(Workloads.fullFeatured());
        setpoints = Workloads.setpoints();
        measurements = Workloads.measurements(3);
        periods = Workloads.jitteredPeriods(4);
    }

    /** The full-featured update at the configured period. */
    @Benchmark
    public double fullFeatured() {
        int i = k++ & Workloads.MASK;
        return fixedPeriod.update(setpoints[i], measurements[i]);
    }

    /** The same arithmetic on plain fields: the limit. */
    @Benchmark
    public double bareRecurrence() {
        int i = k++ & Workloads.MASK;
        return bare.update(setpoints[i], measurements[i]);
    }

    /** The full-featured update with a measured period (coefficients computed per call). */
    @Benchmark
    public double variablePeriod() {
        int i = k++ & Workloads.MASK;
        return variablePeriod.update(setpoints[i], measurements[i], periods[i]);
    }
}
