package org.loopwright.sim.cli;

import java.io.PrintStream;
import java.util.function.IntConsumer;

import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;

/**
 * The sweep's progress bar (me.tongfei:progressbar), or nothing: {@link #off()} for JSON output,
 * {@code --no-progress} and a standard error that is not a console. Steps are counted from the
 * pool's threads. Thread-safe: the bar's counter is.
 */
final class SweepProgress implements IntConsumer, AutoCloseable {

    /** The bar's width in characters (fixed, so no terminal has to be probed). */
    static final int WIDTH = 100;
    private static final int REFRESH_MILLIS = 200;

    private final ProgressBar bar;

    private SweepProgress(ProgressBar bar) {
        this.bar = bar;
    }

    /** No bar. */
    static SweepProgress off() {
        return new SweepProgress(null);
    }

    /** A bar over {@code runs} steps drawn on {@code stream}. */
    static SweepProgress on(PrintStream stream, int runs) {
        return new SweepProgress(new ProgressBarBuilder().setTaskName("sweep").setInitialMax(runs)
                .setUpdateIntervalMillis(REFRESH_MILLIS).setConsumer(new ConsoleProgressBarConsumer(stream, WIDTH))
                .build());
    }

    @Override
    public void accept(int runIndex) {
        if (bar != null) {
            bar.step();
        }
    }

    @Override
    public void close() {
        if (bar != null) {
            bar.close();
        }
    }
}
