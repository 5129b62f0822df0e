/**
 * Scenarios: one closed-loop experiment (controller, plant, setpoint profile, load steps, actuator,
 * sensor, duration, seed), built in code or read from a YAML file.
 */
package org.loopwright.sim.scenario;
