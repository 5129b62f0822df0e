package org.loopwright.sim.assess;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.loopwright.pid.monitor.ConditionStatus;
import org.loopwright.pid.monitor.LoopCondition;
import org.loopwright.pid.monitor.LoopMonitor;
import org.loopwright.pid.monitor.MonitorSettings;
import org.loopwright.pid.monitor.MonitorSummary;
import org.loopwright.sim.replay.LoggedLoop;

/**
 * Assesses a logged loop: runs the {@link LoopMonitor} over the record sample by sample (the worst
 * status each condition reached is its finding), then the whole-record methods on the longest steady
 * stretch (automatic, constant setpoint, no missing sample): the autocorrelation of the error
 * ({@link ErrorAutocorrelation}), the stiction test ({@link HorchStiction}) and the minimum-variance
 * index ({@link HarrisIndex}). Saturation and noise are judged over the whole record with the
 * monitor's definitions and thresholds.
 */
public final class LoopAssessment {

    /** Condition names of the whole-record methods. */
    public static final String REGULARITY = "oscillation-regularity";
    /** Stiction's condition name. */
    public static final String STICTION = "stiction";
    /** The minimum-variance index's condition name. */
    public static final String MINIMUM_VARIANCE = "minimum-variance-index";
    /**
     * Index below which the loop is far from minimum variance (our cut-off: a PI loop on a process with
     * dead time cannot reach 1, and well-tuned ones sit around 0.1 to 0.5).
     */
    public static final double MV_ALARM = 0.02;
    /** Index below which the loop is worth a look (our cut-off). */
    public static final double MV_WARN = 0.1;
    /** Fewest oscillation periods in the steady stretch for the stiction test (our choice). */
    public static final int STICTION_MIN_PERIODS = 4;
    /** Fewest samples in the steady stretch for the autocorrelation (our choice). */
    public static final int ACF_MIN_SAMPLES = 50;

    private static final String HAGGLUND_1995 = "Hägglund 1995 (from memory)";
    private static final String HAGGLUND_1999 = "Hägglund 1999 (from memory)";
    private static final String THORNHILL = "Thornhill, Huang & Zhang 2003 (from memory)";

    private LoopAssessment() {
    }

    /** The assessment of a record. */
    public static Assessment of(LoggedLoop loop, AssessmentOptions options) {
        MonitorSettings s = options.monitor();
        double h = s.samplePeriodSeconds();
        int n = loop.length();
        LoopMonitor monitor = new LoopMonitor(s);
        MonitorSummary now = new MonitorSummary();
        MonitorSummary atPeak = new MonitorSummary();
        ConditionStatus[] worst = new ConditionStatus[LoopCondition.values().length];
        java.util.Arrays.fill(worst, ConditionStatus.OK);
        long longestFrozen = 0;
        List<TimeSpan> stretches = new ArrayList<>();
        double stretchStart = Double.NaN;
        double peakEvents = 0.0;
        for (int k = 0; k < n; k++) {
            monitor.sample(loop.setpoint(k), loop.measurement(k), loop.output(k), loop.automatic(k));
            for (LoopCondition c : LoopCondition.values()) {
                ConditionStatus status = monitor.status(c);
                if (status.compareTo(worst[c.ordinal()]) > 0) {
                    worst[c.ordinal()] = status;
                }
            }
            monitor.readSummary(now);
            if (now.oscillationEvents() > peakEvents) {
                peakEvents = now.oscillationEvents();
                monitor.readSummary(atPeak);
            }
            if (monitor.status(LoopCondition.FROZEN_MEASUREMENT) != ConditionStatus.OK) {
                longestFrozen = Math.max(longestFrozen, now.unchangedSamples());
            }
            boolean oscillating = monitor.status(LoopCondition.OSCILLATION) != ConditionStatus.OK;
            if (oscillating && Double.isNaN(stretchStart)) {
                stretchStart = loop.time(k);
            } else if (!oscillating && !Double.isNaN(stretchStart)) {
                stretches.add(new TimeSpan(stretchStart, loop.time(k)));
                stretchStart = Double.NaN;
            }
        }
        if (!Double.isNaN(stretchStart)) {
            stretches.add(new TimeSpan(stretchStart, loop.time(n - 1)));
        }

        int[] steady = longestSteadyStretch(loop);
        double[] error = new double[n];
        double[] output = new double[n];
        double[] measurement = new double[n];
        for (int k = 0; k < n; k++) {
            error[k] = loop.setpoint(k) - loop.measurement(k);
            output[k] = loop.output(k);
            measurement[k] = loop.measurement(k);
        }
        int steadyLength = steady[1] - steady[0];
        ErrorAutocorrelation acf = steadyLength >= ACF_MIN_SAMPLES
                ? ErrorAutocorrelation.of(error, steady[0], steady[1], h) : null;

        boolean oscillates = worst[LoopCondition.OSCILLATION.ordinal()] != ConditionStatus.OK;
        double period = !oscillates ? Double.NaN
                : acf != null && acf.regular() ? acf.periodSeconds() : atPeak.oscillationPeriodSeconds();
        double amplitude = oscillates ? atPeak.oscillationAmplitude() : Double.NaN;

        List<Finding> findings = new ArrayList<>();
        findings.add(oscillation(s, worst[LoopCondition.OSCILLATION.ordinal()], peakEvents, atPeak, stretches));
        findings.add(regularity(acf, steadyLength, worst[LoopCondition.OSCILLATION.ordinal()]));
        findings.add(stiction(options, oscillates, period, output, measurement, steady, h));
        findings.add(saturation(loop, s));
        findings.add(sluggish(s, monitor.readSummary(now), monitor.status(LoopCondition.SLUGGISH)));
        findings.add(frozen(s, worst[LoopCondition.FROZEN_MEASUREMENT.ordinal()], longestFrozen));
        findings.add(noise(loop, s));
        findings.add(minimumVariance(options, error, steady, h));
        return new Assessment(loop.name(), n, h, findings, period, amplitude, stretches, options.assumptions());
    }

    /** [from, to) of the longest run of samples in automatic, with a constant setpoint and every value present. */
    static int[] longestSteadyStretch(LoggedLoop loop) {
        int bestFrom = 0;
        int bestTo = 0;
        int from = 0;
        for (int k = 0; k <= loop.length(); k++) {
            boolean usable = k < loop.length() && loop.automatic(k) && Double.isFinite(loop.setpoint(k))
                    && Double.isFinite(loop.measurement(k)) && Double.isFinite(loop.output(k))
                    && (k == from || loop.setpoint(k) == loop.setpoint(k - 1));
            if (!usable) {
                if (k - from > bestTo - bestFrom) {
                    bestFrom = from;
                    bestTo = k;
                }
                boolean restartHere = k < loop.length() && loop.automatic(k) && Double.isFinite(loop.setpoint(k))
                        && Double.isFinite(loop.measurement(k)) && Double.isFinite(loop.output(k));
                from = restartHere ? k : k + 1;
            }
        }
        return new int[] {bestFrom, bestTo};
    }

    private static Finding oscillation(MonitorSettings s, ConditionStatus worst, double peakEvents,
            MonitorSummary atPeak, List<TimeSpan> stretches) {
        String note = String.format(Locale.ROOT, "warn from %s; excursion IAE limit a*T/pi = %.4g (a = %.4g, T = %s s),"
                + " supervision time %s s", fmt(s.oscillationWarnEvents()), s.iaeLimit(), s.acceptableAmplitude(),
                fmt(s.timeScaleSeconds()), fmt(s.supervisionTimeSeconds()));
        if (worst != ConditionStatus.OK) {
            note += String.format(Locale.ROOT, "; at its peak: period %.4g s, amplitude %.4g;"
                    + " flagged in %d stretch(es)", atPeak.oscillationPeriodSeconds(), atPeak.oscillationAmplitude(),
                    stretches.size());
        }
        return new Finding(LoopCondition.OSCILLATION.label(), FindingStatus.of(worst), peakEvents,
                s.oscillationAlarmEvents(), "load disturbances per supervision time",
                "IAE between zero crossings of the error, counted with forgetting", HAGGLUND_1995, note);
    }

    /** Regular and large enough for the monitor: the monitor's status; regular but small, or irregular: ok. */
    private static Finding regularity(ErrorAutocorrelation acf, int steadyLength, ConditionStatus monitored) {
        String method = "zero crossings of the error's autocorrelation";
        if (acf == null) {
            return Finding.notAssessed(REGULARITY, "", method, THORNHILL, "the longest steady stretch has "
                    + steadyLength + " samples; the autocorrelation needs " + ACF_MIN_SAMPLES);
        }
        if (Double.isNaN(acf.regularity())) {
            return Finding.notAssessed(REGULARITY, "", method, THORNHILL, "the autocorrelation crosses zero "
                    + acf.crossings() + " times within half the steady stretch; a period needs "
                    + ErrorAutocorrelation.MIN_CROSSINGS);
        }
        FindingStatus status = acf.regular() ? FindingStatus.of(monitored) : FindingStatus.OK;
        String size = !acf.regular() ? "" : monitored == ConditionStatus.OK
                ? " (within the acceptable amplitude: not flagged)" : " (flagged by the oscillation monitor)";
        return new Finding(REGULARITY, status, acf.regularity(), ErrorAutocorrelation.REGULAR, "", method, THORNHILL,
                String.format(Locale.ROOT, "%s oscillation%s; period %.4g s from %d zero crossings; regular when r > 1",
                        acf.regular() ? "regular" : "no regular", size, acf.periodSeconds(), acf.crossings()));
    }

    private static Finding stiction(AssessmentOptions options, boolean oscillates, double period, double[] output,
            double[] measurement, int[] steady, double h) {
        String method = "cross-correlation of output and measurement: odd (stiction) or even";
        String source = "Horch 1999 (from memory)";
        String unit = "deg";
        if (options.processKind() == ProcessKind.INTEGRATING) {
            return Finding.notAssessed(STICTION, unit, method, source, "the test does not apply to an integrating"
                    + " process (--process-kind integrating)");
        }
        if (options.withoutIntegralAction()) {
            return Finding.notAssessed(STICTION, unit, method, source,
                    "the test needs a controller with integral action; this one has none");
        }
        if (!oscillates) {
            return Finding.notAssessed(STICTION, unit, method, source, "the loop does not oscillate; the test needs"
                    + " an oscillation");
        }
        int lag = (int) Math.round(period / h);
        int length = steady[1] - steady[0];
        if (!(lag >= 4) || length < STICTION_MIN_PERIODS * lag) {
            return Finding.notAssessed(STICTION, unit, method, source, String.format(Locale.ROOT,
                    "the longest steady stretch has %d samples; the test needs %d periods of %.4g s", length,
                    STICTION_MIN_PERIODS, period));
        }
        double phase = HorchStiction.phaseDegrees(output, measurement, steady[0], steady[1], lag);
        if (Double.isNaN(phase)) {
            return Finding.notAssessed(STICTION, unit, method, source,
                    "the cross-correlation does not cross zero within one period on both sides of lag 0");
        }
        FindingStatus status = phase > HorchStiction.ALARM_DEGREES ? FindingStatus.ALARM
                : phase >= HorchStiction.WARN_DEGREES ? FindingStatus.WARN : FindingStatus.OK;
        String verdict = status == FindingStatus.ALARM ? "odd: stiction likely"
                : status == FindingStatus.WARN ? "undecided" : "even: no sign of stiction";
        return new Finding(STICTION, status, phase, HorchStiction.ALARM_DEGREES, unit, method, source,
                String.format(Locale.ROOT, "%s (0 deg even, 90 deg odd; undecided from %s deg, our cut-offs);"
                        + " applies to %s loops with integral action", verdict, fmt(HorchStiction.WARN_DEGREES),
                        options.processKind().label()));
    }

    private static Finding saturation(LoggedLoop loop, MonitorSettings s) {
        String method = "share of samples in automatic with the output at a limit";
        if (!Double.isFinite(s.outputMin()) && !Double.isFinite(s.outputMax())) {
            return Finding.notAssessed(LoopCondition.SATURATION.label(), "%", method, "common practice",
                    "the output limits are unknown: give --controller with output-min or output-max");
        }
        long automatic = 0;
        long atLimit = 0;
        double low = s.outputMin() + 1e-9 * Math.max(1.0, Math.abs(s.outputMin()));
        double high = s.outputMax() - 1e-9 * Math.max(1.0, Math.abs(s.outputMax()));
        for (int k = 0; k < loop.length(); k++) {
            double u = loop.output(k);
            if (loop.automatic(k) && Double.isFinite(u)) {
                automatic++;
                atLimit += u <= low || u >= high ? 1 : 0;
            }
        }
        if (automatic == 0) {
            return Finding.notAssessed(LoopCondition.SATURATION.label(), "%", method, "common practice",
                    "no sample in automatic with an output");
        }
        double share = (double) atLimit / automatic;
        FindingStatus status = share > s.saturationAlarmShare() ? FindingStatus.ALARM
                : share > s.saturationWarnShare() ? FindingStatus.WARN : FindingStatus.OK;
        return new Finding(LoopCondition.SATURATION.label(), status, 100.0 * share, 100.0 * s.saturationAlarmShare(),
                "%", method, "common practice", String.format(Locale.ROOT, "over the whole record; warn above %s %%;"
                        + " limits %s to %s", fmt(100.0 * s.saturationWarnShare()), fmt(s.outputMin()),
                        fmt(s.outputMax())));
    }

    private static Finding sluggish(MonitorSettings s, MonitorSummary end, ConditionStatus status) {
        String method = "idle index over load disturbances";
        if (end.idleEpisodes() == 0) {
            return Finding.notAssessed(LoopCondition.SLUGGISH.label(), "", method, HAGGLUND_1999,
                    "no load disturbance detected in automatic at a constant setpoint");
        }
        return new Finding(LoopCondition.SLUGGISH.label(), FindingStatus.of(status), end.idleIndex(),
                s.idleIndexAlarm(), "", method, HAGGLUND_1999, String.format(Locale.ROOT,
                        "mean of the last %d of %d load disturbances; warn above %s; near 1 sluggish, negative brisk",
                        Math.min(end.idleEpisodes(), 4), end.idleEpisodes(), fmt(s.idleIndexWarn())));
    }

    private static Finding frozen(MonitorSettings s, ConditionStatus worst, long longest) {
        return new Finding(LoopCondition.FROZEN_MEASUREMENT.label(), FindingStatus.of(worst), longest,
                s.frozenSamples(), "samples", "measurement unchanged while the output moves", "common practice",
                String.format(Locale.ROOT, "longest unchanged stretch while the output moved more than %.4g;"
                        + " quantisation step %s; warn from half the samples", s.frozenOutputMove(),
                        fmt(s.quantisationStep())));
    }

    private static Finding noise(LoggedLoop loop, MonitorSettings s) {
        String method = "sigma = median |first difference of the measurement| / (0.6745 * sqrt 2)";
        double[] differences = new double[Math.max(0, loop.length() - 1)];
        int count = 0;
        for (int k = 1; k < loop.length(); k++) {
            double d = loop.measurement(k) - loop.measurement(k - 1);
            if (Double.isFinite(d)) {
                differences[count++] = Math.abs(d);
            }
        }
        if (count < 30) {
            return Finding.notAssessed(LoopCondition.NOISE.label(), "", method, "common practice",
                    count + " pairs of consecutive measurements; the estimate needs 30");
        }
        double[] used = java.util.Arrays.copyOf(differences, count);
        java.util.Arrays.sort(used);
        double median = count % 2 == 1 ? used[count / 2] : 0.5 * (used[count / 2 - 1] + used[count / 2]);
        double sigma = median / (0.6744897501960817 * Math.sqrt(2.0));
        FindingStatus status = sigma > s.noiseAlarm() ? FindingStatus.ALARM
                : sigma > s.noiseWarn() ? FindingStatus.WARN : FindingStatus.OK;
        return new Finding(LoopCondition.NOISE.label(), status, sigma, s.noiseAlarm(), "measurement units", method,
                "common practice", String.format(Locale.ROOT, "over the whole record; white Gaussian noise assumed"
                        + " (the median ignores steps and slips); warn above %.4g (a/2), alarm above a", s.noiseWarn()));
    }

    private static Finding minimumVariance(AssessmentOptions options, double[] error, int[] steady, double h) {
        String method = "AR model of the error by least squares; variance of its first d impulse-response terms";
        String source = "Harris 1989; Desborough & Harris 1992 (from memory)";
        if (Double.isNaN(options.deadTimeSeconds())) {
            return Finding.notAssessed(MINIMUM_VARIANCE, "", method, source, "needs the loop's dead time (--dead-time)");
        }
        int length = steady[1] - steady[0];
        if (length < HarrisIndex.MIN_SAMPLES) {
            return Finding.notAssessed(MINIMUM_VARIANCE, "", method, source, "the longest steady stretch has "
                    + length + " samples; the fit needs " + HarrisIndex.MIN_SAMPLES);
        }
        int delay = delaySamples(options.deadTimeSeconds(), h);
        HarrisIndex index = HarrisIndex.of(error, steady[0], steady[1], delay);
        if (!index.stationary()) {
            return Finding.notAssessed(MINIMUM_VARIANCE, "", method, source, "the error is not stationary (the fitted"
                    + " AR model is unstable): the loop drifts or diverges, and the index is not defined");
        }
        FindingStatus status = index.index() < MV_ALARM ? FindingStatus.ALARM
                : index.index() < MV_WARN ? FindingStatus.WARN : FindingStatus.OK;
        return new Finding(MINIMUM_VARIANCE, status, index.index(), MV_ALARM, "", method, source,
                String.format(Locale.ROOT, "1 = minimum variance; alarm below %s, warn below %s (our cut-offs);"
                        + " delay d = %d samples, AR order %d, over %d samples", fmt(MV_ALARM), fmt(MV_WARN), delay,
                        index.order(), Math.min(length, HarrisIndex.MAX_SAMPLES)));
    }

    /**
     * d, the loop's delay in whole samples for a dead time L: floor(L/h) + 1 (the zero-order hold adds
     * one sample: an output applied at k first shows at k + d).
     */
    public static int delaySamples(double deadTimeSeconds, double h) {
        return (int) Math.floor(deadTimeSeconds / h + 1e-9) + 1;
    }

    private static String fmt(double v) {
        return Double.isFinite(v) ? new java.math.BigDecimal(String.format(Locale.ROOT, "%.6g", v)).stripTrailingZeros()
                .toPlainString() : String.valueOf(v);
    }
}
