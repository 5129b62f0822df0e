package org.loopwright.pid.tuning;

import java.util.Locale;

/**
 * A relay experiment run on the device: called once per sample, it drives the output between
 * bias − d and bias + d with hysteresis ε around the setpoint until the loop settles into a limit
 * cycle, measures the cycle's period and amplitude a over several consecutive cycles that agree,
 * and estimates the ultimate point from the describing function of a relay with hysteresis,
 * Ku = 4d/(π·√(a² − ε²)), Pu = the measured period (Åström &amp; Hägglund, "Automatic tuning of
 * simple regulators with specifications on phase and amplitude margins", Automatica 20 (1984)
 * 645-651; recalled from memory).
 *
 * <p>Safety first: on a process-variable excursion beyond the configured band, on a timeout, when
 * the relay stops switching (no oscillation), or on a non-finite sample, it aborts and from then on
 * returns the output it was given at the start; {@link #status()} and {@link #message()} say why.
 * It returns that same output once it has succeeded, so the caller can hand over to a controller.
 *
 * <p>The period is measured between upward switches of the relay, whose times are interpolated
 * linearly between samples; the amplitude is half the peak-to-peak swing of the measurement over
 * each cycle. The first {@link RelaySettings#settlingCycles()} cycles are discarded; the result is
 * taken when the last {@link RelaySettings#measuredCycles()} cycles all lie within
 * {@link RelaySettings#cycleTolerance()} of their mean in both period and amplitude.
 *
 * <p>Example, each sample of a 1 s loop: {@code heater.write(relay.step(1.0, bath.temperature()));}
 * then, once {@code relay.status() == RelayStatus.SUCCEEDED}, tune with
 * {@code UltimatePointRule.ZIEGLER_NICHOLS.tune(relay.ultimatePoint(), ControllerType.PI)}.
 *
 * <p>{@link #step(double, double)} allocates nothing. Not thread-safe: one loop thread calls it.
 */
public final class RelayExperiment {

    private final RelaySettings settings;
    private final double previousOutput;
    private final double setpoint;
    private final double sign;
    private final double hysteresis;
    private final double highOutput;
    private final double lowOutput;
    private final double[] periods;
    private final double[] amplitudes;

    private RelayStatus status = RelayStatus.RUNNING;
    private boolean started;
    private boolean high;
    private double elapsedSeconds;
    private double previousError;
    private double lastSwitchSeconds;
    private double cycleStartSeconds = Double.NaN;
    private double cycleMax;
    private double cycleMin;
    private int completedCycles;
    private int stored;
    private int nextSlot;
    private double ultimateGain = Double.NaN;
    private double ultimatePeriodSeconds = Double.NaN;
    private double oscillationAmplitude = Double.NaN;
    private double abortMeasurement = Double.NaN;
    private double abortStep = Double.NaN;

    /**
     * Prepares an experiment; the relay starts on the first {@link #step(double, double)}.
     *
     * @param settings       validated settings
     * @param previousOutput the output in force before the experiment, restored when it ends
     */
    public RelayExperiment(RelaySettings settings, double previousOutput) {
        this.settings = settings;
        this.previousOutput = previousOutput;
        setpoint = settings.setpoint();
        sign = settings.action().sign();
        hysteresis = settings.hysteresis();
        highOutput = settings.bias() + settings.relayAmplitude();
        lowOutput = settings.bias() - settings.relayAmplitude();
        periods = new double[settings.measuredCycles()];
        amplitudes = new double[settings.measuredCycles()];
    }

    /**
     * Takes one sample and returns the output to apply until the next one.
     *
     * @param h           seconds since the previous call (or since the start, on the first call)
     * @param measurement the process variable now
     * @return bias ± d while running; the previous output once finished or aborted
     */
    public double step(double h, double measurement) {
        if (status != RelayStatus.RUNNING) {
            return previousOutput;
        }
        if (!(h > 0.0) || h == Double.POSITIVE_INFINITY || !Double.isFinite(measurement)) {
            return abort(RelayStatus.ABORTED_INVALID_SAMPLE, h, measurement);
        }
        elapsedSeconds += h;
        if (Math.abs(measurement - setpoint) > settings.excursionLimit()) {
            return abort(RelayStatus.ABORTED_EXCURSION, h, measurement);
        }
        if (elapsedSeconds > settings.timeoutSeconds()) {
            return abort(RelayStatus.ABORTED_TIMEOUT, h, measurement);
        }
        double error = sign * (setpoint - measurement);
        if (!started) {
            started = true;
            high = error >= 0.0;
            lastSwitchSeconds = elapsedSeconds;
        } else {
            cycleMax = Math.max(cycleMax, measurement);
            cycleMin = Math.min(cycleMin, measurement);
            if (high && error < -hysteresis) {
                high = false;
                lastSwitchSeconds = crossingSeconds(h, error, -hysteresis);
            } else if (!high && error > hysteresis) {
                high = true;
                lastSwitchSeconds = crossingSeconds(h, error, hysteresis);
                if (!Double.isNaN(cycleStartSeconds)) {
                    endCycle(lastSwitchSeconds - cycleStartSeconds, 0.5 * (cycleMax - cycleMin));
                }
                cycleStartSeconds = lastSwitchSeconds;
                cycleMax = measurement;
                cycleMin = measurement;
            }
        }
        previousError = error;
        if (status == RelayStatus.SUCCEEDED) {
            return previousOutput;
        }
        if (elapsedSeconds - lastSwitchSeconds > settings.maxHalfPeriodSeconds()) {
            return abort(RelayStatus.ABORTED_NO_OSCILLATION, h, measurement);
        }
        return high ? highOutput : lowOutput;
    }

    /** The interpolated time at which the error passed {@code level} between the last two samples. */
    private double crossingSeconds(double h, double error, double level) {
        double fraction = (previousError - level) / (previousError - error);
        return elapsedSeconds - h + fraction * h;
    }

    private void endCycle(double periodSeconds, double amplitude) {
        completedCycles++;
        if (completedCycles <= settings.settlingCycles()) {
            return;
        }
        periods[nextSlot] = periodSeconds;
        amplitudes[nextSlot] = amplitude;
        nextSlot = (nextSlot + 1) % periods.length;
        stored = Math.min(stored + 1, periods.length);
        if (stored < periods.length) {
            return;
        }
        double meanPeriod = mean(periods);
        double meanAmplitude = mean(amplitudes);
        double tolerance = settings.cycleTolerance();
        if (withinTolerance(periods, meanPeriod, tolerance) && withinTolerance(amplitudes, meanAmplitude, tolerance)) {
            oscillationAmplitude = meanAmplitude;
            ultimatePeriodSeconds = meanPeriod;
            // a > ε always: a cycle holds a sample above setpoint + ε and one below setpoint − ε
            ultimateGain = 4.0 * settings.relayAmplitude()
                    / (Math.PI * Math.sqrt(meanAmplitude * meanAmplitude - hysteresis * hysteresis));
            status = RelayStatus.SUCCEEDED;
        }
    }

    private static double mean(double[] values) {
        double sum = 0.0;
        for (int i = 0; i < values.length; i++) {
            sum += values[i];
        }
        return sum / values.length;
    }

    private static boolean withinTolerance(double[] values, double mean, double tolerance) {
        for (int i = 0; i < values.length; i++) {
            if (Math.abs(values[i] - mean) > tolerance * Math.abs(mean)) {
                return false;
            }
        }
        return true;
    }

    private double abort(RelayStatus reason, double h, double measurement) {
        status = reason;
        abortStep = h;
        abortMeasurement = measurement;
        return previousOutput;
    }

    /** {@return where the experiment stands} */
    public RelayStatus status() {
        return status;
    }

    /** {@return one sentence on the state, with the values behind an abort} Allocates; not for the loop. */
    public String message() {
        return switch (status) {
            case RUNNING -> "running: " + completedCycles + " cycles completed after " + fmt(elapsedSeconds) + " s";
            case SUCCEEDED -> "limit cycle measured over " + settings.measuredCycles() + " cycles: period="
                    + fmt(ultimatePeriodSeconds) + " s, amplitude=" + fmt(oscillationAmplitude) + ", ultimateGain="
                    + fmt(ultimateGain);
            case ABORTED_EXCURSION -> "aborted: the process variable left the band setpoint +/- excursionLimit:"
                    + " measurement=" + fmt(abortMeasurement) + ", setpoint=" + fmt(setpoint) + ", excursionLimit="
                    + fmt(settings.excursionLimit());
            case ABORTED_TIMEOUT -> "aborted: no stable limit cycle within timeoutSeconds="
                    + fmt(settings.timeoutSeconds()) + " (" + completedCycles + " cycles completed)";
            case ABORTED_NO_OSCILLATION -> "aborted: no oscillation, the relay did not switch for more than"
                    + " maxHalfPeriodSeconds=" + fmt(settings.maxHalfPeriodSeconds()) + " (at " + fmt(elapsedSeconds)
                    + " s)";
            case ABORTED_INVALID_SAMPLE -> "aborted: invalid sample, h must be finite and > 0 and the measurement"
                    + " finite: h=" + abortStep + ", measurement=" + abortMeasurement;
        };
    }

    /** {@return the ultimate gain estimate, NaN until {@link RelayStatus#SUCCEEDED}} */
    public double ultimateGain() {
        return ultimateGain;
    }

    /** {@return the ultimate period estimate in seconds, NaN until {@link RelayStatus#SUCCEEDED}} */
    public double ultimatePeriodSeconds() {
        return ultimatePeriodSeconds;
    }

    /** {@return the measured amplitude a (half the peak-to-peak swing), NaN until {@link RelayStatus#SUCCEEDED}} */
    public double oscillationAmplitude() {
        return oscillationAmplitude;
    }

    /** {@return complete relay cycles seen so far, settling cycles included} */
    public int completedCycles() {
        return completedCycles;
    }

    /** {@return seconds since the first sample's time base (the sum of every h)} */
    public double elapsedSeconds() {
        return elapsedSeconds;
    }

    /** {@return the output restored when the experiment ends} */
    public double previousOutput() {
        return previousOutput;
    }

    /**
     * The measured ultimate point.
     *
     * @return Ku and Pu as measured
     * @throws IllegalStateException unless the experiment has succeeded
     */
    public UltimatePoint ultimatePoint() {
        if (status != RelayStatus.SUCCEEDED) {
            throw new IllegalStateException("no ultimate point: " + message());
        }
        return new UltimatePoint(ultimateGain, ultimatePeriodSeconds);
    }

    private static String fmt(double value) {
        return String.format(Locale.ROOT, "%.4g", value);
    }
}
