/**
 * The discretisation study: every integral × derivative method at each sample period against the
 * continuous design, in one table (margins, Ms, set-point and load response, the controller's error
 * at the crossover, and how the period compares with the crossover), with its plots.
 */
package org.loopwright.sim.study;
