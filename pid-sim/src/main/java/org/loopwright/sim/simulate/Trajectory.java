package org.loopwright.sim.simulate;

import java.util.Arrays;

/**
 * A closed-loop run, one row per sample k: the sample instant, the setpoint r(k), the measurement
 * y(k) the controller read (NaN for a dropout), the controller output u(k) held from that instant,
 * and the load disturbance in effect at that instant. Beside these it keeps the true process output
 * (before the sensor), the input the actuator delivered, and whether the output was limited; a
 * cascade adds the inner setpoint and measurement, a split range each actuator's value.
 *
 * <p>Filled by {@link ClosedLoop} while it runs; after the run it is only read. Not thread-safe
 * while it is being filled.
 */
public final class Trajectory implements SampleRecorder {

    private final double[] time;
    private final double[] setpoint;
    private final double[] measurement;
    private final double[] output;
    private final double[] disturbance;
    private final double[] process;
    private final double[] delivered;
    private final boolean[] saturated;
    private final double[] innerSetpoint;
    private final double[] innerMeasurement;
    private final double[] firstActuator;
    private final double[] secondActuator;
    private int length;
    private double divergedAtSeconds = Double.NaN;

    Trajectory(int capacity, boolean innerLoop, boolean splitRange) {
        time = new double[capacity];
        setpoint = new double[capacity];
        measurement = new double[capacity];
        output = new double[capacity];
        disturbance = new double[capacity];
        process = new double[capacity];
        delivered = new double[capacity];
        saturated = new boolean[capacity];
        innerSetpoint = innerLoop ? new double[capacity] : null;
        innerMeasurement = innerLoop ? new double[capacity] : null;
        firstActuator = splitRange ? new double[capacity] : null;
        secondActuator = splitRange ? new double[capacity] : null;
    }

    /** The inner loop's setpoint and measurement at the sample just recorded. */
    void recordInner(double setpointNow, double measurementNow) {
        innerSetpoint[length - 1] = setpointNow;
        innerMeasurement[length - 1] = measurementNow;
    }

    /** The two actuators of a split range at the sample just recorded. */
    void recordSplit(double first, double second) {
        firstActuator[length - 1] = first;
        secondActuator[length - 1] = second;
    }

    /** Whether the run was a cascade, with inner-loop columns. */
    public boolean hasInnerLoop() {
        return innerSetpoint != null;
    }

    /** Whether the run had a split range, with a column per actuator. */
    public boolean hasSplitRange() {
        return firstActuator != null;
    }

    /** The inner loop's setpoint at sample k (a cascade only). */
    public double innerSetpoint(int k) {
        return innerSetpoint[k];
    }

    /** The inner measurement at sample k (a cascade only). */
    public double innerMeasurement(int k) {
        return innerMeasurement[k];
    }

    /** The first actuator of a split range at sample k. */
    public double firstActuator(int k) {
        return firstActuator[k];
    }

    /** The second actuator of a split range at sample k. */
    public double secondActuator(int k) {
        return secondActuator[k];
    }

    @Override
    public void record(double t, double r, double y, double u, double d, double trueOutput, double input,
            boolean limited) {
        int k = length++;
        time[k] = t;
        setpoint[k] = r;
        measurement[k] = y;
        output[k] = u;
        disturbance[k] = d;
        process[k] = trueOutput;
        delivered[k] = input;
        saturated[k] = limited;
    }

    @Override
    public void clear() {
        length = 0;
        divergedAtSeconds = Double.NaN;
    }

    @Override
    public void markDiverged(double instant) {
        divergedAtSeconds = instant;
    }

    /** Whether the run was stopped because it diverged (see {@link Divergence}). */
    public boolean diverged() {
        return !Double.isNaN(divergedAtSeconds);
    }

    /** The sample instant at which the run was found diverged, in seconds; NaN when it did not diverge. */
    public double divergedAtSeconds() {
        return divergedAtSeconds;
    }

    /** The number of samples recorded. */
    public int length() {
        return length;
    }

    /** The instant of sample k, in seconds. */
    public double time(int k) {
        return time[k];
    }

    /** r(k). */
    public double setpoint(int k) {
        return setpoint[k];
    }

    /** y(k) as the controller read it (NaN for a dropout). */
    public double measurement(int k) {
        return measurement[k];
    }

    /** u(k), the controller output. */
    public double output(int k) {
        return output[k];
    }

    /** The load disturbance in effect at sample k. */
    public double disturbance(int k) {
        return disturbance[k];
    }

    /** The true process output at sample k, before the sensor. */
    public double process(int k) {
        return process[k];
    }

    /** The input the actuator delivered from sample k (without the load). */
    public double delivered(int k) {
        return delivered[k];
    }

    /** Whether u(k) was limited by the controller's range or the actuator. */
    public boolean saturated(int k) {
        return saturated[k];
    }

    /** A copy of the sample instants. */
    public double[] times() {
        return Arrays.copyOf(time, length);
    }

    /** A copy of the setpoints. */
    public double[] setpoints() {
        return Arrays.copyOf(setpoint, length);
    }

    /** A copy of the measurements. */
    public double[] measurements() {
        return Arrays.copyOf(measurement, length);
    }

    /** A copy of the controller outputs. */
    public double[] outputs() {
        return Arrays.copyOf(output, length);
    }

    /** A copy of the disturbances. */
    public double[] disturbances() {
        return Arrays.copyOf(disturbance, length);
    }

    /** A copy of the true process outputs. */
    public double[] processOutputs() {
        return Arrays.copyOf(process, length);
    }
}
