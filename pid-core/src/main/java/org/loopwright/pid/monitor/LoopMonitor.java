package org.loopwright.pid.monitor;

import java.lang.invoke.VarHandle;
import java.util.Objects;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Watches one control loop, fed once per sample with setpoint, measurement, output and whether the
 * controller is in automatic. Constant work and no allocation per sample; the caller polls
 * {@link #status(LoopCondition)} or copies every figure with {@link #readSummary(MonitorSummary)}.
 *
 * <ul>
 * <li><b>Oscillation</b> (Hägglund 1995, from memory): with the setpoint constant and the controller
 * in automatic, the IAE of the error is integrated between its zero crossings; an excursion whose IAE
 * exceeds a·T/π ({@link MonitorSettings#iaeLimit()}) is a load disturbance. The count is kept with
 * exponential forgetting over the supervision time (x ← γx + 1 per disturbance, γ = 1 − h/Tsup per
 * sample); too many means the loop oscillates. Amplitude and period are the mean peak |e| and twice
 * the mean crossing-to-crossing time of the last {@value #EVENT_MEMORY} disturbances (crossing times
 * interpolated between samples).
 * <li><b>Sluggishness</b>: the idle index Ii = (tpos − tneg)/(tpos + tneg) (Hägglund 1999, from memory),
 * where tpos is the time the increments of the (low-pass filtered) output and measurement have the
 * sign of a slow recovery (the same sign for reverse action) and tneg the time they have the opposite
 * sign. It is evaluated only over excursions that count as load disturbances, from the zero crossing
 * that starts one until the next crossing or until |e| is back under a tenth of its peak; the figure
 * is the mean of the last four. Near 1: the output creeps while the measurement creeps back (sluggish);
 * negative: the loop answers briskly.
 * <li><b>Saturation</b>: the running share (time constant {@link MonitorSettings#saturationWindowSeconds()})
 * of samples in automatic with the output at a limit.
 * <li><b>Frozen measurement</b> (common practice): the measurement has stayed within the quantisation
 * step of one value for N samples while the output moved by more than the threshold; warn at N/2.
 * <li><b>Noise</b>: σ estimated from the first difference of the measurement, σ = (√π/2)·mean|Δy|
 * (for white Gaussian noise Δy has standard deviation σ√2 and mean absolute value 2σ/√π), the mean
 * running with time constant {@link MonitorSettings#noiseWindowSeconds()}. Slow process movement adds
 * little when h is small against the time scale; an oscillation adds its own.
 * </ul>
 *
 * <p>A sample with a NaN or infinite value is counted and skipped: it changes no other figure. A change
 * of setpoint, or a sample in manual or tracking, ends the current excursion without counting it; the
 * next one starts at the next zero crossing. Running shares start as plain means, so the first
 * window is not biased towards zero.
 *
 * <p>Example, beside a controller:
 * <pre>
 *   double u = controller.update(r, y);
 *   monitor.sample(r, y, u, controller.mode() == Mode.AUTOMATIC);
 *   ...
 *   if (monitor.status(LoopCondition.OSCILLATION) == ConditionStatus.ALARM) { ... }   // any thread
 * </pre>
 *
 * <p>Thread rules as for the controller: one loop thread calls {@link #sample}; any thread may call
 * {@link #status}, {@link #worst()} and {@link #readSummary}, which see the figures of one whole
 * sample (a sequence counter around each sample: a reader that overlaps a sample reads again).
 */
public final class LoopMonitor {

    /** Number of recent load disturbances whose amplitude and half-period are averaged. */
    public static final int EVENT_MEMORY = 8;
    /** Number of recent idle-index evaluations averaged. */
    static final int IDLE_MEMORY = 4;
    /** A counted excursion's idle evaluation ends when |e| falls under this share of its peak (our choice). */
    static final double RECOVERED_SHARE = 0.1;
    /** Filter time constant for the idle index's signals, in time scales (our choice). */
    static final double IDLE_FILTER_TIME_SCALES = 0.05;
    /** Differences taken before the noise estimate is trusted (our choice). */
    static final long NOISE_MIN_DIFFERENCES = 30;
    private static final double NOISE_FROM_MEAN_ABS_DIFF = Math.sqrt(Math.PI) / 2.0;
    private static final LoopCondition[] CONDITIONS = LoopCondition.values();

    private final MonitorSettings settings;
    private final double h;
    private final double iaeLimit;
    private final double forgetting;
    private final double saturationWeight;
    private final double noiseWeight;
    private final double idleFilterWeight;
    private final double recoverySign;
    private final double lowLimit;
    private final double highLimit;

    // odd while a sample is being taken; readers retry when it is odd or changed under them
    private final AtomicLong sequence = new AtomicLong();
    private final AtomicInteger statusWord = new AtomicInteger();

    // everything below is written by the loop thread between the two sequence writes
    private long samples;
    private long badSamples;
    private boolean hasPrevious;
    private double previousSetpoint;
    private double previousError;
    private boolean previousAutomatic;
    private double previousMeasurement;

    private double meanAbsDifference;
    private long differences;

    private double frozenReference;
    private long unchangedSamples;
    private double frozenOutputMin;
    private double frozenOutputMax;

    private long automaticSamples;
    private double saturationShare = Double.NaN;

    private double events;
    private boolean excursionOpen;
    private boolean excursionCounted;
    private double excursionStart;
    private double excursionIae;
    private double excursionPeak;
    private final double[] halfPeriods = new double[EVENT_MEMORY];
    private final double[] peaks = new double[EVENT_MEMORY];
    private long recordedEvents;

    private double filteredMeasurement;
    private double filteredOutput;
    private double positiveSeconds;
    private double negativeSeconds;
    private boolean idleOpen;
    private double idleIndex = Double.NaN;
    private long idleEpisodes;

    /**
     * A monitor with no samples.
     *
     * @param settings the thresholds
     */
    public LoopMonitor(MonitorSettings settings) {
        this.settings = Objects.requireNonNull(settings, "settings");
        h = settings.samplePeriodSeconds();
        iaeLimit = settings.iaeLimit();
        forgetting = 1.0 - Math.min(1.0, h / settings.supervisionTimeSeconds());
        saturationWeight = Math.min(1.0, h / settings.saturationWindowSeconds());
        noiseWeight = Math.min(1.0, h / settings.noiseWindowSeconds());
        double filterTime = IDLE_FILTER_TIME_SCALES * settings.timeScaleSeconds();
        idleFilterWeight = h / (h + filterTime);
        recoverySign = settings.action().sign();
        lowLimit = settings.outputMin() + limitTolerance(settings.outputMin());
        highLimit = settings.outputMax() - limitTolerance(settings.outputMax());
    }

    /** An output within a few parts in 10⁹ of a limit is at it (limits are exact in the controller). */
    private static double limitTolerance(double limit) {
        return Double.isFinite(limit) ? 1e-9 * Math.max(1.0, Math.abs(limit)) : 0.0;
    }

    /** {@return the settings this monitor was built with} */
    public MonitorSettings settings() {
        return settings;
    }

    /**
     * Takes one sample. Loop thread only.
     *
     * @param setpoint    r
     * @param measurement y
     * @param output      u, the output the controller produced
     * @param automatic   whether the controller is in automatic (manual and tracking are not)
     */
    public void sample(double setpoint, double measurement, double output, boolean automatic) {
        long s = sequence.get();
        sequence.setOpaque(s + 1);
        VarHandle.storeStoreFence();
        if (Double.isFinite(setpoint) && Double.isFinite(measurement) && Double.isFinite(output)) {
            take(setpoint, measurement, output, automatic);
        } else {
            badSamples++;
        }
        sequence.setRelease(s + 2);
    }

    private void take(double setpoint, double measurement, double output, boolean automatic) {
        samples++;
        double error = setpoint - measurement;
        if (hasPrevious) {
            differences++;
            meanAbsDifference += Math.max(noiseWeight, 1.0 / differences)
                    * (Math.abs(measurement - previousMeasurement) - meanAbsDifference);
        }
        watchFrozen(measurement, output);
        if (automatic) {
            automaticSamples++;
            double atLimit = output <= lowLimit || output >= highLimit ? 1.0 : 0.0;
            saturationShare = automaticSamples == 1 ? atLimit
                    : saturationShare + Math.max(saturationWeight, 1.0 / automaticSamples) * (atLimit - saturationShare);
        }
        watchExcursions(setpoint, error, measurement, output, automatic);

        hasPrevious = true;
        previousSetpoint = setpoint;
        previousError = error;
        previousAutomatic = automatic;
        previousMeasurement = measurement;
        publishStatuses();
    }

    private void watchFrozen(double measurement, double output) {
        if (!hasPrevious || Math.abs(measurement - frozenReference) > settings.quantisationStep()) {
            frozenReference = measurement;
            unchangedSamples = 0;
            frozenOutputMin = output;
            frozenOutputMax = output;
        } else {
            unchangedSamples++;
            frozenOutputMin = Math.min(frozenOutputMin, output);
            frozenOutputMax = Math.max(frozenOutputMax, output);
        }
    }

    private void watchExcursions(double setpoint, double error, double measurement, double output, boolean automatic) {
        events *= forgetting;
        double lastMeasurement = filteredMeasurement;
        double lastOutput = filteredOutput;
        if (hasPrevious) {
            filteredMeasurement += idleFilterWeight * (measurement - filteredMeasurement);
            filteredOutput += idleFilterWeight * (output - filteredOutput);
        } else {
            filteredMeasurement = measurement;
            filteredOutput = output;
        }
        if (!automatic || !hasPrevious || !previousAutomatic || setpoint != previousSetpoint) {
            excursionOpen = false;
            idleOpen = false;
            return;
        }
        if ((error > 0.0) != (previousError > 0.0)) {
            double crossing = (samples - 2) * h + h * previousError / (previousError - error);
            if (excursionOpen) {
                closeExcursion(crossing);
            }
            excursionOpen = true;
            excursionCounted = false;
            excursionStart = crossing;
            excursionIae = 0.0;
            excursionPeak = 0.0;
            idleOpen = true;
            positiveSeconds = 0.0;
            negativeSeconds = 0.0;
        }
        if (!excursionOpen) {
            return;
        }
        double magnitude = Math.abs(error);
        excursionIae += magnitude * h;
        excursionPeak = Math.max(excursionPeak, magnitude);
        if (idleOpen) {
            double product = recoverySign * (filteredMeasurement - lastMeasurement) * (filteredOutput - lastOutput);
            if (product > 0.0) {
                positiveSeconds += h;
            } else if (product < 0.0) {
                negativeSeconds += h;
            }
        }
        if (!excursionCounted && excursionIae > iaeLimit) {
            excursionCounted = true;
            events += 1.0;
        }
        if (excursionCounted && idleOpen && magnitude < RECOVERED_SHARE * excursionPeak) {
            finishIdle();
        }
    }

    private void closeExcursion(double crossing) {
        if (!excursionCounted) {
            return;
        }
        int slot = (int) (recordedEvents % EVENT_MEMORY);
        halfPeriods[slot] = crossing - excursionStart;
        peaks[slot] = excursionPeak;
        recordedEvents++;
        if (idleOpen) {
            finishIdle();
        }
    }

    private void finishIdle() {
        idleOpen = false;
        double total = positiveSeconds + negativeSeconds;
        if (total > 0.0) {
            double episode = (positiveSeconds - negativeSeconds) / total;
            idleEpisodes++;
            idleIndex = idleEpisodes == 1 ? episode
                    : idleIndex + (episode - idleIndex) / Math.min(idleEpisodes, IDLE_MEMORY);
        }
    }

    private void publishStatuses() {
        int word = code(LoopCondition.OSCILLATION,
                level(events, settings.oscillationWarnEvents(), settings.oscillationAlarmEvents()))
                | code(LoopCondition.SLUGGISH, idleEpisodes == 0 ? 0
                        : level(idleIndex, settings.idleIndexWarn(), settings.idleIndexAlarm()))
                | code(LoopCondition.SATURATION, automaticSamples == 0 ? 0
                        : level(saturationShare, settings.saturationWarnShare(), settings.saturationAlarmShare()))
                | code(LoopCondition.FROZEN_MEASUREMENT, frozenOutputMax - frozenOutputMin <= settings.frozenOutputMove()
                        ? 0 : level(unchangedSamples, 0.5 * settings.frozenSamples() - 0.5, settings.frozenSamples() - 0.5))
                | code(LoopCondition.NOISE, differences < NOISE_MIN_DIFFERENCES ? 0
                        : level(noise(), settings.noiseWarn(), settings.noiseAlarm()));
        if (word != statusWord.getPlain()) {
            statusWord.setRelease(word);
        }
    }

    /** 0 ok, 1 warn, 2 alarm: strictly above a threshold. */
    private static int level(double value, double warn, double alarm) {
        return value > alarm ? 2 : value > warn ? 1 : 0;
    }

    private static int code(LoopCondition condition, int level) {
        return level << (2 * condition.ordinal());
    }

    private double noise() {
        return differences == 0 ? Double.NaN : NOISE_FROM_MEAN_ABS_DIFF * meanAbsDifference;
    }

    /**
     * The condition's status after the last sample; any thread.
     *
     * @param condition the condition to read
     * @return ok, warn or alarm for that condition
     */
    public ConditionStatus status(LoopCondition condition) {
        return MonitorSummary.statusOf(statusWord.getAcquire(), condition);
    }

    /** {@return the worst status of all conditions after the last sample} Any thread may call it. */
    public ConditionStatus worst() {
        int word = statusWord.getAcquire();
        ConditionStatus worst = ConditionStatus.OK;
        for (LoopCondition c : CONDITIONS) {
            ConditionStatus s = MonitorSummary.statusOf(word, c);
            if (s.compareTo(worst) > 0) {
                worst = s;
            }
        }
        return worst;
    }

    /**
     * Copies the figures of the last whole sample into {@code into}; any thread, no allocation.
     *
     * @param into the holder to overwrite
     * @return {@code into}
     */
    public MonitorSummary readSummary(MonitorSummary into) {
        while (true) {
            long before = sequence.getAcquire();
            if ((before & 1L) == 0L) {
                copyInto(into);
                VarHandle.loadLoadFence();
                if (sequence.getAcquire() == before) {
                    return into;
                }
            }
            Thread.onSpinWait();
        }
    }

    private void copyInto(MonitorSummary into) {
        into.samples = samples;
        into.badSamples = badSamples;
        into.oscillationEvents = events;
        long kept = Math.min(recordedEvents, EVENT_MEMORY);
        double halfPeriodSum = 0.0;
        double peakSum = 0.0;
        for (int i = 0; i < kept; i++) {
            halfPeriodSum += halfPeriods[i];
            peakSum += peaks[i];
        }
        into.oscillationPeriodSeconds = kept < 2 ? Double.NaN : 2.0 * halfPeriodSum / kept;
        into.oscillationAmplitude = kept < 2 ? Double.NaN : peakSum / kept;
        into.idleIndex = idleIndex;
        into.idleEpisodes = idleEpisodes;
        into.saturationShare = saturationShare;
        into.unchangedSamples = unchangedSamples;
        into.noiseStdDev = differences < NOISE_MIN_DIFFERENCES ? Double.NaN : noise();
        into.statusWord = statusWord.getPlain(); // written inside the sample, so of the same sample
    }
}
