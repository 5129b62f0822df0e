package org.loopwright.sim.metrics;

import static org.loopwright.sim.metrics.ResponseMetrics.FINAL_SHARE_PERCENT;
import static org.loopwright.sim.metrics.ResponseMetrics.SETTLING_BAND;

/**
 * {@link ResponseMetrics} gathered one sample at a time, as a run goes: the integral criteria, the total
 * variation and the time in saturation are summed on the way, and of the response window only the
 * instants and the process output are kept (the step figures need the output at the window's end before
 * they can be read), in arrays sized once. {@link ResponseMetrics#of(org.loopwright.sim.simulate.Trajectory,
 * double, double)} feeds a whole trajectory through it, so a sweep's streaming figures and a simulation's
 * figures are the same code.
 *
 * <p>Example: {@code acc.clear(); for each sample: acc.sample(t, r, y, u, limited); ResponseMetrics m = acc.finish(false);}
 *
 * <p>Not thread-safe: one run feeds it. {@link #sample} allocates nothing.
 */
public final class ResponseAccumulator {

    private final double startSeconds;
    private final double endSeconds;
    private final double[] windowTime;
    private final double[] windowProcess;

    private int samples;
    private int first;
    private int windowLength;
    private boolean windowOpen;
    private double target;
    private double t0;
    private double previousTime;
    private double previousError;
    private double previousOutput;
    private double iae;
    private double ise;
    private double itae;
    private double variation;
    private int saturated;

    /**
     * An accumulator for runs of at most {@code capacity} samples.
     *
     * @param window   where the step figures look
     * @param capacity the most samples a run hands in
     */
    public ResponseAccumulator(ResponseWindow window, int capacity) {
        this.startSeconds = window.startSeconds();
        this.endSeconds = window.endSeconds();
        this.windowTime = new double[capacity];
        this.windowProcess = new double[capacity];
        clear();
    }

    /** Ready for a new run. */
    public void clear() {
        samples = 0;
        first = -1;
        windowLength = 0;
        windowOpen = true;
        target = Double.NaN;
        t0 = Double.NaN;
        previousTime = Double.NaN;
        previousError = Double.NaN;
        previousOutput = 0.0; // the output of the loop at rest, before its first sample
        iae = 0.0;
        ise = 0.0;
        itae = 0.0;
        variation = 0.0;
        saturated = 0;
    }

    /**
     * The next sample of the run.
     *
     * @param t       its instant, seconds (increasing from sample to sample)
     * @param r       the setpoint
     * @param process the true process output
     * @param u       the controller output
     * @param limited whether the output was limited
     */
    public void sample(double t, double r, double process, double u, boolean limited) {
        if (first < 0 && t >= startSeconds) {
            first = samples;
            t0 = t;
        }
        if (first >= 0) {
            if (samples > first) {
                // the previous sample's error, held until this instant
                double dt = t - previousTime;
                iae += Math.abs(previousError) * dt;
                ise += previousError * previousError * dt;
                itae += (previousTime - t0) * Math.abs(previousError) * dt;
            }
            windowOpen = windowOpen && (windowLength == 0 || t < endSeconds);
            if (windowOpen) {
                windowTime[windowLength] = t;
                windowProcess[windowLength] = process;
                windowLength++;
                target = r;
            }
            variation += Math.abs(u - previousOutput);
            saturated += limited ? 1 : 0;
            previousTime = t;
            previousError = r - process;
        }
        previousOutput = u;
        samples++;
    }

    /**
     * The figures of the run fed since {@link #clear()}.
     *
     * @param diverged whether the run was stopped as diverged (then no figure applies)
     */
    public ResponseMetrics finish(boolean diverged) {
        if (diverged || first < 0) {
            return new ResponseMetrics(Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    diverged ? ResponseState.DIVERGED : ResponseState.NO_STEP);
        }
        int last = windowLength - 1;
        double y0 = windowProcess[0];
        double yEnd = windowProcess[last];
        double step = target - y0;
        double scale = Math.max(Math.abs(y0), Math.abs(target));
        int tail = Math.min(last + 1, Math.max(2, (last + 1) * FINAL_SHARE_PERCENT / 100));

        ResponseState state = ResponseState.NO_STEP;
        double rise = Double.NaN;
        double settling = Double.NaN;
        double overshoot = Double.NaN;
        double peakTime = Double.NaN;
        double steadyStateError = target - yEnd;
        if (Math.abs(step) > 1e-9 * Math.max(1.0, scale)) {
            double band = Math.abs(step) * SETTLING_BAND;
            int finalStart = last - tail + 1;
            double slope = slope(finalStart, last);
            double meanOffset = mean(finalStart, last) - target;
            settling = settlingTime(finalStart, last, target, band);
            if (Double.isNaN(settling) || slope * meanOffset > 0.0) {
                double windowSeconds = windowTime[last] - t0;
                boolean resting = Math.abs(slope) * windowSeconds <= band;
                settling = resting ? settlingTime(finalStart, last, yEnd, band) : Double.NaN;
            }
            state = Double.isNaN(settling) ? ResponseState.NOT_SETTLED : ResponseState.SETTLED;
        }
        if (state == ResponseState.SETTLED) {
            settling -= t0;
            double moved = yEnd - y0;
            if (Math.abs(moved) > 1e-9 * Math.max(1.0, scale)) {
                rise = crossing(last, y0 + 0.9 * moved, moved) - crossing(last, y0 + 0.1 * moved, moved);
            }
            double sign = Math.signum(step);
            double peak = 0.0;
            int peakAt = -1;
            for (int k = 0; k <= last; k++) {
                double beyond = sign * (windowProcess[k] - target);
                if (beyond > peak) {
                    peak = beyond;
                    peakAt = k;
                }
            }
            overshoot = 100.0 * peak / Math.abs(step);
            peakTime = peakAt < 0 ? Double.NaN : windowTime[peakAt] - t0;
        } else if (state == ResponseState.NOT_SETTLED) {
            steadyStateError = Double.NaN;
        }
        return new ResponseMetrics(rise, settling, overshoot, peakTime, steadyStateError, iae, ise, itae, variation,
                (double) saturated / (samples - first), state);
    }

    /** The first time the output reaches {@code level}, moving in the direction of {@code step}. */
    private double crossing(int last, double level, double step) {
        double sign = Math.signum(step);
        for (int k = 0; k <= last; k++) {
            double here = sign * (windowProcess[k] - level);
            if (here >= 0.0) {
                if (k == 0) {
                    return windowTime[k];
                }
                double before = sign * (windowProcess[k - 1] - level);
                double fraction = -before / (here - before);
                return windowTime[k - 1] + fraction * (windowTime[k] - windowTime[k - 1]);
            }
        }
        return Double.NaN;
    }

    /** The mean process output over window samples {@code from} to {@code to}. */
    private double mean(int from, int to) {
        double sum = 0.0;
        for (int k = from; k <= to; k++) {
            sum += windowProcess[k];
        }
        return sum / (to - from + 1);
    }

    /** The least-squares slope of the process output against time over window samples {@code from} to {@code to}. */
    private double slope(int from, int to) {
        double origin = windowTime[from];
        int n = to - from + 1;
        double meanT = 0.0;
        double meanY = 0.0;
        for (int k = from; k <= to; k++) {
            meanT += (windowTime[k] - origin) / n;
            meanY += windowProcess[k] / n;
        }
        double sty = 0.0;
        double stt = 0.0;
        for (int k = from; k <= to; k++) {
            double dt = windowTime[k] - origin - meanT;
            sty += dt * (windowProcess[k] - meanY);
            stt += dt * dt;
        }
        return stt > 0.0 ? sty / stt : 0.0;
    }

    /**
     * The first window instant after which the output stays within the band around {@code centre}; NaN
     * when it is still outside during the final stretch (from {@code finalStart}).
     */
    private double settlingTime(int finalStart, int last, double centre, double band) {
        int lastOutside = -1;
        for (int k = 0; k <= last; k++) {
            if (Math.abs(windowProcess[k] - centre) > band) {
                lastOutside = k;
            }
        }
        if (lastOutside >= finalStart) {
            return Double.NaN;
        }
        return lastOutside < 0 ? windowTime[0] : windowTime[lastOutside + 1];
    }
}
