package org.loopwright.examples;

/** Reads the one optional argument every example takes: its duration in seconds. */
final class DurationArgument {

    private DurationArgument() {
    }

    /**
     * The first argument as seconds, or the default when there is none.
     *
     * @throws IllegalArgumentException naming the value when it is not a number
     */
    static double seconds(String[] args, double defaultSeconds) {
        if (args.length == 0) {
            return defaultSeconds;
        }
        try {
            return Double.parseDouble(args[0].strip());
        } catch (NumberFormatException e) {
            throw new IllegalArgumentException("duration must be a number of seconds: duration=" + args[0], e);
        }
    }
}
