/**
 * The controller and its settings: {@link org.loopwright.pid.PidController} runs the law,
 * {@link org.loopwright.pid.ControllerSettings} holds an immutable, validated configuration, and
 * {@link org.loopwright.pid.StateSnapshot} carries the dynamic state across a restart.
 */
package org.loopwright.pid;
