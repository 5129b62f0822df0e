package org.loopwright.sim.config;

/**
 * A place in a text file, as an editor shows it.
 *
 * @param line   line, from 1
 * @param column column, from 1
 */
public record TextPosition(int line, int column) {

    /** The start of a file. */
    public static final TextPosition START = new TextPosition(1, 1);
}
