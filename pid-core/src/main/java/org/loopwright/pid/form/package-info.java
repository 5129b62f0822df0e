/**
 * The three standard ways to write PID gains — parallel, ideal (non-interacting) and series
 * (interacting) — as immutable values with exact conversions between them.
 *
 * <p>Conversions follow Åström &amp; Hägglund, <i>Advanced PID Control</i> (ISA, 2006), §3.4.
 */
package org.loopwright.pid.form;
