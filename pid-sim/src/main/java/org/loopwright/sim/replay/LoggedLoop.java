package org.loopwright.sim.replay;

import org.loopwright.sim.simulate.Trajectory;

/**
 * A loop's record as logged: per sample the time, setpoint, measurement, the controller output that
 * was logged, and whether the controller was in automatic. A missing sample is NaN. Read from a file by
 * {@link LoggedLoopFile}, or taken from a simulation by {@link #of(String, Trajectory)}.
 *
 * <p>Thread-safe: immutable (the arrays are never handed out).
 */
public final class LoggedLoop {

    private final String name;
    private final double[] time;
    private final double[] setpoint;
    private final double[] measurement;
    private final double[] output;
    private final boolean[] automatic;

    LoggedLoop(String name, double[] time, double[] setpoint, double[] measurement, double[] output,
            boolean[] automatic) {
        this.name = name;
        this.time = time;
        this.setpoint = setpoint;
        this.measurement = measurement;
        this.output = output;
        this.automatic = automatic;
    }

    /** A simulated run as if it had been logged (always in automatic). */
    public static LoggedLoop of(String name, Trajectory t) {
        boolean[] automatic = new boolean[t.length()];
        java.util.Arrays.fill(automatic, true);
        return new LoggedLoop(name, t.times(), t.setpoints(), t.measurements(), t.outputs(), automatic);
    }

    /** A record from arrays of equal length (copied); times must increase. */
    public static LoggedLoop of(String name, double[] time, double[] setpoint, double[] measurement, double[] output,
            boolean[] automatic) {
        int n = time.length;
        if (setpoint.length != n || measurement.length != n || output.length != n || automatic.length != n) {
            throw new IllegalArgumentException("every column of a logged loop must have " + n + " samples");
        }
        for (int k = 1; k < n; k++) {
            if (!(time[k] > time[k - 1])) {
                throw new IllegalArgumentException("time must increase: time[" + k + "]=" + time[k]);
            }
        }
        return new LoggedLoop(name, time.clone(), setpoint.clone(), measurement.clone(), output.clone(),
                automatic.clone());
    }

    /** How messages and reports name the record. */
    public String name() {
        return name;
    }

    /** Number of samples. */
    public int length() {
        return time.length;
    }

    /** Time of sample k (seconds). */
    public double time(int k) {
        return time[k];
    }

    /** Setpoint at sample k (NaN when missing). */
    public double setpoint(int k) {
        return setpoint[k];
    }

    /** Measurement at sample k (NaN when missing). */
    public double measurement(int k) {
        return measurement[k];
    }

    /** Logged controller output at sample k (NaN when missing). */
    public double output(int k) {
        return output[k];
    }

    /** Whether the controller was in automatic at sample k. */
    public boolean automatic(int k) {
        return automatic[k];
    }

    /** The median interval between samples (seconds), NaN for fewer than two samples. */
    public double medianIntervalSeconds() {
        if (time.length < 2) {
            return Double.NaN;
        }
        double[] steps = new double[time.length - 1];
        for (int k = 1; k < time.length; k++) {
            steps[k - 1] = time[k] - time[k - 1];
        }
        java.util.Arrays.sort(steps);
        return steps[steps.length / 2];
    }
}
