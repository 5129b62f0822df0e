/**
 * Identification of step-test data: reading a {@code time,input,output} CSV, finding the step in
 * the input, and fitting a first-order-plus-dead-time or second-order-plus-dead-time model by least
 * squares (Hipparchus Levenberg–Marquardt) started from Smith's two-point estimate, with the fit's
 * RMSE and R² and a plot of the data against the fitted response.
 */
package org.loopwright.sim.identify;
