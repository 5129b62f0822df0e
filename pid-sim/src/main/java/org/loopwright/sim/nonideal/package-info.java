/**
 * Non-ideal parts of a loop: the actuator (dead zone, saturation, slew) and the sensor (delay, seeded
 * noise, quantisation, dropouts, sample jitter). Models are immutable records; the running parts are
 * allocation-free.
 */
package org.loopwright.sim.nonideal;
