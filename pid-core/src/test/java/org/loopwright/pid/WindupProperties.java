package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Random;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.IdealGains;

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

    private static ControllerSettings saturating(Random rnd, WindupProtection scheme) {
        double integralTime = RandomSettings.logUniform(rnd, 0.05, 50.0);
        IdealGains gains = new IdealGains(RandomSettings.logUniform(rnd, 0.1, 10.0), integralTime,
                rnd.nextBoolean() ? 0.0 : 0.25 * integralTime * rnd.nextDouble());
        ControllerSettings.Builder b = RandomSettings.linear(rnd, RandomSettings.inRandomForm(rnd, gains))
                .outputRange(-1.0, 1.0)
                .windupProtection(scheme);
        if (rnd.nextBoolean()) {
            b.outputSlewPerSecond(RandomSettings.logUniform(rnd, 0.1, 10.0));
        }
        if (rnd.nextBoolean()) {
            b.trackingTimeSeconds(RandomSettings.logUniform(rnd, 0.01, 10.0));
        }
        return b.build();
    }

    /** Runs mostly saturated (setpoint far away) and returns the largest |I| − bound seen (≤ 0 when bounded). */
    private static double worstExcess(long seed, WindupProtection scheme) {
        Random rnd = new Random(seed);
        ControllerSettings s = saturating(rnd, scheme);
        PidController c = new PidController(s);
        double m = 0.0;
        double largestError = 0.0;
        double largestPeriod = 0.0;
        double worst = Double.NEGATIVE_INFINITY;
        double r = 50.0 * (rnd.nextBoolean() ? 1.0 : -1.0);
        for (int k = 0; k < STEPS; k++) {
            if (rnd.nextInt(20) == 0) {
                r = -r;
            }
            if (rnd.nextInt(25) == 0) {
                c.switchToManual();
            } else if (rnd.nextInt(25) == 0) {
                c.switchToAutomatic();
            }
            double y = rnd.nextInt(15) == 0 ? Double.NaN : rnd.nextGaussian();
            double h = rnd.nextBoolean() ? s.samplePeriodSeconds() : s.samplePeriodSeconds() * (0.2 + 5.0 * rnd.nextDouble());
            c.actuatorPosition(c.position() + 0.1 * rnd.nextGaussian());
            c.update(r, y, h);
            if (c.fault() != Fault.NONE) {
                continue;
            }
            largestPeriod = Math.max(largestPeriod, h);
            largestError = Math.max(largestError, Math.abs(r - y));
            m = Math.max(m, Math.max(Math.abs(c.position()), 1.2) + Math.abs(c.proportionalTerm())
                    + Math.abs(c.derivativeTerm()) + Math.abs(c.feedforwardTerm()));
            double ki = s.parallelGains().integralGain();
            double bound = scheme == WindupProtection.CLAMPING ? m
                    : m + ki * Math.max(s.trackingTimeSeconds(), largestPeriod) * largestError;
            worst = Math.max(worst, Math.abs(c.integralTerm()) - bound * (1.0 + 1e-12));
        }
        return worst;
    }

    @Property(tries = 1000)
    void integralBoundedUnderConditionalIntegration(@ForAll long seed) {
        assertThat(worstExcess(seed, WindupProtection.CLAMPING)).isLessThanOrEqualTo(0.0);
    }

    @Property(tries = 1000)
    void integralBoundedUnderBackCalculation(@ForAll long seed) {
        assertThat(worstExcess(seed, WindupProtection.BACK_CALCULATION)).isLessThanOrEqualTo(0.0);
    }

    @Property(tries = 1000)
    void integralBoundedUnderActuatorTracking(@ForAll long seed) {
        // the actuator reads within 0.1·N(0, 1) of the output (so |u| in M is taken as at least 1.2)
        assertThat(worstExcess(seed, WindupProtection.ACTUATOR_TRACKING)).isLessThanOrEqualTo(0.0);
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
