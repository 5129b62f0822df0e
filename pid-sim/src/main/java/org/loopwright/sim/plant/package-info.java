/**
 * Plant models: linear transfer functions with dead time, stepped exactly by the matrix exponential
 * ({@link org.loopwright.sim.plant.LinearPlant}), and nonlinear plants integrated with fixed sub-steps
 * (DC motor with stick–slip friction, thermal zone, draining tank). A {@link org.loopwright.sim.plant.PlantModel}
 * is the immutable description; a {@link org.loopwright.sim.plant.Plant} is one running instance.
 */
package org.loopwright.sim.plant;
