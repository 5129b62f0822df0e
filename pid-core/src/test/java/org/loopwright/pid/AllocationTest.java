package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.testing.AllocationWindows;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.form.IdealGains;

/**
 * The update allocates nothing: bytes allocated by this thread over three windows of 10⁶ updates
 * ({@link AllocationWindows}) after a warm-up that lets the JIT compile the update. The settings
 * switch on every feature the update can run.
 */
class AllocationTest {

    private static final int UPDATES = 1_000_000;

    private static ControllerSettings fullFeatured() {
        return ControllerSettings.builder()
                .gains(new IdealGains(2.0, 8.0, 1.0))
                .samplePeriodSeconds(0.01)
                .setpointWeights(0.8, 0.2)
                .derivativeMethod(DerivativeMethod.RAMP_INVARIANT)
                .outputRange(-5.0, 5.0)
                .outputSlewPerSecond(200.0)
                .setpointSlewPerSecond(100.0)
                .windupProtection(WindupProtection.BACK_CALCULATION)
                .errorDeadband(0.01)
                .faultPolicy(FaultPolicy.SAFE_OUTPUT, 0.0)
                .build();
    }

    /** One pass of updates; every 1000th sample is a NaN measurement, every 500th switches a mode. */
    private static double run(PidController c, boolean variablePeriod, int updates) {
        double sum = 0.0;
        for (int k = 0; k < updates; k++) {
            double r = (k / 2000) % 2 == 0 ? 1.0 : -1.0;
            double y = k % 1000 == 999 ? Double.NaN : 0.3 * Math.sin(k * 1e-3);
            if (k % 500 == 250) {
                c.switchToManual();
            } else if (k % 500 == 300) {
                c.switchToAutomatic();
            }
            c.feedforward(0.1 * r);
            c.feedforwardOn(k % 3000 < 1500);
            sum += variablePeriod ? c.update(r, y, 0.01 + 1e-4 * (k % 7)) : c.update(r, y);
        }
        return sum;
    }

    private static void assertAllocatesNothing(boolean variablePeriod) {
        PidController c = new PidController(fullFeatured());
        double[] sink = {0.0};
        for (int warmUp = 0; warmUp < 5; warmUp++) {
            sink[0] += run(c, variablePeriod, 200_000);
        }
        long[] bytes = AllocationWindows.measure(() -> sink[0] += run(c, variablePeriod, UPDATES));
        assertThat(sink[0]).isFinite();
        AllocationWindows.assertNothingAllocated(bytes, "update");
    }

    @Test
    void fixedPeriodUpdateAllocatesNothing() {
        assertAllocatesNothing(false);
    }

    @Test
    void variablePeriodUpdateAllocatesNothing() {
        assertAllocatesNothing(true);
    }
}
