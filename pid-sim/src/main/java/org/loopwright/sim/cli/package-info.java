/** The command-line harness and its sub-commands. */
package org.loopwright.sim.cli;
