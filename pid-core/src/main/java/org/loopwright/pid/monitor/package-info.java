/**
 * The loop monitor: {@link org.loopwright.pid.monitor.LoopMonitor} is fed once per sample with
 * setpoint, measurement, output and mode, and keeps — in constant work and without allocating — a
 * status ({@link org.loopwright.pid.monitor.ConditionStatus}) for each
 * {@link org.loopwright.pid.monitor.LoopCondition}: oscillation (Hägglund 1995), sluggishness (the
 * idle index, Hägglund 1999), saturation, a frozen measurement and measurement noise. Thresholds live
 * in the immutable {@link org.loopwright.pid.monitor.MonitorSettings}; any thread may poll the
 * statuses or copy the published figures into a {@link org.loopwright.pid.monitor.MonitorSummary}.
 */
package org.loopwright.pid.monitor;
