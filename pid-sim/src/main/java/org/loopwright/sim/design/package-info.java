/**
 * The design job in one go: from a step test or a model to candidate settings (published rules and
 * the Ms-constrained largest integral gain on the sampled loop), each verified on the sampled loop,
 * in simulation with the device's limits and across plant uncertainty, and one recommendation.
 */
package org.loopwright.sim.design;
