package org.loopwright.sim.assess;

/**
 * A stretch of a record in time.
 *
 * @param fromSeconds start
 * @param toSeconds   end
 */
public record TimeSpan(double fromSeconds, double toSeconds) {
}
