/**
 * Assessment of a logged loop ({@code assess}): the loop monitor run over the record, then the methods
 * that need the whole record — stiction by the cross-correlation test ({@link
 * org.loopwright.sim.assess.HorchStiction}), the minimum-variance index ({@link
 * org.loopwright.sim.assess.HarrisIndex}) and the oscillation's period and regularity from the
 * autocorrelation of the error ({@link org.loopwright.sim.assess.ErrorAutocorrelation}) — gathered
 * as {@link org.loopwright.sim.assess.Finding}s by {@link org.loopwright.sim.assess.LoopAssessment}.
 */
package org.loopwright.sim.assess;
