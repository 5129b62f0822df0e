package org.loopwright.pid.monitor;

/** How a {@link LoopCondition} stands: ok, worth a look (warn) or needing action (alarm). */
public enum ConditionStatus {
    /** Within the warn threshold, or not enough evidence yet. */
    OK,
    /** Past the warn threshold. */
    WARN,
    /** Past the alarm threshold. */
    ALARM
}
