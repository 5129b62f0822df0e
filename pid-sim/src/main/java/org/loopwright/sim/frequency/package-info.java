/**
 * Frequency analysis of a PID loop: the frequency responses of the continuous and the discrete
 * controller, of the plant with its dead time and of its zero-order-hold equivalent; the stability
 * margins of the continuous design and of the sampled loop; and the closed-loop poles that decide
 * whether the sampled loop is stable. {@link org.loopwright.sim.frequency.LoopAnalysis} is the entry
 * point.
 *
 * <p>Sources: Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i> (3rd ed., 1997), ch. 2
 * (sampling with time delay) and ch. 8 (approximating continuous designs); Åström &amp; Murray,
 * <i>Feedback Systems</i> (2nd ed., 2021), ch. 10–11 (margins, sensitivity).
 */
package org.loopwright.sim.frequency;
