package org.loopwright.bench;

import java.util.concurrent.TimeUnit;

import org.loopwright.pid.PidController;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * A bank of 1,000 full-featured controllers (a rack of bath heaters, each with its own gains and
 * settings) updated once per tick; the score is per controller, to set beside one controller alone.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@State(Scope.Thread)
public class BankBenchmark {

    /** Controllers in the bank. */
    public static final int SIZE = 1000;

    private final PidController[] bank = new PidController[SIZE];
    private double[] setpoints;
    private double[] measurements;
    private int tick;

    /** Builds the bank; gains differ by up to ±25 % between controllers. */
    @Setup
    public void setUp() {
        for (int c = 0; c < SIZE; c++) {
            double scale = 0.75 + 0.5 * c / SIZE;
            IdealGains gains = new IdealGains(Workloads.BATH_GAINS.gain() * scale,
                    Workloads.BATH_GAINS.integralTime() * scale, Workloads.BATH_GAINS.derivativeTime() / scale);
            bank[c] = new PidController(Workloads.fullFeatured(gains, IntegralMethod.TUSTIN,
                    DerivativeMethod.BACKWARD_EULER));
        }
        setpoints = Workloads.setpoints();
        measurements = Workloads.measurements(5);
    }

    /** One tick of the whole bank; each controller reads a different point of the input sequence. */
    @Benchmark
    @OperationsPerInvocation(SIZE)
    public double tick() {
        int t = tick++;
        double sum = 0.0;
        for (int c = 0; c < SIZE; c++) {
            int i = (t + c) & Workloads.MASK;
            sum += bank[c].update(setpoints[i], measurements[i]);
        }
        return sum;
    }
}
