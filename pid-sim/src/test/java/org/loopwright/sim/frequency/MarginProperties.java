package org.loopwright.sim.frequency;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.hipparchus.complex.Complex;
import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.plant.TransferFunction;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;

/** Margins against the closed-loop poles, over random first-order-plus-dead-time loops. */
class MarginProperties {

    /**
     * Nyquist criterion (Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i>, §3.4): multiplying the
     * loop by its gain margin makes L(e^{jωh}) pass through −1, so 1 + L has a root on the unit circle at
     * z = e^{jωh}, ω the phase crossover.
     */
    @Property(tries = 200)
    void gainMarginPutsAClosedLoopPoleOnTheUnitCircle(@ForAll @DoubleRange(min = 0.2, max = 5) double gain,
            @ForAll @DoubleRange(min = 0.5, max = 20) double lagSeconds,
            @ForAll @DoubleRange(min = 0.0, max = 5) double deadTimeSeconds,
            @ForAll @DoubleRange(min = 0.1, max = 1.5) double loopGain,
            @ForAll @DoubleRange(min = 0.5, max = 2) double integralTimeRatio,
            @ForAll @DoubleRange(min = 0.01, max = 0.2) double periodRatio,
            @ForAll IntegralMethod integral, @ForAll DerivativeMethod derivative) {
        TransferFunction plant = TransferFunction.fopdt(gain, lagSeconds, deadTimeSeconds);
        double kp = loopGain / gain;
        double h = periodRatio * (lagSeconds + deadTimeSeconds);
        ControllerSettings settings = ControllerSettings.builder()
                .gains(new ParallelGains(kp, kp / (integralTimeRatio * lagSeconds), 0.0)).samplePeriodSeconds(h)
                .integralMethod(integral).derivativeMethod(derivative).build();
        SampledMargins sampled = LoopAnalysis.sampled(SampledLoop.of(plant, settings));
        for (PhaseCrossing crossing : sampled.margins().phaseCrossings()) {
            PulseTransferFunction scaled = LoopAnalysis.sampledLoop(new SampledLoop(plant, settings, h, 0)).times(crossing.gainMargin());
            List<Complex> poles = LoopAnalysis.closedLoopPoles(scaled);
            Complex expected = new Complex(Math.cos(crossing.frequencyRadPerSecond() * h),
                    Math.sin(crossing.frequencyRadPerSecond() * h));
            double closest = poles.stream().mapToDouble(p -> p.subtract(expected).norm()).min().orElseThrow();
            assertThat(closest).as("crossing %s", crossing).isLessThan(1e-6);
        }
    }

    /**
     * Invariance: a direct-acting controller on a plant of negative gain is the same loop as a reverse-acting
     * one on the positive plant (σ·C·P unchanged), so every margin is the same.
     */
    @Property(tries = 30)
    void directActionOnANegativePlantHasTheSameMargins(@ForAll @DoubleRange(min = 0.2, max = 5) double gain,
            @ForAll @DoubleRange(min = 0.5, max = 20) double lagSeconds,
            @ForAll @DoubleRange(min = 0.1, max = 5) double deadTimeSeconds) {
        ControllerSettings reverse = ControllerSettings.builder()
                .gains(new ParallelGains(0.5 / gain, 0.5 / gain / lagSeconds, 0.0)).samplePeriodSeconds(0.1).build();
        ControllerSettings direct = reverse.toBuilder().action(Action.DIRECT).build();
        StabilityMargins a = LoopAnalysis.continuous(TransferFunction.fopdt(gain, lagSeconds, deadTimeSeconds), reverse);
        StabilityMargins b = LoopAnalysis.continuous(TransferFunction.fopdt(-gain, lagSeconds, deadTimeSeconds), direct);
        assertThat(b.phaseCrossover().orElseThrow().gainMargin())
                .isCloseTo(a.phaseCrossover().orElseThrow().gainMargin(), within(1e-9));
        assertThat(b.gainCrossover().orElseThrow().phaseMarginDegrees())
                .isCloseTo(a.gainCrossover().orElseThrow().phaseMarginDegrees(), within(1e-9));
        assertThat(b.sensitivityPeak().value()).isCloseTo(a.sensitivityPeak().value(), within(1e-9));
    }
}
