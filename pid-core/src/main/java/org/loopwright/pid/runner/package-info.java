/**
 * The fixed-rate loop runner: {@link org.loopwright.pid.runner.LoopRunner} reads the measurement,
 * updates a {@link org.loopwright.pid.PidController} and writes the output on a thread of its own,
 * at absolute deadlines (start + k·h, so the schedule never drifts). How it waits, what it does after
 * an overrun and how many failed callbacks it tolerates are set in
 * {@link org.loopwright.pid.runner.RunnerSettings}. Per-tick timing reaches a
 * {@link org.loopwright.pid.runner.TimingListener} as primitives, so a histogram can be attached
 * without allocation. Other threads command the running loop through its
 * {@link org.loopwright.pid.runner.OperatorChannel} and read it through the published
 * {@link org.loopwright.pid.runner.LoopStatus}, optionally over JMX
 * ({@link org.loopwright.pid.runner.LoopStatusRegistration}).
 */
package org.loopwright.pid.runner;
