package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.IdealGains;

/**
 * Edges of the controller that a mutation run found unpinned: conditional integration judging the
 * output with its feedforward, a range of zero width, and the limited flag when nothing limits.
 */
class ControllerBoundaryTest {

    private static ControllerSettings.Builder pi() {
        // Kc = 1, Ti = 1 s, h = 0.1 s: P = e, the integral grows by e·h per sample
        return ControllerSettings.builder().gains(IdealGains.pi(1.0, 1.0)).samplePeriodSeconds(0.1)
                .outputRange(0.0, 100.0);
    }

    @Test
    void conditionalIntegrationJudgesTheOutputWithItsFeedforward() {
        // conditional integration (Åström & Murray 2021, §11.4): the integral holds while the output is
        // limited and the error pushes further. e = 20 with feedforward 90: 20 + I + 90 is far above 100,
        // so the integral must not move; without the feedforward the output would be well inside the range
        PidController c = new PidController(pi().windupProtection(WindupProtection.CLAMPING).build());
        c.feedforward(90.0);
        c.feedforwardOn(true);
        c.update(20.0, 0.0);
        double held = c.integralTerm();
        for (int k = 0; k < 10; k++) {
            assertThat(c.update(20.0, 0.0)).isEqualTo(100.0);
        }
        assertThat(c.integralTerm()).isEqualTo(held);
        assertThat(c.outputLimited()).isTrue();
    }

    @Test
    void aRangeOfZeroWidthIsAllowedAndHoldsTheOutput() {
        // the rule is outputMin <= outputMax (equal is allowed): a fixed output, whatever the error
        PidController c = new PidController(pi().outputRange(5.0, 5.0).build());
        assertThat(c.update(100.0, 0.0)).isEqualTo(5.0);
        assertThat(c.update(-100.0, 0.0)).isEqualTo(5.0);
    }

    @Test
    void anOutputInsideItsLimitsIsNotLimited() {
        // e = 1: P = 1 plus one integral step of 0.1, far inside 0..100 and with no slew limit
        PidController c = new PidController(pi().build());
        assertThat(c.update(1.0, 0.0)).isBetween(1.0, 1.2);
        assertThat(c.outputLimited()).isFalse();
    }
}
