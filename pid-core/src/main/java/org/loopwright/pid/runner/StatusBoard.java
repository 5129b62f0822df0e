package org.loopwright.pid.runner;

import java.lang.invoke.VarHandle;

/**
 * The runner's published status behind a sequence lock: the loop thread is the only writer and
 * makes the version odd while it writes, even when it is done; a reader copies the fields and keeps
 * the copy only if the version was even and unchanged around it (the pattern of
 * {@link java.util.concurrent.locks.StampedLock}'s optimistic read). No allocation and no lock on
 * either side; the writer never waits for readers.
 */
final class StatusBoard {

    private volatile long version;

    /** Written by the loop thread between {@link #beginWrite()} and {@link #endWrite()} only. */
    final LoopStatus current = new LoopStatus();

    void beginWrite() {
        version = version + 1;
        VarHandle.storeStoreFence(); // the field writes below may not move above the odd version
    }

    void endWrite() {
        version = version + 1; // a volatile write: the field writes above may not move below it
    }

    /** Copies one tick's status; spins briefly while the loop thread is writing. */
    void readInto(LoopStatus into) {
        while (true) {
            long before = version;
            if ((before & 1L) == 0L) {
                into.copyFrom(current);
                VarHandle.loadLoadFence(); // the field reads above may not move below the check
                if (version == before) {
                    return;
                }
            }
            Thread.onSpinWait();
        }
    }
}
