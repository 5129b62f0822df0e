package org.loopwright.sim.assess;

import java.util.List;
import java.util.Objects;

import org.loopwright.pid.monitor.MonitorSettings;

/**
 * What an assessment needs besides the record.
 *
 * @param monitor               the monitor's settings (sample period, time scale, amplitude, limits, action)
 * @param deadTimeSeconds       the loop's dead time for the minimum-variance index, NaN when unknown
 * @param processKind           decides whether the stiction test applies
 * @param withoutIntegralAction true when the controller is known to have no integral action
 * @param assumptions           what was assumed for want of an option, in words, for the report
 */
public record AssessmentOptions(MonitorSettings monitor, double deadTimeSeconds, ProcessKind processKind,
        boolean withoutIntegralAction, List<String> assumptions) {

    /** Copies the list and checks the values. */
    public AssessmentOptions {
        Objects.requireNonNull(monitor, "monitor");
        Objects.requireNonNull(processKind, "processKind");
        assumptions = List.copyOf(assumptions);
        if (!(Double.isNaN(deadTimeSeconds) || deadTimeSeconds >= 0.0 && deadTimeSeconds < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("dead time must be finite and >= 0: dead-time=" + deadTimeSeconds);
        }
    }
}
