package org.loopwright.sim.frequency;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.hipparchus.complex.Complex;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.plant.TransferFunction;

/**
 * Margins of a PID loop, for the continuous design and for the loop as it runs sampled.
 *
 * <p>The loop is L = σ·C·P with σ = +1 for reverse action and −1 for direct action, so a direct-acting
 * controller on a plant of negative gain gives an ordinary loop. The sampled loop is the discrete
 * controller C(z) from {@link ControllerSettings#discretePid(double)} (the coefficients the running
 * controller uses) in series with the plant's {@link ZeroOrderHoldEquivalent} and the sensor's whole
 * samples of delay z^(−N) — the complete {@link SampledLoop} as the simulation runs it — evaluated at
 * z = e^{jωh} for 0 &lt; ω &le; π/h; no computation delay is assumed (the output is applied at the
 * sample it was computed from).
 *
 * <p>Cost: the closed-loop poles are the eigenvalues of a companion matrix of order n + d + 2 (plant
 * order, dead time in periods, controller), which takes O((n + d)³): milliseconds for tens of periods
 * of dead time, seconds for several hundred.
 *
 * <p>Example: P control with gain 4 on 1/(s+1)³ has a gain margin of 2 at ω = √3 rad/s:
 * <pre>{@code
 * StabilityMargins m = LoopAnalysis.continuous(
 *         new TransferFunction(new double[] {1}, new double[] {1, 3, 3, 1}, 0.0),
 *         ControllerSettings.builder().gains(new ParallelGains(4, 0, 0)).samplePeriodSeconds(0.01).build());
 * m.phaseCrossover().get().gainMargin(); // 2.0
 * }</pre>
 * Thread-safe: stateless.
 */
public final class LoopAnalysis {

    /** Decades the band reaches beyond the slowest and fastest corner frequency of plant and controller. */
    private static final double CORNER_DECADES = 1.0;
    /** Decades the band may be widened further while the loop gain is still within 10³ of 1. */
    private static final int EXTRA_DECADES = 8;
    /** The band ends where |L| has fallen below this (a phase crossover there has a gain margin above 60 dB). */
    private static final double NEGLIGIBLE_LOOP_GAIN = 1e-3;
    private static final int POINTS_PER_DECADE = 200;
    /** The largest closed-loop order whose stabilising gain range is searched (about 160 pole computations). */
    public static final int MAX_GAIN_RANGE_ORDER = 200;

    private LoopAnalysis() {
    }

    /** The margins of the continuous design C(s)·P(s) with its dead time. */
    public static StabilityMargins continuous(TransferFunction plant, ControllerSettings settings) {
        return MarginSearch.search(continuousLoop(plant, settings), continuousBand(plant, settings));
    }

    /**
     * The margins and closed-loop poles of the sampled loop: controller, plant and every sample of
     * sensor delay in it.
     *
     * @throws InvalidSettingException if the forward-Euler derivative is unstable at the loop's period
     */
    public static SampledMargins sampled(SampledLoop loop) {
        PulseTransferFunction pulse = sampledLoop(loop);
        StabilityMargins margins = MarginSearch.search(pulse, sampledBand(loop, pulse));
        return new SampledMargins(margins, closedLoopPoles(pulse));
    }

    /**
     * The range of loop-gain factors k over which the sampled closed loop is stable, from the
     * closed-loop poles of A(z)·z^d + k·B(z): the interval around k = 1 when the loop is stable, else the
     * stabilising interval nearest to it; empty when no factor in [10⁻⁴, 10⁴] stabilises the loop, or the
     * loop's order exceeds {@value #MAX_GAIN_RANGE_ORDER} (each trial costs a pole computation). The ends
     * are found on a grid of ten factors a decade and refined by bisection to 10⁻⁹ relative.
     */
    public static Optional<GainRange> stableGainRange(SampledLoop loop) {
        PulseTransferFunction pulse = sampledLoop(loop);
        if (pulse.closedLoopCharacteristic().degree() > MAX_GAIN_RANGE_ORDER) {
            return Optional.empty();
        }
        int decades = 4;
        int perDecade = 10;
        int n = 2 * decades * perDecade + 1;
        double[] factor = new double[n];
        boolean[] stable = new boolean[n];
        int nominal = decades * perDecade;
        for (int i = 0; i < n; i++) {
            factor[i] = Math.pow(10.0, (double) (i - nominal) / perDecade);
            stable[i] = stableAt(pulse, factor[i]);
        }
        int centre = -1;
        for (int distance = 0; distance <= nominal && centre < 0; distance++) {
            if (stable[nominal - distance]) {
                centre = nominal - distance;
            } else if (stable[nominal + distance]) {
                centre = nominal + distance;
            }
        }
        if (centre < 0) {
            return Optional.empty();
        }
        int first = centre;
        while (first > 0 && stable[first - 1]) {
            first--;
        }
        int last = centre;
        while (last + 1 < n && stable[last + 1]) {
            last++;
        }
        double low = first == 0 ? 0.0 : boundary(pulse, factor[first - 1], factor[first]);
        double high = last == n - 1 ? Double.POSITIVE_INFINITY : boundary(pulse, factor[last], factor[last + 1]);
        return Optional.of(new GainRange(low, high));
    }

    /** The stability boundary between two factors of which exactly one is stable, by bisection. */
    private static double boundary(PulseTransferFunction pulse, double a, double b) {
        boolean stableAtA = stableAt(pulse, a);
        double lo = a;
        double hi = b;
        while (hi - lo > 1e-9 * hi) {
            double mid = Math.sqrt(lo * hi);
            if (stableAt(pulse, mid) == stableAtA) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    private static boolean stableAt(PulseTransferFunction pulse, double factor) {
        for (Complex pole : closedLoopPoles(pulse.times(factor))) {
            if (pole.norm() >= 1.0) {
                return false;
            }
        }
        return true;
    }

    /** The continuous loop σ·C(jω)·P(jω). */
    public static FrequencyResponse continuousLoop(TransferFunction plant, ControllerSettings settings) {
        return new ContinuousController(settings).times(new ContinuousPlant(plant)).times(settings.action().sign());
    }

    /**
     * The discrete controller C(z) at {@code periodSeconds} with the settings' methods.
     *
     * @throws InvalidSettingException if the forward-Euler derivative is unstable at this period (h &ge; 2·Tf)
     */
    public static PulseTransferFunction discreteController(ControllerSettings settings, double periodSeconds) {
        settings.derivativeMethod().requireStable(settings.parallelGains().derivativeGain(), periodSeconds,
                settings.derivativeFilterTimeSeconds());
        return PulseTransferFunction.of(settings.discretePid(periodSeconds));
    }

    /**
     * The sampled loop σ·C(z)·P_zoh(z)·z^(−N), N the samples of sensor delay.
     *
     * @throws IllegalArgumentException if the loop has more than {@link SampledLoop#MAX_DELAY_SAMPLES} of delay
     */
    public static PulseTransferFunction sampledLoop(SampledLoop loop) {
        requireAnalysableDelay(loop); // before C(z) is made, so a too-long delay is the error reported first
        return sampledLoop(loop, discreteController(loop.controller(), loop.periodSeconds()));
    }

    /**
     * The sampled loop σ·C(z)·P_zoh(z)·z^(−N) with the controller's C(z) given, as {@link #discreteController}
     * makes it for the loop's settings and period: a sweep makes it once for all the plants it draws.
     *
     * @throws IllegalArgumentException if the loop has more than {@link SampledLoop#MAX_DELAY_SAMPLES} of delay
     */
    public static PulseTransferFunction sampledLoop(SampledLoop loop, PulseTransferFunction controller) {
        requireAnalysableDelay(loop);
        double h = loop.periodSeconds();
        PulseTransferFunction sensor = new PulseTransferFunction(PulseTransferFunction.constant(1.0),
                PulseTransferFunction.constant(1.0), loop.sensorDelaySamples(), h);
        return controller
                .times(ZeroOrderHoldEquivalent.of(loop.plant(), h))
                .times(sensor)
                .times(loop.controller().action().sign());
    }

    private static void requireAnalysableDelay(SampledLoop loop) {
        if (loop.delaySamples() > SampledLoop.MAX_DELAY_SAMPLES) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "the sampled loop's delay must be at most %d"
                    + " samples for analysis: dead time %s s and %d sensor samples at h = %s s give %.4g",
                    SampledLoop.MAX_DELAY_SAMPLES, loop.plant().deadTimeSeconds(), loop.sensorDelaySamples(),
                    loop.periodSeconds(), loop.delaySamples()));
        }
    }

    /** The closed-loop poles of unity negative feedback around {@code loop}: roots of A(z)·z^d + B(z). */
    public static List<Complex> closedLoopPoles(PulseTransferFunction loop) {
        return PolynomialRoots.of(loop.closedLoopCharacteristic());
    }

    /**
     * The band searched for the continuous loop: a decade beyond the slowest and the fastest corner
     * of plant (poles, zeros, 1/L) and controller (Ki/Kp, Kp/Kd, 1/Tf), widened a decade at a time
     * while the loop gain is still below 10³ at the low end or above 10⁻³ at the high end, so every
     * gain crossover lies inside, and every phase crossover with a gain margin below 60 dB.
     */
    public static FrequencyBand continuousBand(TransferFunction plant, ControllerSettings settings) {
        List<Double> corners = corners(plant, settings);
        double slowest = corners.stream().mapToDouble(Double::doubleValue).min().orElse(1.0);
        double fastest = corners.stream().mapToDouble(Double::doubleValue).max().orElse(1.0);
        double low = slowest * Math.pow(10.0, -CORNER_DECADES);
        double high = fastest * Math.pow(10.0, CORNER_DECADES);
        FrequencyResponse loop = continuousLoop(plant, settings);
        for (int i = 0; i < EXTRA_DECADES && loop.at(low).norm() < 1.0 / NEGLIGIBLE_LOOP_GAIN; i++) {
            low /= 10.0;
        }
        for (int i = 0; i < EXTRA_DECADES && loop.at(high).norm() > NEGLIGIBLE_LOOP_GAIN; i++) {
            high *= 10.0;
        }
        return new FrequencyBand(low, high, POINTS_PER_DECADE, plant.deadTimeSeconds(), false);
    }

    private static FrequencyBand sampledBand(SampledLoop loop, PulseTransferFunction pulse) {
        double nyquist = pulse.nyquistRadPerSecond();
        double low = Math.min(continuousBand(loop.plant(), loop.controller()).lowestRadPerSecond(), nyquist * 1e-4);
        // z^(−d) and the hold's fractional delay turn the phase at about (d + 1)·h seconds
        double delaySeconds = (pulse.delaySamples() + 1) * pulse.periodSeconds();
        return new FrequencyBand(low, nyquist, POINTS_PER_DECADE, delaySeconds, true);
    }

    private static List<Double> corners(TransferFunction plant, ControllerSettings settings) {
        List<Double> corners = new ArrayList<>();
        for (Complex root : PolynomialRoots.ofDescending(plant.denominator())) {
            addPositive(corners, root.norm());
        }
        for (Complex root : PolynomialRoots.ofDescending(plant.numerator())) {
            addPositive(corners, root.norm());
        }
        if (plant.deadTimeSeconds() > 0.0) {
            corners.add(1.0 / plant.deadTimeSeconds());
        }
        ParallelGains gains = settings.parallelGains();
        if (gains.proportionalGain() > 0.0 && gains.integralGain() > 0.0) {
            corners.add(gains.integralGain() / gains.proportionalGain());
        }
        if (gains.proportionalGain() > 0.0 && gains.derivativeGain() > 0.0) {
            corners.add(gains.proportionalGain() / gains.derivativeGain());
        }
        if (gains.derivativeGain() > 0.0) {
            addPositive(corners, 1.0 / settings.derivativeFilterTimeSeconds());
        }
        return corners;
    }

    private static void addPositive(List<Double> corners, double value) {
        if (value > 0.0 && Double.isFinite(value)) {
            corners.add(value);
        }
    }
}
