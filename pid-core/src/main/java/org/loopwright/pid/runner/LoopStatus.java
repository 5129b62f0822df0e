package org.loopwright.pid.runner;

import org.loopwright.pid.Fault;
import org.loopwright.pid.Mode;
import org.loopwright.pid.monitor.ConditionStatus;
import org.loopwright.pid.monitor.LoopCondition;

/**
 * One consistent view of a running loop, as published after a tick: every figure in it belongs to
 * the same tick. Filled by {@link LoopRunner#readStatus(LoopStatus)}, so a monitoring thread can keep
 * one holder and refill it without allocating. Before the first tick every count is 0, the mode is
 * the controller's, the fault {@link Fault#NONE} and the signals NaN.
 *
 * <p>Not thread-safe: one holder per reading thread.
 */
public final class LoopStatus {

    long tickCount;
    double setpoint = Double.NaN;
    double measurement = Double.NaN;
    double output = Double.NaN;
    Mode mode = Mode.AUTOMATIC;
    Fault fault = Fault.NONE;
    long faultCount;
    long overrunCount;
    long skippedTickCount;
    long failedTickCount;
    int consecutiveFailures;
    long lastPeriodErrorNanos;
    long appliedCommandCount;
    long rejectedCommandCount;
    final ConditionStatus[] conditions = new ConditionStatus[LoopCondition.values().length]; // nulls: no monitor

    /** An empty holder, to be filled by {@link LoopRunner#readStatus(LoopStatus)}. */
    public LoopStatus() {
    }

    void copyFrom(LoopStatus s) {
        tickCount = s.tickCount;
        setpoint = s.setpoint;
        measurement = s.measurement;
        output = s.output;
        mode = s.mode;
        fault = s.fault;
        faultCount = s.faultCount;
        overrunCount = s.overrunCount;
        skippedTickCount = s.skippedTickCount;
        failedTickCount = s.failedTickCount;
        consecutiveFailures = s.consecutiveFailures;
        lastPeriodErrorNanos = s.lastPeriodErrorNanos;
        appliedCommandCount = s.appliedCommandCount;
        rejectedCommandCount = s.rejectedCommandCount;
        System.arraycopy(s.conditions, 0, conditions, 0, conditions.length);
    }

    /** {@return ticks run since the runner was built (counting across restarts)} */
    public long tickCount() {
        return tickCount;
    }

    /** {@return the setpoint the last tick used (NaN when its source failed)} */
    public double setpoint() {
        return setpoint;
    }

    /** {@return the measurement the last tick read (NaN when the read failed)} */
    public double measurement() {
        return measurement;
    }

    /** {@return the output the last tick wrote} */
    public double output() {
        return output;
    }

    /** {@return the controller's mode after the last tick} */
    public Mode mode() {
        return mode;
    }

    /** {@return the controller's fault at the last tick ({@link Fault#NONE} for a good sample)} */
    public Fault fault() {
        return fault;
    }

    /** {@return faulty samples the controller has counted} */
    public long faultCount() {
        return faultCount;
    }

    /** {@return ticks that ended after the next deadline} */
    public long overrunCount() {
        return overrunCount;
    }

    /** {@return deadlines dropped by {@link OverrunPolicy#SKIP_MISSED}} */
    public long skippedTickCount() {
        return skippedTickCount;
    }

    /** {@return ticks in which at least one callback failed} */
    public long failedTickCount() {
        return failedTickCount;
    }

    /** {@return failed ticks in a row up to the last tick (0 after a good tick)} */
    public int consecutiveFailures() {
        return consecutiveFailures;
    }

    /**
     * The last tick's start minus the previous tick's start, minus the period, in nanoseconds:
     * positive when the tick came late relative to the one before; 0 at the first tick of a run.
     *
     * @return the period error of the last tick in nanoseconds
     */
    public long lastPeriodErrorNanos() {
        return lastPeriodErrorNanos;
    }

    /** {@return operator commands applied so far (the number of the last one applied)} */
    public long appliedCommandCount() {
        return appliedCommandCount;
    }

    /** {@return operator commands that were taken but could not be applied (a restore that did not fit)} */
    public long rejectedCommandCount() {
        return rejectedCommandCount;
    }

    /**
     * The loop monitor's status of a condition after the last tick, for a runner built with
     * {@link LoopRunner#monitored}; null for a runner without a monitor (nothing is watched, which is
     * not the same as ok).
     *
     * @param condition the condition to read
     * @return ok, warn or alarm, or null without a monitor
     */
    public ConditionStatus condition(LoopCondition condition) {
        return conditions[condition.ordinal()];
    }

    /** {@return the worst of the monitor's condition statuses after the last tick; null without a monitor} */
    public ConditionStatus worstCondition() {
        ConditionStatus worst = conditions[0];
        for (ConditionStatus c : conditions) {
            if (c != null && c.compareTo(worst) > 0) {
                worst = c;
            }
        }
        return worst;
    }

    @Override
    public String toString() {
        return "tick " + tickCount + ", output " + output + ", mode " + mode + ", fault " + fault + " (" + faultCount
                + "), overruns " + overrunCount + ", skipped " + skippedTickCount + ", failed " + failedTickCount
                + ", last period error " + lastPeriodErrorNanos + " ns, commands applied " + appliedCommandCount;
    }
}
