package org.loopwright.pid.testing;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The one rule every zero-allocation test applies to the bytes charged to a thread over a few
 * windows of many updates (ticks, samples, simulation steps), read from
 * {@link com.sun.management.ThreadMXBean#getThreadAllocatedBytes(long)}.
 *
 * <p>The JVM now and then charges bytes to a thread that the code under test did not ask for: seen
 * here, 48 B in one window with no GC or safepoint in it, and a few hundred bytes on a loaded machine
 * when the JIT deoptimises a method and rematerialises objects that escape analysis had removed.
 * Those are one-off charges. An update that allocated a single 16-byte object would charge
 * 16 B × (updates per window) to every window. So the rule is: at least one window is exactly zero
 * (the steady state allocates nothing), and no window reaches {@value #ONE_OFF_BYTES_PER_WINDOW} B
 * (which also rules out an allocation every few hundred updates).
 */
public final class AllocationWindows {

    /** Windows each test measures. */
    public static final int COUNT = 3;

    /** The most the JVM's one-off charges may add to one window. */
    public static final long ONE_OFF_BYTES_PER_WINDOW = 4096;

    private AllocationWindows() {
    }

    /**
     * Runs a window of work {@link #COUNT} times on this thread, reading the counter around each.
     *
     * @param window one window of work, already warm
     * @return the bytes charged to this thread in each window
     */
    public static long[] measure(Runnable window) {
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) java.lang.management.ManagementFactory.getThreadMXBean();
        long thread = Thread.currentThread().getId();
        long[] bytes = new long[COUNT];
        for (int w = 0; w < COUNT; w++) {
            long before = threads.getThreadAllocatedBytes(thread);
            window.run();
            bytes[w] = threads.getThreadAllocatedBytes(thread) - before;
        }
        return bytes;
    }

    /**
     * Asserts the rule above.
     *
     * @param bytesPerWindow bytes charged to the thread in each window
     * @param what what one update is, for the failure message ("tick", "sample", ...)
     */
    public static void assertNothingAllocated(long[] bytesPerWindow, String what) {
        assertThat(bytesPerWindow).as("bytes per window of %ss: one window must be exactly zero", what)
                .contains(0L);
        for (long bytes : bytesPerWindow) {
            assertThat(bytes).as("bytes in a window of %ss: one-off JVM charges only", what)
                    .isLessThan(ONE_OFF_BYTES_PER_WINDOW);
        }
    }
}
