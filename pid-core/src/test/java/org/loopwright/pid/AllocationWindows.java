package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import java.lang.management.ManagementFactory;
import java.util.Arrays;

/**
 * Bytes allocated by the calling thread over three windows of warm work, read from the JVM's
 * per-thread counter ({@link com.sun.management.ThreadMXBean#getThreadAllocatedBytes(long)}). The
 * JVM itself now and then charges a few dozen bytes to a thread (seen in pid-sim's closed-loop test:
 * 48 B in one window, with no GC or safepoint in it), so one window must be exactly zero and the
 * three together under {@link #JVM_NOISE_BYTES}; work that allocated one 16-byte object per step
 * would charge megabytes to every window. The same rule as pid-sim's {@code ClosedLoopAllocationTest}.
 */
public final class AllocationWindows {

    /** The number of measured windows. */
    public static final int WINDOWS = 3;
    /** What the JVM may charge to a thread over all windows, in bytes. */
    public static final long JVM_NOISE_BYTES = 256;

    private AllocationWindows() {
    }

    /**
     * Runs a window of work {@link #WINDOWS} times, reading the counter around each.
     *
     * @param window one window of work, already warm
     * @return the bytes allocated in each window
     */
    public static long[] measure(Runnable window) {
        com.sun.management.ThreadMXBean threads = (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        long thread = Thread.currentThread().getId();
        long[] bytes = new long[WINDOWS];
        for (int w = 0; w < WINDOWS; w++) {
            long before = threads.getThreadAllocatedBytes(thread);
            window.run();
            bytes[w] = threads.getThreadAllocatedBytes(thread) - before;
        }
        return bytes;
    }

    /**
     * Asserts that the windows show no allocation: one window exactly zero, all together under the noise.
     *
     * @param bytes the bytes of each window
     * @param what  what a window holds, for the message ("100000 updates")
     */
    public static void assertNothingAllocated(long[] bytes, String what) {
        assertThat(bytes).as("bytes per window of %s", what).contains(0L);
        assertThat(Arrays.stream(bytes).sum()).as("bytes over %d windows of %s", WINDOWS, what)
                .isLessThan(JVM_NOISE_BYTES);
    }
}
