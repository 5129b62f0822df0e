package org.loopwright.bench.suite;

/**
 * One performance target and whether this run met it.
 *
 * @param target   the target as the design notes state it
 * @param measured what this run measured, in words and numbers
 * @param met      whether it was met
 */
public record TargetCheck(String target, String measured, boolean met) {
}
