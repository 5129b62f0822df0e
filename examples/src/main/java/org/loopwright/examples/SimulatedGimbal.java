package org.loopwright.examples;

import java.util.Arrays;

import org.HdrHistogram.Histogram;
import org.loopwright.pid.runner.LoopClock;
import org.loopwright.pid.runner.LoopRunner;
import org.loopwright.pid.runner.MeasurementSource;
import org.loopwright.pid.runner.OutputSink;
import org.loopwright.pid.runner.SetpointSource;
import org.loopwright.pid.runner.TimingListener;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.Plant;

/**
 * Stands in for the gimbal's hardware on the loop thread: the motor is advanced to the runner
 * clock's present with the last voltage held, an absolute encoder reads its angle in [0°, 360°),
 * the setpoint follows a profile in time, and every tick's period error goes into a histogram.
 * Stops the runner once the clock has run for the duration.
 *
 * <p>Allocation-free per tick: every log is sized at construction. Used by the loop thread only
 * while the runner runs; read by the starting thread after the runner has stopped.
 */
final class SimulatedGimbal implements SetpointSource, MeasurementSource, OutputSink, TimingListener {

    /** The encoder's counts per revolution (a 12-bit absolute encoder). */
    static final int ENCODER_COUNTS = 4096;
    private static final double DEGREES_PER_COUNT = 360.0 / ENCODER_COUNTS;

    private final Plant motor;
    private final LoopClock clock;
    private final double mountingOffsetDegrees;
    private final long periodNanos;
    private final long originNanos;
    private final long durationNanos;
    private final double[] profileFromSeconds;
    private final double[] profileDegrees;
    private final Histogram periodErrorNanos;
    private LoopRunner runner;

    private long advancedToNanos;
    private double volts;
    private double lastSeconds;
    private double lastSetpoint;
    private double lastReading;
    private long previousStartNanos;
    private boolean ticked;

    private final double[] timeSeconds;
    private final double[] setpointDegrees;
    private final double[] encoderDegrees;
    private final double[] shaftDegrees;
    private final double[] voltsLog;
    private int samples;

    /**
     * @param motor                 the motor model (position output, radians)
     * @param clock                 the runner's clock
     * @param mountingOffsetDegrees the encoder reading with the shaft at the motor model's angle 0
     * @param periodNanos           the runner's nominal period
     * @param durationSeconds       how long to run, on the clock
     * @param profileFromSeconds    when each setpoint of the profile starts (ascending, the first at 0)
     * @param profileDegrees        the setpoints
     */
    SimulatedGimbal(DcMotorModel motor, LoopClock clock, double mountingOffsetDegrees, long periodNanos,
            double durationSeconds, double[] profileFromSeconds, double[] profileDegrees) {
        this.motor = motor.newPlant();
        this.clock = clock;
        this.mountingOffsetDegrees = mountingOffsetDegrees;
        this.periodNanos = periodNanos;
        this.durationNanos = Math.round(durationSeconds * 1e9);
        this.profileFromSeconds = profileFromSeconds.clone();
        this.profileDegrees = profileDegrees.clone();
        // errors up to 1 s at 3 significant digits; a longer stall is recorded as 1 s
        this.periodErrorNanos = new Histogram(1_000_000_000L, 3);
        int capacity = (int) (durationNanos / periodNanos) + 2;
        timeSeconds = new double[capacity];
        setpointDegrees = new double[capacity];
        encoderDegrees = new double[capacity];
        shaftDegrees = new double[capacity];
        voltsLog = new double[capacity];
        this.originNanos = clock.nanoTime();
        this.advancedToNanos = originNanos;
    }

    /** The runner to stop when the duration is over; set before it starts. */
    void stopsAtTheEnd(LoopRunner loop) {
        runner = loop;
    }

    @Override
    public double setpoint() {
        double t = (clock.nanoTime() - originNanos) * 1e-9;
        int i = 0;
        while (i + 1 < profileFromSeconds.length && profileFromSeconds[i + 1] <= t) {
            i++;
        }
        lastSetpoint = profileDegrees[i];
        return lastSetpoint;
    }

    @Override
    public double readMeasurement() {
        long now = clock.nanoTime();
        if (now > advancedToNanos) {
            motor.advance(volts, (now - advancedToNanos) * 1e-9);
            advancedToNanos = now;
        }
        lastSeconds = (now - originNanos) * 1e-9;
        double counts = Math.floor(wrap(shaftDegrees()) / DEGREES_PER_COUNT);
        lastReading = counts * DEGREES_PER_COUNT;
        return lastReading;
    }

    @Override
    public void writeOutput(double output) {
        volts = output;
        if (samples < timeSeconds.length) {
            timeSeconds[samples] = lastSeconds;
            setpointDegrees[samples] = lastSetpoint;
            encoderDegrees[samples] = lastReading;
            shaftDegrees[samples] = shaftDegrees();
            voltsLog[samples] = output;
            samples++;
        }
    }

    @Override
    public void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overrun) {
        if (ticked) {
            long error = Math.abs(startNanos - previousStartNanos - periodNanos);
            periodErrorNanos.recordValue(Math.min(error, periodErrorNanos.getHighestTrackableValue()));
        }
        ticked = true;
        previousStartNanos = startNanos;
        if (endNanos - originNanos >= durationNanos) {
            runner.stop();
        }
    }

    /** The shaft's angle without wrapping, as the encoder would read it with an endless count. */
    private double shaftDegrees() {
        return mountingOffsetDegrees + Math.toDegrees(motor.output());
    }

    private static double wrap(double degrees) {
        return degrees - 360.0 * Math.floor(degrees / 360.0);
    }

    Histogram periodErrorNanos() {
        return periodErrorNanos;
    }

    int samples() {
        return samples;
    }

    double[] timeSeconds() {
        return Arrays.copyOf(timeSeconds, samples);
    }

    double[] setpointDegrees() {
        return Arrays.copyOf(setpointDegrees, samples);
    }

    double[] encoderDegrees() {
        return Arrays.copyOf(encoderDegrees, samples);
    }

    double[] shaftDegreesLog() {
        return Arrays.copyOf(shaftDegrees, samples);
    }

    double[] volts() {
        return Arrays.copyOf(voltsLog, samples);
    }
}
