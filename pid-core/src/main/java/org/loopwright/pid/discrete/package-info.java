/**
 * How each term of the continuous control law becomes a difference equation: the integral by
 * forward Euler, backward Euler or Tustin; the filtered derivative by backward Euler, Tustin,
 * step invariance, ramp invariance or forward Euler. The coefficients computed here are the only
 * copy of these formulas: the controller runs them and the frequency analysis evaluates them.
 *
 * <p>Source: Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i> (3rd ed., 1997), §8.2–8.3.
 */
package org.loopwright.pid.discrete;
