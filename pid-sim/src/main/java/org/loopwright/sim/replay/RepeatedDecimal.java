package org.loopwright.sim.replay;

/**
 * The text of one result column's numbers ({@link Replay#number}), kept for the last value: a logged
 * loop repeats a value for long stretches (an output at its limit, a derivative term of 0 without
 * derivative action), and the shortest exact decimal costs more than the rest of a row.
 * Not thread-safe.
 */
final class RepeatedDecimal {

    private long lastBits;
    private String lastText;

    /** The value as {@link Replay#number} writes it. */
    String text(double value) {
        long bits = Double.doubleToRawLongBits(value);
        if (lastText == null || bits != lastBits) {
            lastBits = bits;
            lastText = Replay.number(value);
        }
        return lastText;
    }
}
