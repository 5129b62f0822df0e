package org.loopwright.sim.replay;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.io.Writer;
import java.util.ArrayDeque;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;

import org.loopwright.pid.Fault;
import org.loopwright.pid.PidController;

/**
 * {@link Replay#stream}'s work on several threads, so a long trace keeps every core busy while the
 * controller stays on one: a reader thread reads and checks rows, the caller's thread runs the
 * controller over them in order, a pool turns finished rows into text (the shortest exact decimals
 * of four numbers a row were most of a replay's time), and the caller writes that text in order.
 * Rows travel in batches drawn from a fixed set, so memory does not grow with the trace: the reader
 * waits while every batch is in use. A bad row's error reaches the caller when the controller gets
 * to that row, as it would reading on one thread.
 *
 * <p>Used once, by one thread.
 */
final class ReplayPipeline {

    /** Rows in a batch: large enough that handing a batch over costs little per row. */
    static final int ROWS_PER_BATCH = 4096;
    /** Batches being formatted or waiting to be written, at most. */
    private static final int IN_FLIGHT = 4;
    /** Every batch: those in flight, one with the controller, the rest for the reader to fill. */
    private static final int BATCHES = 2 * IN_FLIGHT + 1;

    private final TraceReader trace;
    private final ReplayEngine engine;
    private final ReplaySummary.Accumulator summary;
    private final BlockingQueue<Batch> empty = new ArrayBlockingQueue<>(BATCHES);
    private final BlockingQueue<Batch> filled = new ArrayBlockingQueue<>(BATCHES);

    ReplayPipeline(TraceReader trace, ReplayEngine engine, ReplaySummary.Accumulator summary) {
        this.trace = trace;
        this.engine = engine;
        this.summary = summary;
        for (int i = 0; i < BATCHES; i++) {
            empty.add(new Batch());
        }
    }

    /** Replays every row, writing each result row to {@code out} in the trace's order. */
    void run(Writer out) throws IOException {
        Thread reader = new Thread(this::read, "replay-reader");
        reader.setDaemon(true);
        int formatters = Math.min(IN_FLIGHT, Runtime.getRuntime().availableProcessors());
        ExecutorService formatting = Executors.newFixedThreadPool(formatters, task -> {
            Thread thread = new Thread(task, "replay-formatter");
            thread.setDaemon(true);
            return thread;
        });
        ArrayDeque<Future<Batch>> inFlight = new ArrayDeque<>();
        reader.start();
        try {
            Batch batch;
            do {
                batch = filled.take();
                control(batch);
                inFlight.add(formatting.submit(batch::format));
                while (inFlight.size() >= IN_FLIGHT || !inFlight.isEmpty() && inFlight.peek().isDone()) {
                    write(inFlight.remove(), out);
                }
            } while (!batch.last);
            while (!inFlight.isEmpty()) {
                write(inFlight.remove(), out);
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new InterruptedIOException("the replay was interrupted");
        } finally {
            formatting.shutdownNow();
            reader.interrupt();
        }
    }

    /** The reader thread: fills batches until the trace ends or a row is refused. */
    private void read() {
        try {
            boolean more = true;
            while (more) {
                Batch batch = empty.take();
                batch.size = 0;
                try {
                    while (batch.size < ROWS_PER_BATCH && trace.next(batch.rows[batch.size])) {
                        batch.size++;
                    }
                    more = batch.size == ROWS_PER_BATCH;
                } catch (RuntimeException | Error e) {
                    batch.failure = e;
                    more = false;
                }
                batch.last = !more;
                filled.put(batch);
            }
        } catch (InterruptedException e) {
            // the replay stopped early (an error further on); nothing is waiting for more rows
        }
    }

    /** The caller's thread: the controller over the batch's rows, then the reader's error, if any. */
    private void control(Batch batch) {
        PidController c = engine.controller;
        for (int k = 0; k < batch.size; k++) {
            TraceRow row = batch.rows[k];
            engine.step(row);
            summary.add(row.number(), row.timeSeconds(), c.fault(), c.output(), c.position());
            batch.output[k] = c.output();
            batch.proportional[k] = c.proportionalTerm();
            batch.integral[k] = c.integralTerm();
            batch.derivative[k] = c.derivativeTerm();
            batch.status[k] = c.fault();
        }
        if (batch.failure instanceof RuntimeException e) {
            throw e;
        }
        if (batch.failure instanceof Error e) {
            throw e;
        }
    }

    private void write(Future<Batch> formatted, Writer out) throws IOException, InterruptedException {
        Batch batch;
        try {
            batch = formatted.get();
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException cause) {
                throw cause;
            }
            throw new IllegalStateException("formatting a batch of the replay failed", e.getCause());
        }
        batch.writeTo(out);
        empty.put(batch);
    }

    /** Rows with their results and, once formatted, their text. */
    private static final class Batch {
        final TraceRow[] rows = new TraceRow[ROWS_PER_BATCH];
        final double[] output = new double[ROWS_PER_BATCH];
        final double[] proportional = new double[ROWS_PER_BATCH];
        final double[] integral = new double[ROWS_PER_BATCH];
        final double[] derivative = new double[ROWS_PER_BATCH];
        final Fault[] status = new Fault[ROWS_PER_BATCH];
        final RepeatedDecimal outputText = new RepeatedDecimal();
        final RepeatedDecimal proportionalText = new RepeatedDecimal();
        final RepeatedDecimal integralText = new RepeatedDecimal();
        final RepeatedDecimal derivativeText = new RepeatedDecimal();
        final StringBuilder text = new StringBuilder();
        char[] chars = new char[0];
        int size;
        boolean last;
        Throwable failure;

        Batch() {
            for (int k = 0; k < ROWS_PER_BATCH; k++) {
                rows[k] = new TraceRow();
            }
        }

        Batch format() {
            text.setLength(0);
            for (int k = 0; k < size; k++) {
                Replay.appendResultRow(text, rows[k].cells(), outputText.text(output[k]),
                        proportionalText.text(proportional[k]), integralText.text(integral[k]),
                        derivativeText.text(derivative[k]), ReplayResult.statusWord(status[k]));
            }
            return this;
        }

        void writeTo(Writer out) throws IOException {
            int length = text.length();
            if (chars.length < length) {
                chars = new char[length];
            }
            text.getChars(0, length, chars, 0);
            out.write(chars, 0, length);
        }
    }
}
