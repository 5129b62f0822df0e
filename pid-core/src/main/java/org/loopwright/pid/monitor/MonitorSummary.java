package org.loopwright.pid.monitor;

/**
 * The figures of a {@link LoopMonitor} at one sample, copied by {@link LoopMonitor#readSummary}.
 * A holder to recycle: read into the same instance as often as needed, nothing is allocated.
 * Figures that have no evidence yet are NaN.
 *
 * <p>Not thread-safe: one reader thread owns an instance.
 */
public final class MonitorSummary {

    private static final LoopCondition[] CONDITIONS = LoopCondition.values();
    private static final ConditionStatus[] STATUSES = ConditionStatus.values();

    long samples;
    long badSamples;
    int statusWord;
    double oscillationEvents;
    double oscillationPeriodSeconds;
    double oscillationAmplitude;
    double idleIndex;
    long idleEpisodes;
    double saturationShare;
    long unchangedSamples;
    double noiseStdDev;

    /** An empty summary (no samples, every figure NaN). */
    public MonitorSummary() {
        oscillationPeriodSeconds = Double.NaN;
        oscillationAmplitude = Double.NaN;
        idleIndex = Double.NaN;
        saturationShare = Double.NaN;
        noiseStdDev = Double.NaN;
    }

    /** {@return samples taken (finite setpoint, measurement and output)} */
    public long samples() {
        return samples;
    }

    /** {@return samples skipped because a value was NaN or infinite} */
    public long badSamples() {
        return badSamples;
    }

    /**
     * The condition's status.
     *
     * @param condition the condition to read
     * @return ok, warn or alarm for that condition in this summary
     */
    public ConditionStatus status(LoopCondition condition) {
        return statusOf(statusWord, condition);
    }

    /** {@return the worst status of all conditions} */
    public ConditionStatus worst() {
        ConditionStatus worst = ConditionStatus.OK;
        for (LoopCondition c : CONDITIONS) {
            ConditionStatus s = status(c);
            if (s.compareTo(worst) > 0) {
                worst = s;
            }
        }
        return worst;
    }

    /** {@return load disturbances counted within the supervision time (exponential forgetting, Hägglund 1995)} */
    public double oscillationEvents() {
        return oscillationEvents;
    }

    /** {@return twice the mean time between the zero crossings of the last counted excursions (seconds), or NaN} */
    public double oscillationPeriodSeconds() {
        return oscillationPeriodSeconds;
    }

    /** {@return the mean peak |error| of the last counted excursions (measurement units), or NaN} */
    public double oscillationAmplitude() {
        return oscillationAmplitude;
    }

    /** {@return the idle index averaged over the last load disturbances (Hägglund 1999), or NaN before the first} */
    public double idleIndex() {
        return idleIndex;
    }

    /** {@return load disturbances after which the idle index was evaluated} */
    public long idleEpisodes() {
        return idleEpisodes;
    }

    /** {@return the running share of samples in automatic with the output at a limit, 0..1, or NaN before any} */
    public double saturationShare() {
        return saturationShare;
    }

    /** {@return samples since the measurement last changed by more than the quantisation step} */
    public long unchangedSamples() {
        return unchangedSamples;
    }

    /** {@return the measurement noise's standard deviation estimated from its first difference, or NaN} */
    public double noiseStdDev() {
        return noiseStdDev;
    }

    static ConditionStatus statusOf(int word, LoopCondition condition) {
        return STATUSES[(word >>> (2 * condition.ordinal())) & 3];
    }

    @Override
    public String toString() {
        StringBuilder text = new StringBuilder(160).append("samples=").append(samples);
        for (LoopCondition c : CONDITIONS) {
            text.append(' ').append(c.label()).append('=').append(status(c).name().toLowerCase(java.util.Locale.ROOT));
        }
        return text.toString();
    }
}
