package org.loopwright.sim.timing;

import org.HdrHistogram.Histogram;

/**
 * A timed loop's figures and the histogram of its period errors (nanoseconds), for a plot or a log.
 *
 * @param result        the figures
 * @param periodErrors  every period error recorded, in nanoseconds
 */
public record TimedRun(TimingResult result, Histogram periodErrors) {
}
