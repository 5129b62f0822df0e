package org.loopwright.sim.metrics;

import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Trajectory;

/**
 * The figures of merit of a closed-loop response, measured on the true process output (before the
 * sensor's noise and dropouts) over a window that starts at a setpoint change. A figure that does
 * not apply is NaN (written as null in JSON), and {@link #state()} says why: the step figures need a
 * setpoint change in the window ({@link ResponseState#NO_STEP}) and a response that has settled
 * ({@link ResponseState#NOT_SETTLED}); a run that diverged ({@link ResponseState#DIVERGED}) has no figures
 * at all. Rise time is also NaN when the output never reaches 90 %, peak time when there is no overshoot.
 *
 * <p>Definitions (Åström &amp; Murray, <i>Feedback Systems</i>, 2nd ed., 2021, §5.3 for the step
 * figures; the integral criteria as in Åström &amp; Hägglund, <i>Advanced PID Control</i>, 2006, §4.4):
 * with y₀ the output at the window's start, r the setpoint at the window's end, Δ = r − y₀ the step
 * (the setpoint change when the loop starts at rest on its old setpoint) and y∞ the output at the
 * window's end,
 * <ul>
 * <li>settled: {@value #SETTLED_RULE}. The band is ±{@link #SETTLING_BAND 2 %} of |Δ|, the final stretch
 *     is the window's last {@value #FINAL_SHARE_PERCENT} % (at least two samples) and the line is the
 *     least-squares fit of the output against time over that stretch. Why the line: a slow response
 *     (a lag of 100 s watched for 60 s) moves less than the band within the final stretch and would
 *     pass a band test alone, with y∞ far from where it is heading. For an exponential approach with
 *     time constant τ up to the window's length the distance still to go is at most slope·τ, so a
 *     response at rest has y∞ within the band of its true final value; a first-order response
 *     1 − e^(−t/τ) that stops short of the setpoint (P control) is called settled once the window is
 *     about 6τ long (its 2 % settling time is τ·ln 50 ≈ 3.9τ). A response inside the setpoint's band
 *     and still closing on it (integral action's slow tail) cannot leave that band by doing so, and
 *     its band is the setpoint's. The rule reads the final stretch only, so it can be judged in one
 *     pass over the run;</li>
 * <li>rise time: from reaching y₀ + 10 % to y₀ + 90 % of y∞ − y₀ (linear interpolation between samples);</li>
 * <li>settling time: from the window's start until the output stays within the band it settled in, around
 *     r or around y∞ (resolved to the sample);</li>
 * <li>overshoot: {@value #OVERSHOOT_DEFINITION}; peak time: when that peak occurs. A loop that settles
 *     away from the setpoint (P control, a limit) is measured against the setpoint too: a response that
 *     stops short shows 0 %, and its steady-state error says by how much;</li>
 * <li>steady-state error: r − y∞;</li>
 * <li>IAE, ISE, ITAE: ∫|e|dt, ∫e²dt, ∫(t − t₀)|e|dt with e = r − y, from the window's start to the end of
 *     the run, each sample's error held until the next sample;</li>
 * <li>total variation: Σ|u(k) − u(k−1)| from the window's first sample k₀ on, the move at k₀ included
 *     (u before the run's first sample is 0, the output of the loop at rest); saturated fraction: the
 *     share of samples whose output was limited by the controller's range or the actuator.</li>
 * </ul>
 *
 * <p>Gathered in one pass by {@link ResponseAccumulator}, for a whole trajectory as for a sweep run that
 * keeps no trajectory: one definition of each figure.
 *
 * @param riseTimeSeconds     10–90 % rise time
 * @param settlingTimeSeconds 2 % settling time
 * @param overshootPercent    overshoot in percent of the step
 * @param peakTimeSeconds     time of the overshoot's peak after the window's start
 * @param steadyStateError    r − y at the window's end, process units
 * @param iae                 integral of absolute error, units·s
 * @param ise                 integral of squared error, units²·s
 * @param itae                integral of time-weighted absolute error, units·s²
 * @param totalVariation      total variation of the controller output, output units
 * @param saturatedFraction   share of samples in saturation, 0 to 1
 * @param state               whether the step figures apply
 */
public record ResponseMetrics(double riseTimeSeconds, double settlingTimeSeconds, double overshootPercent,
        double peakTimeSeconds, double steadyStateError, double iae, double ise, double itae, double totalVariation,
        double saturatedFraction, ResponseState state) {

    /** The definition of overshoot in words, for help texts and reports. */
    public static final String OVERSHOOT_DEFINITION = "the largest excursion of the output beyond the new setpoint,"
            + " in percent of the step from the output at the setpoint change to the new setpoint";

    /** The share of the step that counts as settled (2 %). */
    public static final double SETTLING_BAND = 0.02;

    /** The final share of the window, in percent, over which {@link #SETTLED_RULE} is judged. */
    public static final int FINAL_SHARE_PERCENT = 10;

    /**
     * When a response counts as settled, in words, for help texts and reports (no percent sign: picocli
     * reads help texts as format strings).
     */
    public static final String SETTLED_RULE = "over the last " + FINAL_SHARE_PERCENT + " percent of the window the"
            + " output either stays within 2 percent of the step of the setpoint while the straight line fitted to"
            + " that stretch heads toward the setpoint, or stays within 2 percent of the step of its last value"
            + " while that line, continued for as long again as the window, would stay within that band too";

    /**
     * The metrics of a scenario's run over its {@link ResponseWindow#of(Scenario) response window}.
     */
    public static ResponseMetrics of(Scenario scenario, Trajectory trajectory) {
        ResponseWindow window = ResponseWindow.of(scenario);
        return of(trajectory, window.startSeconds(), window.endSeconds());
    }

    /**
     * The metrics over a window.
     *
     * @param trajectory   the run
     * @param startSeconds the setpoint change the step figures refer to
     * @param endSeconds   where the step figures stop looking (the integrals run to the end of the run)
     */
    public static ResponseMetrics of(Trajectory trajectory, double startSeconds, double endSeconds) {
        ResponseAccumulator accumulator = new ResponseAccumulator(new ResponseWindow(startSeconds, endSeconds),
                trajectory.length());
        for (int k = 0; k < trajectory.length(); k++) {
            accumulator.sample(trajectory.time(k), trajectory.setpoint(k), trajectory.process(k), trajectory.output(k),
                    trajectory.saturated(k));
        }
        return accumulator.finish(trajectory.diverged());
    }

    /**
     * The integral of absolute error r − y from {@code fromSeconds} to the end of the run, for
     * judging the response to a load step (each sample's error held until the next sample).
     */
    public static double loadIae(Trajectory trajectory, double fromSeconds) {
        double iae = 0.0;
        for (int k = firstAtOrAfter(trajectory, fromSeconds); k + 1 < trajectory.length(); k++) {
            double dt = trajectory.time(k + 1) - trajectory.time(k);
            iae += Math.abs(trajectory.setpoint(k) - trajectory.process(k)) * dt;
        }
        return iae;
    }

    /** The largest |r − y| from {@code fromSeconds} on: the peak deviation after a load step. */
    public static double peakDeviation(Trajectory trajectory, double fromSeconds) {
        double peak = 0.0;
        for (int k = firstAtOrAfter(trajectory, fromSeconds); k < trajectory.length(); k++) {
            peak = Math.max(peak, Math.abs(trajectory.setpoint(k) - trajectory.process(k)));
        }
        return peak;
    }

    private static int firstAtOrAfter(Trajectory trajectory, double seconds) {
        int k = 0;
        while (k < trajectory.length() && trajectory.time(k) < seconds) {
            k++;
        }
        return k;
    }
}
