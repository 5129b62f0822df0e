package org.loopwright.pid.runner;

/** What the runner does when a tick ends after the next deadline. */
public enum OverrunPolicy {
    /**
     * Drops every deadline already passed and resumes at the next one on the grid: the loop stays in
     * phase, and in {@link PeriodMode#MEASURED} mode the controller sees the longer period.
     */
    SKIP_MISSED,
    /**
     * Runs every scheduled tick, the missed ones late and back to back, until the loop is on time
     * again: no tick is lost, at the price of bursts after a stall.
     */
    RUN_LATE
}
