/**
 * Checking tuned settings before they reach hardware: a rule's gains turned into controller
 * settings, with the margins and Ms they give on a model and the setpoint- and load-step figures
 * of a simulation, so the rules can be compared side by side.
 */
package org.loopwright.sim.tuning;
