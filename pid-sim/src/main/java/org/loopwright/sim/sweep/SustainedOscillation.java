package org.loopwright.sim.sweep;

import java.util.Arrays;

import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.simulate.Trajectory;

/**
 * Whether a simulated loop keeps oscillating at the end of its run: the rule that judges a nonlinear
 * plant's stability, where no poles exist to ask. Fed one sample at a time (allocation-free, so it can
 * ride along a run), it watches the process error e = r − y (the true process output, before the
 * sensor).
 *
 * <p>The rule: over the <b>final half of the stretch after the scenario's last event</b> (setpoint
 * change with its ramp, or load step; the whole run without one), the error's turning points are found
 * with a hysteresis of the swing floor (a turn counts only once the error has come back by the floor,
 * so noise and quantisation do not make turns). Each move from one turning point to the next is a
 * swing (peak to peak). The loop is in <b>sustained oscillation</b> when
 * <ul>
 * <li>the final half holds at least {@value #MIN_SWINGS} swings (two whole cycles), each larger than the
 *     floor, 2 × {@value ResponseMetrics#SETTLING_BAND} × the largest setpoint step (an oscillation that
 *     leaves the settling band; without a setpoint step, of the larger of 1 and the output at rest);</li>
 * <li>the decay ratio, the last swing over the swing one cycle before it (the same direction), is at
 *     least {@value #DECAY_RATIO_LIMIT}; and</li>
 * <li>the last turn came less than one cycle (the last two swings' time) before the end, so the
 *     oscillation is still going.</li>
 * </ul>
 * The decay ratio is the trade's measure of damping: Ziegler &amp; Nichols (Trans. ASME 64, 1942) tune
 * for a quarter decay ratio, 0.25, which is well damped here. For a second-order mode with damping ζ it is
 * exp(−2πζ/√(1 − ζ²)) (Åström &amp; Hägglund, <i>Advanced PID Control</i>, 2006, §4.3, from memory), so the limit
 * {@value #DECAY_RATIO_LIMIT} is ζ below about 0.017: a loop that loses less than a tenth of its swing per
 * cycle. The limit itself is our choice (common practice is "the swings do not die out").
 * A growing oscillation (ratio above 1) that does not reach the divergence bound counts too.
 *
 * <p>The rule's limit: with S the stretch after the last event, two whole cycles must fit in the final half
 * (S/2), after the first turn there, which comes up to half a period after the half starts. An oscillation of
 * period P &gt; S/4 is therefore never caught (a slow hunt reads as stable here; it shows as never settled
 * when it leaves the band), and one of P ≤ S/6 always is, whatever its phase (2.5 periods and the hysteresis's
 * delay fit); between the two it depends on the phase. Lengthen the run to judge a slower loop.
 *
 * <p>Not thread-safe: one run feeds it.
 */
public final class SustainedOscillation {

    /** The decay ratio at or above which an oscillation counts as sustained. */
    public static final double DECAY_RATIO_LIMIT = 0.9;

    /** The swings needed in the final half: two whole cycles. */
    public static final int MIN_SWINGS = 4;

    /** The rule in a sentence, for help texts and reports. */
    public static final String RULE = "sustained oscillation: over the final half of the run after its last setpoint"
            + " change or load step, the process error makes at least two whole cycles whose swings leave the 2 %"
            + " settling band, the last swing is at least " + DECAY_RATIO_LIMIT + " of the swing a cycle before"
            + " (decay ratio; Ziegler-Nichols' quarter decay is 0.25), and the oscillation lasts to the end. Its limit:"
            + " two whole cycles must fit in that final half, so an oscillation whose period is longer than a quarter"
            + " of the stretch after the last event is never caught, and one at most a sixth of it always is;"
            + " lengthen duration to judge a slow loop";

    private double tailStartSeconds;
    private double swingFloor;
    private int direction;
    private double low;
    private double lowSeconds;
    private double high;
    private double highSeconds;
    private double extreme;
    private double extremeSeconds;
    private boolean turned;
    private double lastTurn;
    private double lastTurnSeconds;
    /** The times of the last three turns, oldest first. */
    private final double[] turnSeconds = new double[3];
    private double swingNewest;
    private double swingBefore;
    private double swingCycleBefore;
    private int tailSwings;
    private double lastSeconds;

    /**
     * A check that counts swings after {@code tailStartSeconds} larger than {@code swingFloor}.
     *
     * @param tailStartSeconds where the final half starts
     * @param swingFloor       the smallest swing that counts, process units, &gt; 0
     */
    public SustainedOscillation(double tailStartSeconds, double swingFloor) {
        restart(tailStartSeconds, swingFloor);
    }

    /** The check for a scenario: its final half and swing floor as the rule defines them. */
    public static SustainedOscillation of(Scenario scenario) {
        double lastEvent = 0.0;
        double rest = scenario.plant().newPlant().output();
        double previous = rest;
        double largestStep = 0.0;
        for (SetpointChange change : scenario.setpoint()) {
            lastEvent = Math.max(lastEvent, change.atSeconds() + change.rampSeconds());
            largestStep = Math.max(largestStep, Math.abs(change.value() - previous));
            previous = change.value();
        }
        for (LoadStep load : scenario.disturbances()) {
            lastEvent = Math.max(lastEvent, load.atSeconds());
        }
        double scale = largestStep > 0.0 ? largestStep : Math.max(1.0, Math.abs(rest));
        double end = scenario.durationSeconds();
        return new SustainedOscillation(lastEvent + 0.5 * Math.max(0.0, end - lastEvent),
                2.0 * ResponseMetrics.SETTLING_BAND * scale);
    }

    /**
     * Feeds every sample of a run.
     *
     * @param trajectory the run
     * @return this check, for its verdict
     */
    public SustainedOscillation feed(Trajectory trajectory) {
        for (int k = 0; k < trajectory.length(); k++) {
            sample(trajectory.time(k), trajectory.setpoint(k) - trajectory.process(k));
        }
        return this;
    }

    /**
     * Forgets every sample, for a new run.
     *
     * @param tailStartSeconds where the final half starts
     * @param swingFloor       the smallest swing that counts, &gt; 0
     */
    public void restart(double tailStartSeconds, double swingFloor) {
        if (!(swingFloor > 0.0) || Double.isNaN(tailStartSeconds)) {
            throw new IllegalArgumentException("swing floor must be > 0 and the tail start a number: swingFloor="
                    + swingFloor + ", tailStartSeconds=" + tailStartSeconds);
        }
        this.tailStartSeconds = tailStartSeconds;
        this.swingFloor = swingFloor;
        direction = 0;
        low = Double.POSITIVE_INFINITY;
        high = Double.NEGATIVE_INFINITY;
        turned = false;
        tailSwings = 0;
        lastSeconds = Double.NaN;
        swingNewest = Double.NaN;
        swingBefore = Double.NaN;
        swingCycleBefore = Double.NaN;
        Arrays.fill(turnSeconds, Double.NaN);
    }

    /**
     * One sample of the process error.
     *
     * @param seconds the sample's time, increasing
     * @param error   r − y (a NaN sample is skipped)
     */
    public void sample(double seconds, double error) {
        if (Double.isNaN(error)) {
            return;
        }
        lastSeconds = seconds;
        if (direction == 0) {
            if (error < low) {
                low = error;
                lowSeconds = seconds;
            }
            if (error > high) {
                high = error;
                highSeconds = seconds;
            }
            if (error - low > swingFloor) {
                turn(low, lowSeconds);
                direction = 1;
                extreme = error;
                extremeSeconds = seconds;
            } else if (high - error > swingFloor) {
                turn(high, highSeconds);
                direction = -1;
                extreme = error;
                extremeSeconds = seconds;
            }
            return;
        }
        if (direction * (error - extreme) > 0.0) {
            extreme = error;
            extremeSeconds = seconds;
        } else if (direction * (extreme - error) > swingFloor) {
            turn(extreme, extremeSeconds);
            direction = -direction;
            extreme = error;
            extremeSeconds = seconds;
        }
    }

    private void turn(double value, double seconds) {
        if (turned && lastTurnSeconds >= tailStartSeconds) {
            swingCycleBefore = swingBefore;
            swingBefore = swingNewest;
            swingNewest = Math.abs(value - lastTurn);
            tailSwings++;
        }
        turned = true;
        lastTurn = value;
        lastTurnSeconds = seconds;
        turnSeconds[0] = turnSeconds[1];
        turnSeconds[1] = turnSeconds[2];
        turnSeconds[2] = seconds;
    }

    /** The last swing over the swing one cycle before it; NaN before three swings in the final half. */
    public double decayRatio() {
        return swingNewest / swingCycleBefore;
    }

    /** The swings counted in the final half so far. */
    public int swings() {
        return tailSwings;
    }

    /**
     * The verdict on the samples so far, taken as the whole run (judge a diverged run by its divergence).
     *
     * @return true when the rule finds a sustained oscillation
     */
    public boolean sustained() {
        double cycle = turnSeconds[2] - turnSeconds[0];
        return tailSwings >= MIN_SWINGS && decayRatio() >= DECAY_RATIO_LIMIT && lastSeconds - turnSeconds[2] < cycle;
    }
}
