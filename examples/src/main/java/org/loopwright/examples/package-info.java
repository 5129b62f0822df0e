/**
 * Runnable programs in scenarios of our own, each also run by a test so that it cannot rot: a water
 * bath heater ({@link org.loopwright.examples.WaterBath}), a booster pump holding a discharge pressure
 * ({@link org.loopwright.examples.BoosterPump}) and a camera gimbal axis driven by the fixed-rate loop
 * runner ({@link org.loopwright.examples.GimbalAxis}). Every plant number in them is invented for the
 * demonstration.
 */
package org.loopwright.examples;
