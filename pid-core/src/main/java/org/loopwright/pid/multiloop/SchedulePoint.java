package org.loopwright.pid.multiloop;

import java.util.Objects;

import org.loopwright.pid.form.PidGains;

/**
 * One row of a gain schedule: the gains that hold when the scheduling variable is at a value.
 *
 * @param at    the scheduling variable's value, in its own units
 * @param gains the gains there, in any form
 */
public record SchedulePoint(double at, PidGains gains) {

    /**
     * Requires the gains; the table checks the values when it is built.
     *
     * @param at the scheduling variable's value, in its own units
     * @param gains the gains there, in any form
     */
    public SchedulePoint {
        Objects.requireNonNull(gains, "gains");
    }
}
