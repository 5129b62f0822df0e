/** Plant models: linear transfer functions with dead time, stepped exactly, and nonlinear plants. */
package org.loopwright.sim.plant;
