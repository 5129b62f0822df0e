package org.loopwright.bench.suite;

/**
 * A figure beside its baseline.
 *
 * @param figure   what was measured
 * @param baseline what it is compared with (the same figure for a baseline itself)
 * @param ratio    figure ÷ baseline
 */
public record Comparison(JmhFigure figure, JmhFigure baseline, double ratio) {
}
