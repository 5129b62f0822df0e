package org.loopwright.sim.assess;

import java.util.Objects;

/**
 * One row of an assessment: a condition, its status, the figure it was judged on against the
 * threshold that was crossed (or would be), and where the method comes from.
 *
 * @param name      the condition ("oscillation", "stiction", ...)
 * @param status    ok, warn, alarm or not-assessed
 * @param value     the figure (NaN when not assessed)
 * @param threshold the alarm threshold of the figure (NaN when there is none)
 * @param unit      the figure's unit ("" when it has none)
 * @param method    the method in a few words
 * @param source    the published source, or "common practice"
 * @param note      what the reader should know: the warn threshold, the evidence, or why not assessed
 */
public record Finding(String name, FindingStatus status, double value, double threshold, String unit,
        String method, String source, String note) {

    /** Checks that the texts are present. */
    public Finding {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(status, "status");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(method, "method");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(note, "note");
    }

    /** A condition the method could not judge, with the reason. */
    public static Finding notAssessed(String name, String unit, String method, String source, String reason) {
        return new Finding(name, FindingStatus.NOT_ASSESSED, Double.NaN, Double.NaN, unit, method, source, reason);
    }
}
