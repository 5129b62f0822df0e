package org.loopwright.sim.frequency;

/**
 * The factors k by which the loop gain may be multiplied with the closed loop staying stable, as an
 * open interval (low, high): low = 0 when there is no lower bound (searched down to 10⁻⁴), high =
 * infinity when there is no upper one (searched up to 10⁴). An open-loop-unstable plant has a lower
 * bound above 0: the lower gain margin. Thread-safe: immutable.
 *
 * @param low  the smallest stabilising factor (exclusive), 0 for none
 * @param high the largest stabilising factor (exclusive), infinity for none
 */
public record GainRange(double low, double high) {

    /** Whether the nominal loop, k = 1, lies inside. */
    public boolean containsNominal() {
        return low < 1.0 && 1.0 < high;
    }
}
