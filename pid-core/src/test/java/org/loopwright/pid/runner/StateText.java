package org.loopwright.pid.runner;

import org.loopwright.pid.StateSnapshot;

/** Reads one number from a snapshot's text form (the snapshot has no accessors of its own). */
final class StateText {

    private StateText() {
    }

    static double value(StateSnapshot snapshot, String key) {
        for (String line : snapshot.toText().split("\n")) {
            if (line.startsWith(key + "=")) {
                return Double.parseDouble(line.substring(key.length() + 1));
            }
        }
        throw new IllegalArgumentException("no key " + key + " in " + snapshot.toText());
    }
}
