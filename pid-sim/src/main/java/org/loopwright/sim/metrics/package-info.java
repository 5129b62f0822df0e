/**
 * Figures of merit of a closed-loop run: step-response figures, integral criteria, controller
 * effort, saturation, and the limit cycle of an on-off loop.
 */
package org.loopwright.sim.metrics;
