package org.loopwright.pid.runner;

/** Records every tick's timing into preallocated arrays and stops the runner after a given number. */
final class TickRecorder implements TimingListener {

    final long[] scheduled;
    final long[] start;
    final long[] end;
    final boolean[] overrun;
    int ticks;
    LoopRunner runner;

    TickRecorder(int stopAfter) {
        scheduled = new long[stopAfter];
        start = new long[stopAfter];
        end = new long[stopAfter];
        overrun = new boolean[stopAfter];
    }

    @Override
    public void onTick(long scheduledNanos, long startNanos, long endNanos, boolean overran) {
        scheduled[ticks] = scheduledNanos;
        start[ticks] = startNanos;
        end[ticks] = endNanos;
        overrun[ticks] = overran;
        ticks++;
        if (ticks == scheduled.length) {
            runner.stop();
        }
    }
}
