/**
 * Replaying logged field data through a controller configuration: the trace CSV reader, the
 * replay itself (one controller update per row), its result and summary, and the built-in demo.
 */
package org.loopwright.sim.replay;
