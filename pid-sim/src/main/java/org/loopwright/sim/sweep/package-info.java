/**
 * Parameter sweeps: many closed-loop simulations of one scenario over plants drawn around its
 * nominal plant, run in parallel, summarised as distributions of the response figures, the share of
 * unstable and unsettled runs, and the worst run. Reproducible for a seed whatever the thread count.
 */
package org.loopwright.sim.sweep;
