package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.loopwright.pid.testing.Draws.logUniform;

import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.PidGains;
import org.loopwright.pid.testing.Draws;

/**
 * The integral stays bounded while the output is limited, under every windup protection, with
 * a bound that follows from the update equations (derived here; I is the integral, P, D, uff the
 * other terms, u the output after the limits and v before, e the error, h the period):
 * <ul>
 *   <li>back-calculation, I(k) = (1 − β)·I(k−1) + β·(u − P − D − uff)(k−1) + Ki·h·ē with β = min(h/Tt, 1):
 *       a contraction towards a point within M + Ki·max(Tt, h)·E;</li>
 *   <li>clamping: a kept increment either leaves the output unlimited (so |I| ≤ M) or moves the
 *       integral back from the limit; a dropped one leaves it where it was;</li>
 *   <li>a mode switch back to automatic sets I = u − P − D − uff, within M.</li>
 * </ul>
 * with M the largest |u| + |P| + |D| + |uff| and E the largest |e| seen so far. So
 * |I| ≤ M + Ki·max(Tt, h_max)·E at every sample (M alone for clamping). Without protection the
 * integral grows with the time spent saturated, which the last test shows against the same bound.
 */
class WindupProperties {

    private static final int STEPS = 200;

    /** One sample of a mostly saturated run, and what happens before it. */
    record Sample(boolean setpointReverses, Mode switchTo, double measurement, double periodFactor,
            double actuatorOffset) {
    }

    /**
     * PI or PID with Kc 0.1–10 and Ti 0.05–50 s in any form, output ±1, sometimes a slew limit
     * and an explicit tracking time.
     */
    private static Arbitrary<ControllerSettings> saturating(WindupProtection scheme) {
        Arbitrary<PidGains> gains = Combinators.combine(logUniform(0.1, 10.0), logUniform(0.05, 50.0),
                Arbitraries.frequencyOf(Tuple.of(1, Arbitraries.just(0.0)),
                        Tuple.of(1, Draws.between(0.0, 0.25))))
                .as((k, ti, share) -> new IdealGains(k, ti, share * ti))
                .flatMap(SettingsArbitraries::inAnyForm);
        return Combinators.combine(SettingsArbitraries.linear(gains),
                logUniform(0.1, 10.0).injectNull(0.5), logUniform(0.01, 10.0).injectNull(0.5))
                .as((linear, slew, trackingTime) -> {
                    ControllerSettings.Builder b = linear.toBuilder().outputRange(-1.0, 1.0).windupProtection(scheme);
                    if (slew != null) {
                        b.outputSlewPerSecond(slew);
                    }
                    if (trackingTime != null) {
                        b.trackingTimeSeconds(trackingTime);
                    }
                    return b.build();
                });
    }

    /**
     * STEPS samples: the setpoint reverses one time in 20; a switch to manual or to automatic one
     * time in 25 each; the measurement within ±3, NaN one time in 15; the period the configured one
     * or 0.2–5.2 times it; the actuator within ±0.2 of the output (so |u| in M is taken as at least 1.2).
     */
    @Provide
    Arbitrary<List<Sample>> samples() {
        Arbitrary<Mode> switches = Arbitraries.frequencyOf(Tuple.of(23, Arbitraries.just((Mode) null)),
                Tuple.of(1, Arbitraries.just(Mode.MANUAL)), Tuple.of(1, Arbitraries.just(Mode.AUTOMATIC)));
        Arbitrary<Double> measurements = Arbitraries.frequencyOf(Tuple.of(14, Draws.between(-3.0, 3.0)),
                Tuple.of(1, Arbitraries.just(Double.NaN)));
        Arbitrary<Double> periodFactors = Arbitraries.frequencyOf(Tuple.of(1, Arbitraries.just(1.0)),
                Tuple.of(1, Draws.between(0.2, 5.2)));
        return Combinators.combine(Arbitraries.integers().between(1, 20).map(n -> n == 1), switches, measurements,
                periodFactors, Draws.between(-0.2, 0.2)).as(Sample::new).list().ofSize(STEPS);
    }

    @Provide
    Arbitrary<ControllerSettings> clamping() {
        return saturating(WindupProtection.CLAMPING);
    }

    @Provide
    Arbitrary<ControllerSettings> backCalculation() {
        return saturating(WindupProtection.BACK_CALCULATION);
    }

    @Provide
    Arbitrary<ControllerSettings> actuatorTracking() {
        return saturating(WindupProtection.ACTUATOR_TRACKING);
    }

    /** Runs mostly saturated (setpoint ±50) and returns the largest |I| − bound seen (≤ 0 when bounded). */
    private static double worstExcess(ControllerSettings s, boolean setpointAbove, List<Sample> samples) {
        PidController c = new PidController(s);
        double m = 0.0;
        double largestError = 0.0;
        double largestPeriod = 0.0;
        double worst = Double.NEGATIVE_INFINITY;
        double r = setpointAbove ? 50.0 : -50.0;
        for (Sample sample : samples) {
            if (sample.setpointReverses()) {
                r = -r;
            }
            if (sample.switchTo() == Mode.MANUAL) {
                c.switchToManual();
            } else if (sample.switchTo() == Mode.AUTOMATIC) {
                c.switchToAutomatic();
            }
            double y = sample.measurement();
            double h = s.samplePeriodSeconds() * sample.periodFactor();
            c.actuatorPosition(c.position() + sample.actuatorOffset());
            c.update(r, y, h);
            if (c.fault() != Fault.NONE) {
                continue;
            }
            largestPeriod = Math.max(largestPeriod, h);
            largestError = Math.max(largestError, Math.abs(r - y));
            m = Math.max(m, Math.max(Math.abs(c.position()), 1.2) + Math.abs(c.proportionalTerm())
                    + Math.abs(c.derivativeTerm()) + Math.abs(c.feedforwardTerm()));
            double ki = s.parallelGains().integralGain();
            WindupProtection scheme = s.windupProtection();
            double bound = scheme == WindupProtection.CLAMPING ? m
                    : m + ki * Math.max(s.trackingTimeSeconds(), largestPeriod) * largestError;
            worst = Math.max(worst, Math.abs(c.integralTerm()) - bound * (1.0 + 1e-12));
        }
        return worst;
    }

    @Property
    void integralBoundedUnderConditionalIntegration(@ForAll("clamping") ControllerSettings s,
            @ForAll boolean setpointAbove, @ForAll("samples") List<Sample> samples) {
        assertThat(worstExcess(s, setpointAbove, samples)).isLessThanOrEqualTo(0.0);
    }

    @Property
    void integralBoundedUnderBackCalculation(@ForAll("backCalculation") ControllerSettings s,
            @ForAll boolean setpointAbove, @ForAll("samples") List<Sample> samples) {
        assertThat(worstExcess(s, setpointAbove, samples)).isLessThanOrEqualTo(0.0);
    }

    @Property
    void integralBoundedUnderActuatorTracking(@ForAll("actuatorTracking") ControllerSettings s,
            @ForAll boolean setpointAbove, @ForAll("samples") List<Sample> samples) {
        // the actuator reads within ±0.2 of the output (so |u| in M is taken as at least 1.2)
        assertThat(worstExcess(s, setpointAbove, samples)).isLessThanOrEqualTo(0.0);
    }

    @Test
    void withoutProtectionTheSameBoundIsExceeded() {
        // PI, Kc = 1, Ti = 1 s (Tt = Ti = 1 s), h = 0.1 s, output ±1, setpoint 50 held for 200 samples:
        // the bound is M + Ki·Tt·E = (1 + 50) + 1·1·50 = 101, the unprotected integral reaches ≈ 1000.
        for (WindupProtection scheme : WindupProtection.values()) {
            PidController c = new PidController(ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0))
                    .samplePeriodSeconds(0.1).outputRange(-1.0, 1.0).windupProtection(scheme).build());
            for (int k = 0; k < 200; k++) {
                c.update(50.0, 0.0);
            }
            if (scheme == WindupProtection.NONE) {
                assertThat(c.integralTerm()).isGreaterThan(900.0);
            } else {
                assertThat(Math.abs(c.integralTerm())).isLessThanOrEqualTo(101.0);
            }
        }
    }
}
