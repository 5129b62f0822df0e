package org.loopwright.sim.frequency;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;

import org.hipparchus.complex.Complex;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.plant.TransferFunction;

class LoopAnalysisTest {

    private static final TransferFunction THIRD_ORDER = new TransferFunction(new double[] {1}, new double[] {1, 3, 3, 1}, 0.0);

    static ControllerSettings settings(double kp, double ki, double kd, double periodSeconds) {
        return ControllerSettings.builder().gains(new ParallelGains(kp, ki, kd)).samplePeriodSeconds(periodSeconds).build();
    }

    @Test
    void proportionalGainFourOnThirdOrderLagHasGainMarginTwoAtRootThree() {
        // Analytic: arg 1/(jω+1)³ = −3·atan(ω) = −180° at ω = √3, where |G| = 1/(1+3)^{3/2} = 1/8,
        // so Ku = 8 and a gain of 4 leaves a margin of 2 (the DESIGN.md anchor; Åström & Murray,
        // Feedback Systems, 2nd ed., Example 10.x, from memory of the ultimate gain 8).
        StabilityMargins m = LoopAnalysis.continuous(THIRD_ORDER, settings(4, 0, 0, 0.01));
        PhaseCrossing pc = m.phaseCrossover().orElseThrow();
        assertThat(pc.gainMargin()).isCloseTo(2.0, within(1e-10));
        assertThat(pc.gainMarginDb()).isCloseTo(20 * Math.log10(2.0), within(1e-9));
        assertThat(pc.frequencyRadPerSecond()).isCloseTo(Math.sqrt(3.0), within(1e-10));
        assertThat(m.phaseCrossings()).hasSize(1);
    }

    @Test
    void gainCrossoverOfThirdOrderLagSolvesTheMagnitudeEquation() {
        // Analytic: 4/(1+ω²)^{3/2} = 1 ⇔ ω = √(4^{2/3} − 1); phase margin 180° − 3·atan(ω).
        StabilityMargins m = LoopAnalysis.continuous(THIRD_ORDER, settings(4, 0, 0, 0.01));
        double omega = Math.sqrt(Math.pow(4.0, 2.0 / 3.0) - 1.0);
        GainCrossing gc = m.gainCrossover().orElseThrow();
        assertThat(gc.frequencyRadPerSecond()).isCloseTo(omega, within(1e-10));
        assertThat(Math.pow(1 + gc.frequencyRadPerSecond() * gc.frequencyRadPerSecond(), 1.5)).isCloseTo(4.0, within(1e-9));
        assertThat(gc.phaseMarginDegrees()).isCloseTo(180.0 - 3.0 * Math.toDegrees(Math.atan(omega)), within(1e-8));
        // delay margin = PM (rad) / ωc (Åström & Murray, Feedback Systems, §10.3)
        assertThat(m.delayMarginSeconds().orElseThrow())
                .isCloseTo(Math.toRadians(gc.phaseMarginDegrees()) / omega, within(1e-10));
    }

    @Test
    void firstOrderPlusDeadTimePhaseCrossoverSolvesPhaseEquation() {
        // Analytic: arg K·e^{−jωL}/(jωT+1) = −ωL − atan(ωT) = −π; solved here independently by bisection.
        double gain = 2.0;
        double lag = 5.0;
        double deadTime = 1.3;
        double kp = 0.8;
        TransferFunction plant = new TransferFunction(new double[] {gain}, new double[] {lag, 1}, deadTime);
        double lo = 1e-6;
        double hi = Math.PI / deadTime;
        for (int i = 0; i < 200; i++) {
            double mid = 0.5 * (lo + hi);
            if (mid * deadTime + Math.atan(mid * lag) < Math.PI) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        double omega = 0.5 * (lo + hi);
        StabilityMargins m = LoopAnalysis.continuous(plant, settings(kp, 0, 0, 0.01));
        PhaseCrossing first = m.phaseCrossings().get(0);
        assertThat(first.frequencyRadPerSecond()).isCloseTo(omega, within(1e-10));
        assertThat(first.gainMargin()).isCloseTo(Math.hypot(1.0, omega * lag) / (gain * kp), within(1e-9));
    }

    @Test
    void everyPhaseCrossingOfADeadTimeLoopWithinTwentyDecibelsIsReported() {
        // Analytic: e^{−sL}/(Ts+1) crosses −180° (mod 360°) wherever ωL + atan(ωT) = (2k+1)π, with gain margin
        // √(1+ω²T²)/Kp there. Each crossing is solved here independently by bisection; the analysis must report
        // exactly those within 20 dB (a factor 10) of the smallest margin, in order.
        double lag = 0.2;
        double deadTime = 2.0;
        double kp = 0.5;
        TransferFunction plant = new TransferFunction(new double[] {1}, new double[] {lag, 1}, deadTime);
        StabilityMargins m = LoopAnalysis.continuous(plant, settings(kp, 0, 0, 0.01));
        List<Double> expected = new java.util.ArrayList<>();
        double smallest = Double.NaN;
        for (int k = 0; ; k++) {
            double target = (2 * k + 1) * Math.PI;
            double lo = 0.0;
            double hi = target / deadTime;
            for (int i = 0; i < 200; i++) {
                double mid = 0.5 * (lo + hi);
                if (mid * deadTime + Math.atan(mid * lag) < target) {
                    lo = mid;
                } else {
                    hi = mid;
                }
            }
            double margin = Math.hypot(1.0, lo * lag) / kp;
            if (k == 0) {
                smallest = margin;
            }
            if (margin > 10 * smallest) {
                break;
            }
            expected.add(lo);
        }
        List<PhaseCrossing> crossings = m.phaseCrossings();
        assertThat(expected.size()).isGreaterThan(10);
        assertThat(crossings).hasSize(expected.size());
        for (int k = 0; k < crossings.size(); k++) {
            assertThat(crossings.get(k).frequencyRadPerSecond()).isCloseTo(expected.get(k), within(1e-9));
        }
        assertThat(m.phaseCrossover().orElseThrow()).isEqualTo(crossings.get(0));
    }

    @Test
    void sensitivityPeaksOfThirdOrderLoopMatchTheirClosedForms() {
        // Analytic, derived here for L = 4/(1+jω)³ with x = ω²:
        // |1+L|² = 1 − 24(x − 1)/(1 + x)³, least at x = 2: Ms = 3 at ω = √2;
        // |T|² = 16/((1 + x)³ − 24x + 24), largest where (1 + x)² = 8: Mt = 1 + √2 at ω = √(2√2 − 1).
        StabilityMargins m = LoopAnalysis.continuous(THIRD_ORDER, settings(4, 0, 0, 0.01));
        assertThat(m.sensitivityPeak().value()).isCloseTo(3.0, within(1e-12));
        assertThat(m.sensitivityPeak().frequencyRadPerSecond()).isCloseTo(Math.sqrt(2.0), within(1e-6));
        assertThat(m.complementaryPeak().value()).isCloseTo(1.0 + Math.sqrt(2.0), within(1e-12));
        assertThat(m.complementaryPeak().frequencyRadPerSecond())
                .isCloseTo(Math.sqrt(2.0 * Math.sqrt(2.0) - 1.0), within(1e-6));
    }

    @Test
    void scalingTheSampledLoopByItsGainMarginPutsAPoleOnTheUnitCircle() {
        // Nyquist criterion (Åström & Wittenmark, Computer-Controlled Systems, §3.4): at the gain margin
        // the curve passes through −1, so the characteristic polynomial has a root at z = e^{jωh}.
        TransferFunction plant = new TransferFunction(new double[] {2}, new double[] {5, 1}, 1.3);
        for (double h : new double[] {0.1, 0.5, 1.0}) {
            ControllerSettings s = ControllerSettings.builder().gains(new ParallelGains(1.2, 0.3, 0.9))
                    .samplePeriodSeconds(h).integralMethod(IntegralMethod.BACKWARD_EULER)
                    .derivativeMethod(DerivativeMethod.TUSTIN).build();
            SampledMargins sm = LoopAnalysis.sampled(SampledLoop.of(plant, s));
            PhaseCrossing pc = sm.margins().phaseCrossover().orElseThrow();
            PulseTransferFunction scaled = LoopAnalysis.sampledLoop(new SampledLoop(plant, s, h, 0)).times(pc.gainMargin());
            List<Complex> poles = LoopAnalysis.closedLoopPoles(scaled);
            double closest = poles.stream().mapToDouble(p -> Math.abs(p.norm() - 1.0)).min().orElseThrow();
            assertThat(closest).as("h=%s", h).isLessThan(1e-6);
            Complex onCircle = poles.stream().min((a, b) -> Double.compare(Math.abs(a.norm() - 1), Math.abs(b.norm() - 1)))
                    .orElseThrow();
            assertThat(Math.abs(onCircle.getArgument())).isCloseTo(pc.frequencyRadPerSecond() * h, within(1e-6));
            assertThat(sm.stable()).isEqualTo(pc.gainMargin() > 1.0);
        }
    }

    @Test
    void integratingPlantWithDeadTimeHasItsAnalyticMargins() {
        // Analytic: L = Kp·K·e^{−sL}/s has phase −90° − ωL, so the phase crossover is ω = π/(2L) with gain margin
        // π/(2·L·K·Kp); |L| = 1 at ω = K·Kp, where the phase margin is 90° − K·Kp·L (in radians → degrees).
        double gain = 0.5;
        double deadTime = 0.8;
        double kp = 0.6;
        StabilityMargins m = LoopAnalysis.continuous(TransferFunction.integrating(gain, deadTime), settings(kp, 0, 0, 0.1));
        assertThat(m.phaseCrossover().orElseThrow().frequencyRadPerSecond()).isCloseTo(Math.PI / (2 * deadTime), within(1e-10));
        assertThat(m.phaseCrossover().orElseThrow().gainMargin()).isCloseTo(Math.PI / (2 * deadTime * gain * kp), within(1e-9));
        assertThat(m.gainCrossover().orElseThrow().frequencyRadPerSecond()).isCloseTo(gain * kp, within(1e-10));
        assertThat(m.gainCrossover().orElseThrow().phaseMarginDegrees())
                .isCloseTo(90.0 - Math.toDegrees(gain * kp * deadTime), within(1e-8));
        // and sampled with a fractional delay (0.8 s = 2.67 periods), the margin still puts a pole on the circle
        for (double h : new double[] {0.3, 0.05}) {
            ControllerSettings s = ControllerSettings.builder().gains(new ParallelGains(kp, 0.1, 0))
                    .samplePeriodSeconds(h).build();
            TransferFunction plant = TransferFunction.integrating(gain, deadTime);
            PhaseCrossing pc = LoopAnalysis.sampled(SampledLoop.of(plant, s)).margins().phaseCrossover().orElseThrow();
            List<Complex> poles = LoopAnalysis.closedLoopPoles(LoopAnalysis.sampledLoop(new SampledLoop(plant, s, h, 0)).times(pc.gainMargin()));
            assertThat(poles.stream().mapToDouble(p -> Math.abs(p.norm() - 1.0)).min().orElseThrow()).isLessThan(1e-6);
        }
    }

    @Test
    void sampledDelayMarginAgreesWithThePolesWhenWholeSamplesOfDelayAreAdded() {
        // Åström & Wittenmark, §3.4 (Nyquist criterion for sampled systems): m more samples of delay multiply
        // L(e^{jωh}) by e^{−jωhm} exactly, turning the gain crossover by ω_c·h·m. So the loop stays stable while
        // m·h is below the delay margin PM/ω_c and has a pole outside the unit circle once m·h exceeds it.
        double h = 0.1;
        TransferFunction plant = new TransferFunction(new double[] {1}, new double[] {2, 3, 1}, 0.25);
        ControllerSettings s = settings(1.5, 0.6, 0.5, h);
        StabilityMargins m = LoopAnalysis.sampled(SampledLoop.of(plant, s)).margins();
        assertThat(m.gainCrossings()).hasSize(1);
        double delayMargin = m.delayMarginSeconds().orElseThrow();
        int critical = (int) Math.ceil(delayMargin / h);
        assertThat(critical * h - delayMargin).isGreaterThan(1e-3); // not a tie
        for (int extra : new int[] {critical - 1, critical}) {
            TransferFunction delayed = new TransferFunction(plant.numerator(), plant.denominator(),
                    plant.deadTimeSeconds() + extra * h);
            SampledMargins d = LoopAnalysis.sampled(SampledLoop.of(delayed, s));
            assertThat(d.stable()).as("%d extra samples, delay margin %s s", extra, delayMargin)
                    .isEqualTo(extra < critical);
            assertThat(d.margins().gainCrossover().orElseThrow().phaseMarginDegrees()).isCloseTo(
                    m.gainCrossover().orElseThrow().phaseMarginDegrees()
                            - Math.toDegrees(m.gainCrossover().orElseThrow().frequencyRadPerSecond() * extra * h),
                    within(1e-6));
        }
    }

    @Test
    void integralControlOfAPureDeadTimeHasItsAnalyticMargins() {
        // Analytic: Ki·K·e^{−sL}/s has phase −90° − ωL: phase crossover π/(2L), gain margin π/(2·L·K·Ki).
        // The plant has no dynamics at all (a static gain), the zero-order-hold equivalent is K·z^(−d) with
        // one more sample when L is not whole; its gain margin must still put a pole on the unit circle.
        double gain = 2.0;
        double deadTime = 1.25;
        double ki = 0.3;
        TransferFunction plant = new TransferFunction(new double[] {gain}, new double[] {1}, deadTime);
        ControllerSettings integralOnly = settings(0.0, ki, 0.0, 0.5);
        PhaseCrossing pc = LoopAnalysis.continuous(plant, integralOnly).phaseCrossover().orElseThrow();
        assertThat(pc.frequencyRadPerSecond()).isCloseTo(Math.PI / (2 * deadTime), within(1e-10));
        assertThat(pc.gainMargin()).isCloseTo(Math.PI / (2 * deadTime * gain * ki), within(1e-9));
        PhaseCrossing sampled = LoopAnalysis.sampled(SampledLoop.of(plant, integralOnly)).margins().phaseCrossover().orElseThrow();
        List<Complex> poles = LoopAnalysis.closedLoopPoles(
                LoopAnalysis.sampledLoop(new SampledLoop(plant, integralOnly, 0.5, 0)).times(sampled.gainMargin()));
        assertThat(poles.stream().mapToDouble(p -> Math.abs(p.norm() - 1.0)).min().orElseThrow()).isLessThan(1e-6);
    }

    @Test
    void samplingTheThirdOrderLoopAtNyquistCrossingAgreesWithThePoles() {
        // A P loop on a first-order ZOH plant crosses the negative real axis at z = −1: the classic critical
        // gain K·b/(1+a) = 1 with a = e^{−h/T}, b = 1 − a (Åström & Wittenmark, §3.4 / §2.3 ZOH sampling).
        double h = 0.5;
        TransferFunction plant = new TransferFunction(new double[] {1}, new double[] {1, 1}, 0.0);
        SampledMargins sm = LoopAnalysis.sampled(SampledLoop.of(plant, settings(2.0, 0, 0, h)));
        double a = Math.exp(-h);
        PhaseCrossing pc = sm.margins().phaseCrossover().orElseThrow();
        assertThat(pc.frequencyRadPerSecond()).isCloseTo(Math.PI / h, within(1e-12));
        assertThat(pc.gainMargin()).isCloseTo((1 + a) / (1 - a) / 2.0, within(1e-10));
        assertThat(sm.closedLoopPoles()).hasSize(1);
        assertThat(sm.closedLoopPoles().get(0).getReal()).isCloseTo(a - 2.0 * (1 - a), within(1e-12));
    }

    @Test
    void sampledMarginsConvergeToTheContinuousOnesAsThePeriodShrinks() {
        // Åström & Wittenmark, Computer-Controlled Systems, ch. 8: a discretised design approaches the
        // continuous one as h → 0, the errors shrinking about in proportion to h.
        TransferFunction plant = new TransferFunction(new double[] {1}, new double[] {2, 3, 1}, 0.1);
        ControllerSettings base = settings(1.5, 0.6, 0.5, 0.01);
        StabilityMargins c = LoopAnalysis.continuous(plant, base);
        double[] periods = {0.1, 0.01, 0.001};
        double[][] errors = new double[periods.length][];
        for (int i = 0; i < periods.length; i++) {
            StabilityMargins d = LoopAnalysis.sampled(new SampledLoop(plant, base, periods[i], 0)).margins();
            errors[i] = new double[] {
                Math.abs(d.gainCrossover().orElseThrow().phaseMarginDegrees() - c.gainCrossover().orElseThrow().phaseMarginDegrees()),
                Math.abs(d.phaseCrossover().orElseThrow().gainMargin() / c.phaseCrossover().orElseThrow().gainMargin() - 1),
                Math.abs(d.sensitivityPeak().value() / c.sensitivityPeak().value() - 1),
                Math.abs(d.gainCrossover().orElseThrow().frequencyRadPerSecond()
                        / c.gainCrossover().orElseThrow().frequencyRadPerSecond() - 1),
                Math.abs(d.phaseCrossover().orElseThrow().frequencyRadPerSecond()
                        / c.phaseCrossover().orElseThrow().frequencyRadPerSecond() - 1)};
        }
        for (int k = 0; k < errors[0].length; k++) {
            assertThat(errors[1][k]).as("quantity %s", k).isLessThan(errors[0][k] / 5);
            assertThat(errors[2][k]).as("quantity %s", k).isLessThan(errors[1][k] / 5);
        }
        assertThat(errors[2][0]).isLessThan(0.05); // degrees
        assertThat(errors[2][1]).isLessThan(1e-2);
        assertThat(errors[2][2]).isLessThan(1e-3);
    }

    @Test
    void zeroOrderHoldCostsHalfAPeriodOfPhaseAtCrossover() {
        // Åström & Wittenmark, Computer-Controlled Systems, §7.x/8.1: the hold acts roughly as a delay of
        // h/2, i.e. a phase loss of ωc·h/2 rad at the crossover. PI with the Tustin integral has no
        // phase error of its own (its frequency warping changes only the magnitude).
        TransferFunction plant = new TransferFunction(new double[] {1}, new double[] {4, 4, 1}, 0.0);
        ControllerSettings pi = ControllerSettings.builder().gains(new ParallelGains(2.0, 0.5, 0.0))
                .samplePeriodSeconds(0.01).integralMethod(IntegralMethod.TUSTIN).build();
        GainCrossing c = LoopAnalysis.continuous(plant, pi).gainCrossover().orElseThrow();
        for (double wh : new double[] {0.05, 0.1, 0.2}) {
            double h = wh / c.frequencyRadPerSecond();
            GainCrossing d = LoopAnalysis.sampled(new SampledLoop(plant, pi, h, 0)).margins().gainCrossover().orElseThrow();
            double lossRadians = Math.toRadians(c.phaseMarginDegrees() - d.phaseMarginDegrees());
            assertThat(lossRadians).as("ωc·h=%s", wh).isCloseTo(wh / 2.0, within(0.1 * wh / 2.0));
        }
    }
}
