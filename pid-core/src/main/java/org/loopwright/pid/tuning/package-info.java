/**
 * Tuning on the device: published tuning rules from a first-order-plus-dead-time model or from an
 * ultimate gain and period, Smith's two-point estimate of such a model from a step test, and a
 * relay experiment that finds the ultimate point by making the loop oscillate a little.
 *
 * <p>Every rule names its paper in {@link org.loopwright.pid.tuning.TuningRule#citation()} and in
 * every {@link org.loopwright.pid.tuning.TuningResult}. A rule that does not apply to a model
 * returns a {@link org.loopwright.pid.tuning.RuleNotApplicable} with the reason instead of throwing.
 */
package org.loopwright.pid.tuning;
