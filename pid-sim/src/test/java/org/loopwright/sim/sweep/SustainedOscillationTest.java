package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

/**
 * The sustained-oscillation rule against analytic cases: damped sinusoids whose decay ratio is known in
 * closed form, and a linear loop at and well below its ultimate gain, where the poles give the answer.
 */
class SustainedOscillationTest {

    /**
     * A mode e(t) = c + A·e^(−ζωt)·cos(ω√(1 − ζ²)·t) has its turning points π/ω_d apart, and each swing
     * is the one a cycle before times exp(−2πζ/√(1 − ζ²)), the decay ratio (the standard second-order
     * result, e.g. Åström &amp; Hägglund 2006, §4.3, from memory; it follows from the envelope e^(−ζωt)
     * over one period 2π/ω_d). The rule measures it from samples (500 per period) to within 1e-3, and calls
     * the oscillation sustained exactly when the ratio is at least 0.9.
     */
    @Property(tries = 1000)
    void measuresTheDecayRatioOfADampedModeAndJudgesItByTheLimit(
            @ForAll @DoubleRange(min = 0.0, max = 0.35) double damping,
            @ForAll @DoubleRange(min = 0.2, max = 20.0) double naturalFrequency,
            @ForAll @DoubleRange(min = 0.1, max = 10.0) double amplitude,
            @ForAll @DoubleRange(min = -5.0, max = 5.0) double offset) {
        double dampedFrequency = naturalFrequency * Math.sqrt(1.0 - damping * damping);
        double period = 2.0 * Math.PI / dampedFrequency;
        double analytic = Math.exp(-2.0 * Math.PI * damping / Math.sqrt(1.0 - damping * damping));
        double h = period / 500.0;
        double end = 3.2 * period;
        // the smallest swing in the run, a cycle's decay short of the last, stays above the floor
        SustainedOscillation check = new SustainedOscillation(0.0, 1e-3 * amplitude * Math.pow(analytic, 4.0));
        for (int k = 0; k * h <= end; k++) {
            double t = k * h;
            check.sample(t, offset + amplitude * Math.exp(-damping * naturalFrequency * t)
                    * Math.cos(dampedFrequency * t));
        }
        assertThat(check.swings()).isGreaterThanOrEqualTo(SustainedOscillation.MIN_SWINGS);
        assertThat(check.decayRatio()).isCloseTo(analytic, within(1e-3 * analytic));
        if (Math.abs(analytic - SustainedOscillation.DECAY_RATIO_LIMIT) > 2e-3) {
            assertThat(check.sustained()).as("decay ratio %s", analytic)
                    .isEqualTo(analytic >= SustainedOscillation.DECAY_RATIO_LIMIT);
        }
    }

    /**
     * The rule's stated limit (see {@link SustainedOscillation}): an undamped oscillation of any phase, amplitude
     * and offset, over a stretch S = 100 s after the last event (floor 0.04, a unit setpoint step), is caught
     * whenever its period is at most S/6, and never when it is longer than S/4: two whole cycles must fit in the
     * final half after its first turn.
     */
    @Property(tries = 1000)
    void catchesEveryOscillationOfAtMostASixthOfTheStretch(
            @ForAll @DoubleRange(min = 6.0, max = 50.0) double periodsInStretch,
            @ForAll @DoubleRange(min = 0.0, max = 6.3) double phase,
            @ForAll @DoubleRange(min = 0.1, max = 10.0) double amplitude,
            @ForAll @DoubleRange(min = -5.0, max = 5.0) double offset) {
        assertThat(undamped(periodsInStretch, phase, amplitude, offset).sustained()).isTrue();
    }

    @Property(tries = 1000)
    void missesEveryOscillationSlowerThanAQuarterOfTheStretch(
            @ForAll @DoubleRange(min = 0.5, max = 4.0, maxIncluded = false) double periodsInStretch,
            @ForAll @DoubleRange(min = 0.0, max = 6.3) double phase,
            @ForAll @DoubleRange(min = 0.1, max = 10.0) double amplitude,
            @ForAll @DoubleRange(min = -5.0, max = 5.0) double offset) {
        assertThat(undamped(periodsInStretch, phase, amplitude, offset).sustained()).isFalse();
    }

    /** offset + A·sin(2πt/P + phase) over S = 100 s after the last event at t = 0 (P = S / periods), every 10 ms. */
    private static SustainedOscillation undamped(double periods, double phase, double amplitude, double offset) {
        double stretch = 100.0;
        double period = stretch / periods;
        SustainedOscillation check = new SustainedOscillation(0.5 * stretch, 2.0 * 0.02 * 1.0);
        for (int k = 0; k <= 10_000; k++) {
            double t = 0.01 * k;
            check.sample(t, offset + amplitude * Math.sin(2.0 * Math.PI * t / period + phase));
        }
        return check;
    }

    /** Noise and quantisation whose peak to peak (0.036) is within the floor (0.04) make no swings: not an oscillation. */
    @Test
    void ripplesWithinTheFloorAreNotAnOscillation() {
        SustainedOscillation check = new SustainedOscillation(0.0, 0.04);
        for (int k = 0; k < 10_000; k++) {
            check.sample(0.01 * k, 0.015 * Math.sin(0.7 * k) + 0.0005 * ((k * 7919) % 13 - 6));
        }
        assertThat(check.swings()).isZero();
        assertThat(check.sustained()).isFalse();
        assertThat(check.decayRatio()).isNaN();
    }

    /** An undamped oscillation that stops (the loop then sits still) is not sustained: it must last to the end. */
    @Test
    void anOscillationThatStopsBeforeTheEndIsNotSustained() {
        SustainedOscillation stopping = new SustainedOscillation(0.0, 0.04);
        SustainedOscillation lasting = new SustainedOscillation(0.0, 0.04);
        for (int k = 0; k <= 20_000; k++) {
            double t = 0.01 * k;
            stopping.sample(t, t < 100.0 ? Math.sin(t) : 0.0);
            lasting.sample(t, Math.sin(t));
        }
        assertThat(stopping.decayRatio()).isCloseTo(1.0, within(1e-3));
        assertThat(stopping.sustained()).isFalse();
        assertThat(lasting.sustained()).isTrue();
    }

    /**
     * P control with loop gain K on 1/(s+1)³: the closed loop is on the stability boundary at the ultimate
     * gain K = 8 (Routh–Hurwitz: s³ + 3s² + 3s + 1 + K is Hurwitz iff 9 &gt; 1 + K; it oscillates at
     * ω = √3 rad/s), just beyond it when sampled (the hold's lag); at K = 2, a gain margin of 4, it is well
     * damped. The rule, from the simulated step response alone, agrees with the poles in both cases.
     */
    @Test
    void agreesWithThePolesAtTheUltimateGainAndWellBelowIt() {
        Scenario atUltimate = thirdOrderLag(8.0);
        Scenario wellDamped = thirdOrderLag(2.0);

        assertThat(largestPoleMagnitude(atUltimate)).as("sampled loop at K = 8").isGreaterThanOrEqualTo(1.0);
        SustainedOscillation hunting = SustainedOscillation.of(atUltimate).feed(Simulation.run(atUltimate));
        assertThat(hunting.sustained()).isTrue();
        assertThat(hunting.decayRatio()).isCloseTo(1.0, within(0.02));

        assertThat(largestPoleMagnitude(wellDamped)).as("sampled loop at K = 2").isLessThan(1.0);
        Trajectory damped = Simulation.run(wellDamped);
        assertThat(SustainedOscillation.of(wellDamped).feed(damped).sustained()).isFalse();
    }

    private static Scenario thirdOrderLag(double loopGain) {
        ControllerSettings p = ControllerSettings.builder().gains(new ParallelGains(loopGain, 0.0, 0.0))
                .samplePeriodSeconds(0.01).build();
        return Scenario.setpointStep(new TransferFunction(new double[] {1.0}, new double[] {1.0, 3.0, 3.0, 1.0}, 0.0),
                p, 1.0, 60.0);
    }

    private static double largestPoleMagnitude(Scenario scenario) {
        double largest = 0.0;
        for (Complex pole : LoopAnalysis.closedLoopPoles(LoopAnalysis.sampledLoop(scenario.sampledLoop().orElseThrow()))) {
            largest = Math.max(largest, pole.norm());
        }
        return largest;
    }
}
