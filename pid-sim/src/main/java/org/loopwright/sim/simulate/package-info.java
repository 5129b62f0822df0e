/**
 * The closed-loop simulation in the standard sampled-data order, allocation-free per step, and the
 * trajectory it records.
 */
package org.loopwright.sim.simulate;
