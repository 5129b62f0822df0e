/**
 * Loops that work together: a {@link org.loopwright.pid.multiloop.Cascade} of an outer controller
 * whose output is an inner controller's setpoint, a {@link org.loopwright.pid.multiloop.ScheduledController}
 * whose settings follow a scheduling variable through a {@link org.loopwright.pid.multiloop.GainSchedule},
 * and a {@link org.loopwright.pid.multiloop.SplitRange} that spreads one output over two actuators.
 * Each wraps the ordinary {@link org.loopwright.pid.PidController} and keeps its rules: bumpless
 * transfers, windup protection and no allocation per update.
 */
package org.loopwright.pid.multiloop;
