package org.loopwright.sim.simulate;

/**
 * What a running {@link ClosedLoop} hands each sample to: a {@link Trajectory} keeps every sample; a
 * sweep run keeps only its figures as they accumulate and a thinned measurement for its plot.
 *
 * <p>Called from the loop's thread, once per sample; an implementation allocates nothing there.
 */
public interface SampleRecorder {

    /**
     * One sample k.
     *
     * @param t         the sample instant, seconds
     * @param r         the setpoint r(k)
     * @param y         the measurement y(k) as the controller read it (NaN for a dropout)
     * @param u         the controller output u(k)
     * @param d         the load disturbance in effect
     * @param process   the true process output, before the sensor
     * @param delivered the input the actuator delivered from this instant (without the load)
     * @param limited   whether u(k) was limited by the controller's range or the actuator
     */
    void record(double t, double r, double y, double u, double d, double process, double delivered, boolean limited);

    /** The run was found diverged at this instant (see {@link Divergence}) and stops; the sample is not recorded. */
    void markDiverged(double instant);

    /** The loop was rewound: forget every sample. */
    void clear();
}
