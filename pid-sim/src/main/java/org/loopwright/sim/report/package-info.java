/**
 * Reports of closed-loop runs: the trajectory as CSV (Commons CSV), plots as PNG and SVG (XChart),
 * and the metrics as a table or JSON (Jackson). The plotting helpers are meant for reuse.
 */
package org.loopwright.sim.report;
