package org.loopwright.sim.simulate;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Scale;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

class ClosedLoopProperties {

    /**
     * SIMC PI settings for K·e^(−Ls)/(Ts+1) (Skogestad, "Simple analytic rules for model reduction
     * and PID controller tuning", J. Process Control 13, 2003): Kc = T/(K(τc + L)), Ti = min(T, 4(τc + L)),
     * here with τc = L + h so that the sample-and-hold lag is covered too.
     */
    private static ControllerSettings simc(double gain, double timeConstant, double deadTime, double h) {
        double closedLoopTime = deadTime + h;
        double kc = timeConstant / (gain * (closedLoopTime + deadTime));
        double ti = Math.min(timeConstant, 4.0 * (closedLoopTime + deadTime));
        return ControllerSettings.builder().gains(IdealGains.pi(kc, ti)).samplePeriodSeconds(h).build();
    }

    /** For stable plants under stabilising (SIMC) settings the output stays bounded: |y| ≤ 3·|r| throughout. */
    @Property(tries = 1000)
    void outputStaysBoundedForStablePlantsAndStabilisingSettings(
            @ForAll @DoubleRange(min = 0.2, max = 5.0) double gain,
            @ForAll @DoubleRange(min = 1.0, max = 50.0) double timeConstant,
            @ForAll @DoubleRange(min = 0.0, max = 10.0) double deadTime,
            @ForAll @DoubleRange(min = 0.002, max = 0.02) @Scale(4) double periodShare,
            @ForAll @DoubleRange(min = -100.0, max = 100.0) double setpoint) {
        double h = periodShare * (timeConstant + deadTime);
        Scenario s = Scenario.builder().plant(TransferFunction.fopdt(gain, timeConstant, deadTime))
                .controller(simc(gain, timeConstant, deadTime, h)).setpoint(SetpointChange.step(0.0, setpoint))
                .disturbance(new LoadStep(5.0 * (timeConstant + deadTime) + 0.3 * h, setpoint / gain))
                .durationSeconds(8.0 * (timeConstant + deadTime)).build();
        Trajectory t = Simulation.run(s);
        double largest = 0.0;
        for (int k = 0; k < t.length(); k++) {
            largest = Math.max(largest, Math.abs(t.process(k)));
        }
        assertThat(largest).isLessThanOrEqualTo(3.0 * Math.abs(setpoint));
    }

    private static Scenario shifted(double gain, double timeConstant, double deadTime, double h, double amplitude,
            double loadAtShare, double shiftSeconds) {
        double settle = 10.0 * (timeConstant + deadTime);
        return Scenario.builder().plant(TransferFunction.fopdt(gain, timeConstant, deadTime))
                .controller(simc(gain, timeConstant, deadTime, h))
                .setpoint(SetpointChange.step(shiftSeconds, amplitude))
                // inside a period, never on a sample, so that rounding cannot move it across one
                .disturbance(new LoadStep(shiftSeconds + settle + loadAtShare * h, 0.5 * amplitude / gain))
                .durationSeconds(shiftSeconds + 2.0 * settle).build();
    }

    /**
     * Shifting the whole scenario in time by whole samples leaves every metric unchanged. Both runs
     * rest for at least one sample before the step, because a controller's first sample only sets
     * its states (pid-core's start-up convention), which a step at t = 0 would meet.
     */
    @Property(tries = 300)
    void metricsAreInvariantToATimeShift(
            @ForAll @DoubleRange(min = 0.2, max = 5.0) double gain,
            @ForAll @DoubleRange(min = 1.0, max = 20.0) double timeConstant,
            @ForAll @DoubleRange(min = 0.0, max = 5.0) double deadTime,
            @ForAll @DoubleRange(min = 0.05, max = 0.95) double loadAtShare,
            @ForAll @IntRange(min = 1, max = 200) int shiftSamples) {
        double h = 0.01 * (timeConstant + deadTime);
        Scenario original = shifted(gain, timeConstant, deadTime, h, 1.0, loadAtShare, h);
        Scenario later = shifted(gain, timeConstant, deadTime, h, 1.0, loadAtShare, (1 + shiftSamples) * h);
        ResponseMetrics a = ResponseMetrics.of(original, Simulation.run(original));
        ResponseMetrics b = ResponseMetrics.of(later, Simulation.run(later));
        double tol = 1e-6;
        assertThat(b.riseTimeSeconds()).isCloseTo(a.riseTimeSeconds(), within(tol * a.riseTimeSeconds()));
        assertThat(b.settlingTimeSeconds()).isCloseTo(a.settlingTimeSeconds(), within(tol * (timeConstant + deadTime)));
        assertThat(b.overshootPercent()).isCloseTo(a.overshootPercent(), within(1e-6));
        assertThat(b.steadyStateError()).isCloseTo(a.steadyStateError(), within(1e-9));
        assertThat(b.iae()).isCloseTo(a.iae(), within(tol * a.iae()));
        assertThat(b.ise()).isCloseTo(a.ise(), within(tol * a.ise()));
        assertThat(b.itae()).isCloseTo(a.itae(), within(tol * a.itae()));
        assertThat(b.totalVariation()).isCloseTo(a.totalVariation(), within(tol * a.totalVariation()));
    }

    /**
     * A linear loop scaled by an amplitude a: the times and the overshoot stay, the error and the
     * effort scale by a, and ISE by a².
     */
    @Property(tries = 300)
    void metricsScaleWithAmplitude(
            @ForAll @DoubleRange(min = 0.2, max = 5.0) double gain,
            @ForAll @DoubleRange(min = 1.0, max = 20.0) double timeConstant,
            @ForAll @DoubleRange(min = 0.0, max = 5.0) double deadTime,
            @ForAll @DoubleRange(min = 0.05, max = 0.95) double loadAtShare,
            @ForAll @DoubleRange(min = 0.01, max = 1000.0) double amplitude) {
        double h = 0.01 * (timeConstant + deadTime);
        Scenario unit = shifted(gain, timeConstant, deadTime, h, 1.0, loadAtShare, 0.0);
        Scenario scaled = shifted(gain, timeConstant, deadTime, h, amplitude, loadAtShare, 0.0);
        ResponseMetrics a = ResponseMetrics.of(unit, Simulation.run(unit));
        ResponseMetrics b = ResponseMetrics.of(scaled, Simulation.run(scaled));
        double tol = 1e-6;
        assertThat(b.riseTimeSeconds()).isCloseTo(a.riseTimeSeconds(), within(tol * a.riseTimeSeconds()));
        assertThat(b.settlingTimeSeconds()).isCloseTo(a.settlingTimeSeconds(), within(tol * (timeConstant + deadTime)));
        assertThat(b.overshootPercent()).isCloseTo(a.overshootPercent(), within(1e-6));
        assertThat(b.iae()).isCloseTo(amplitude * a.iae(), within(tol * amplitude * a.iae()));
        assertThat(b.itae()).isCloseTo(amplitude * a.itae(), within(tol * amplitude * a.itae()));
        assertThat(b.ise()).isCloseTo(amplitude * amplitude * a.ise(), within(tol * amplitude * amplitude * a.ise()));
        assertThat(b.totalVariation()).isCloseTo(amplitude * a.totalVariation(),
                within(tol * amplitude * a.totalVariation()));
        assertThat(b.steadyStateError()).isCloseTo(amplitude * a.steadyStateError(), within(1e-9 * amplitude));
    }
}
