package org.loopwright.sim.frequency;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.plant.TransferFunction;

/**
 * Margins of a cascade: the outer plant e^(−0.2·s)/(10·s + 1) under PI Kc = 10, Ti = 10 s (alone,
 * L = e^(−0.2·s)/s: crossover 1 rad/s, phase margin 90° − 0.2 rad = 78.54°), around an inner loop
 * of 1/(s + 1) under PI with Ti = 1 s, whose closed loop is 1/(τ·s + 1) with τ = 1/Kc
 * (pole-zero cancellation; Åström &amp; Murray 2021, ch. 11).
 */
class CascadeAnalysisTest {

    private static final TransferFunction OUTER_PLANT = TransferFunction.fopdt(1.0, 10.0, 0.2);
    private static final TransferFunction INNER_PLANT = TransferFunction.firstOrder(1.0, 1.0);
    private static final double INNER_PERIOD = 0.005;
    private static final double OUTER_PERIOD = 0.05;

    private static ControllerSettings outer() {
        return ControllerSettings.builder().gains(IdealGains.pi(10.0, 10.0)).samplePeriodSeconds(OUTER_PERIOD)
                .windupProtection(WindupProtection.ACTUATOR_TRACKING).build();
    }

    /** The inner controller whose closed loop has time constant τ. */
    private static ControllerSettings inner(double closedLoopTimeConstant) {
        return ControllerSettings.builder().gains(IdealGains.pi(1.0 / closedLoopTimeConstant, 1.0))
                .samplePeriodSeconds(INNER_PERIOD).build();
    }

    @Test
    void innerClosedLoopIsTheAnalyticFirstOrderLag() {
        FrequencyResponse t2 = CascadeAnalysis.innerClosedLoop(INNER_PLANT, inner(0.1));
        for (double omega : new double[] {0.01, 0.3, 1.0, 10.0, 100.0, 1000.0}) {
            Complex analytic = Complex.ONE.divide(new Complex(1.0, 0.1 * omega));
            assertThat(t2.at(omega).subtract(analytic).norm()).as("at %f rad/s", omega).isLessThan(1e-12);
        }
    }

    @Test
    void outerMarginsApproachTheOuterLoopAloneAsTheInnerLoopGetsFaster() {
        StabilityMargins alone = LoopAnalysis.continuous(OUTER_PLANT, outer());
        SampledMargins aloneSampled = LoopAnalysis.sampled(SampledLoop.of(OUTER_PLANT, outer()));
        assertThat(alone.gainCrossover().orElseThrow().phaseMarginDegrees())
                .isCloseTo(90.0 - Math.toDegrees(0.2), within(1e-6));
        double previousGap = Double.POSITIVE_INFINITY;
        double previousSampledGap = Double.POSITIVE_INFINITY;
        // inner bandwidth 1/τ at 1, 3, 10 and 30 times the outer crossover of 1 rad/s
        for (double ratio : new double[] {1.0, 3.0, 10.0, 30.0}) {
            double tau = 1.0 / ratio;
            StabilityMargins cascade = CascadeAnalysis.outerContinuous(OUTER_PLANT, outer(), INNER_PLANT, inner(tau));
            double crossover = cascade.gainCrossover().orElseThrow().frequencyRadPerSecond();
            double phaseMargin = cascade.gainCrossover().get().phaseMarginDegrees();
            // analytic: L1 = L_alone/(τ·s + 1), so PM = 90° − 0.2·ωc − atan(τ·ωc) at |L1(jωc)| = 1
            assertThat(phaseMargin).isCloseTo(90.0 - Math.toDegrees(0.2 * crossover + Math.atan(tau * crossover)),
                    within(1e-6));
            assertThat(crossover * Math.sqrt(1.0 + tau * tau * crossover * crossover)).isCloseTo(1.0, within(1e-9));
            double gap = alone.gainCrossover().get().phaseMarginDegrees() - phaseMargin;
            assertThat(gap).as("phase-margin gap at ratio %f", ratio).isPositive().isLessThan(previousGap);
            previousGap = gap;

            SampledMargins sampled = CascadeAnalysis.outerSampled(OUTER_PLANT, outer(), INNER_PLANT, inner(tau), 0);
            assertThat(sampled.stable()).isTrue();
            double sampledGap = aloneSampled.margins().gainCrossover().orElseThrow().phaseMarginDegrees()
                    - sampled.margins().gainCrossover().orElseThrow().phaseMarginDegrees();
            assertThat(sampledGap).as("sampled gap at ratio %f", ratio).isLessThan(previousSampledGap);
            previousSampledGap = sampledGap;
        }
        // common practice: an inner loop 10 times faster or more costs the outer loop only a few degrees
        assertThat(previousGap).isLessThan(2.0);
        assertThat(previousSampledGap).isLessThan(3.0);
    }

    @Test
    void sampledOuterLoopWithEqualPeriodsMatchesThePulseTransferFunctions() {
        // n = 1 needs no lifting: L1(z) = C1(z)·G(z) with G from the pulse-transfer-function algebra
        ControllerSettings outerFast = outer().toBuilder().samplePeriodSeconds(INNER_PERIOD).build();
        PulseTransferFunction g = CascadeAnalysis.innerSetpointToOuterMeasurement(OUTER_PLANT, INNER_PLANT, inner(0.1));
        PulseTransferFunction loop = LoopAnalysis.discreteController(outerFast, INNER_PERIOD).times(g);
        SampledMargins direct = new SampledMargins(MarginSearch.search(loop,
                new FrequencyBand(1e-3, Math.PI / INNER_PERIOD, 200, 1.0, true)), LoopAnalysis.closedLoopPoles(loop));
        SampledMargins state = CascadeAnalysis.outerSampled(OUTER_PLANT, outerFast, INNER_PLANT, inner(0.1), 0);
        // the polynomials have degree ~45 (40 samples of dead time) and lose digits near z = 1, where the
        // crossover lies (ωh = 0.005): agreement to 10⁻³ degrees is what their evaluation allows
        assertThat(state.margins().gainCrossover().orElseThrow().phaseMarginDegrees())
                .isCloseTo(direct.margins().gainCrossover().orElseThrow().phaseMarginDegrees(), within(1e-3));
        assertThat(state.largestPoleMagnitude()).isCloseTo(direct.largestPoleMagnitude(), within(1e-4));
    }
    /**
     * The sensor's delay on the outer measurement is in the analysed loop. Inner plant 1/s under P with
     * Kp2·h = 1 is deadbeat (y2/r2 = 1/z); the outer plant 1/s behind it makes the series 1/s², whose
     * zero-order-hold equivalent is h²(z + 1)/(2(z − 1)²), so the inner setpoint to the outer measurement
     * is G(z) = h(z + 1)/(2z(z − 1)) (Åström &amp; Wittenmark, Computer-Controlled Systems, 3rd ed., 1997,
     * §2.3 table of zero-order-hold equivalents, and §3.2 for the Jury test). Outer P control Kp1 with
     * b = Kp1·h/2 at the same period and N samples of sensor delay gives the characteristic polynomial
     * z^(N+2) − z^(N+1) + b·z + b. N = 0: z² + (b − 1)z + b, stable for 0 &lt; b &lt; 1, complex poles of
     * magnitude √b. N = 1: z³ − z² + b·z + b, whose Jury condition 1 − b² &gt; 2b needs b &lt; √2 − 1.
     * With b = 0.6 the loop is stable without the delay and unstable with one sample of it.
     */
    @Test
    void sensorDelayOnTheOuterMeasurementIsInTheSampledOuterLoop() {
        double h = 0.1;
        TransferFunction integrator = TransferFunction.integrating(1.0, 0.0);
        ControllerSettings inner = ControllerSettings.builder().gains(IdealGains.pi(1.0 / h, Double.POSITIVE_INFINITY))
                .samplePeriodSeconds(h).build();
        ControllerSettings outer = ControllerSettings.builder().gains(IdealGains.pi(2 * 0.6 / h, Double.POSITIVE_INFINITY))
                .samplePeriodSeconds(h).build();
        SampledMargins undelayed = CascadeAnalysis.outerSampled(integrator, outer, integrator, inner, 0);
        assertThat(undelayed.stable()).isTrue();
        assertThat(undelayed.largestPoleMagnitude()).isCloseTo(Math.sqrt(0.6), within(1e-9));
        SampledMargins delayed = CascadeAnalysis.outerSampled(integrator, outer, integrator, inner, 1);
        assertThat(delayed.stable()).isFalse();
        assertThat(delayed.largestPoleMagnitude()).isGreaterThan(1.0);
    }
}
