package org.loopwright.sim.assess;

import java.util.Locale;

import org.loopwright.pid.monitor.ConditionStatus;

/** A finding's status: the monitor's three, and "not-assessed" when a method could not be applied. */
public enum FindingStatus {
    /** Within the warn threshold. */
    OK,
    /** Past the warn threshold. */
    WARN,
    /** Past the alarm threshold. */
    ALARM,
    /** The method does not apply to this record or loop; the note says why. */
    NOT_ASSESSED;

    /** As in reports and JSON: ok, warn, alarm, not-assessed. */
    public String label() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The monitor's status as a finding's. */
    public static FindingStatus of(ConditionStatus status) {
        return switch (status) {
            case OK -> OK;
            case WARN -> WARN;
            case ALARM -> ALARM;
        };
    }

    /** Whether this status flags a problem (warn or alarm). */
    public boolean flagged() {
        return this == WARN || this == ALARM;
    }
}
