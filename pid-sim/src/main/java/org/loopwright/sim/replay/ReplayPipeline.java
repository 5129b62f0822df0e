package org.loopwright.sim.replay;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.Semaphore;

import org.loopwright.pid.Fault;
import org.loopwright.pid.PidController;

/**
 * {@link Replay#stream}'s work on several threads, so a long trace keeps every core busy while the
 * controller stays on one: a reader thread reads and checks rows, the caller's thread runs the
 * controller over them in order, a pool turns finished rows into text (the shortest exact decimals
 * of four numbers a row were most of a replay's time), and the caller writes that text in order.
 * Rows travel in batches, at most {@link #BATCHES} at a time, so memory does not grow with the
 * trace: the reader waits while that many are in use. A bad row's error reaches the caller when the controller gets
 * to that row, as it would reading on one thread.
 *
 * <p>Used once, by one thread.
 */
final class ReplayPipeline {

    /**
     * Rows in a batch: enough that handing a batch over costs little per row, few enough that the
     * batches in use (their cells held as strings) add little to what the collector copies.
     */
    static final int ROWS_PER_BATCH = 1024;
    /** Batches being formatted or waiting to be written, at most. */
    private static final int IN_FLIGHT = 4;
    /** Batches at a time: those in flight, one with the controller, the rest filled ahead by the reader. */
    private static final int BATCHES = 2 * IN_FLIGHT + 1;

    private final TraceReader trace;
    private final ReplayEngine engine;
    private final ReplaySummary.Accumulator summary;
    private final Semaphore batchesFree = new Semaphore(BATCHES);
    private final BlockingQueue<Batch> filled = new ArrayBlockingQueue<>(BATCHES);

    ReplayPipeline(TraceReader trace, ReplayEngine engine, ReplaySummary.Accumulator summary) {
        this.trace = trace;
        this.engine = engine;
        this.summary = summary;
    }

    /** Replays every row, writing each result row to {@code out} in the trace's order. */
    void run(OutputStream out) throws IOException {
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
                while (inFlight.size() >= IN_FLIGHT || (!inFlight.isEmpty() && inFlight.peek().isDone())) {
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
                batchesFree.acquire();
                Batch batch = new Batch();
                try {
                    TraceRow row = new TraceRow();
                    while (batch.size < ROWS_PER_BATCH && trace.next(row)) {
                        batch.rows[batch.size++] = row;
                        row = new TraceRow();
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

    private void write(Future<Batch> formatted, OutputStream out) throws IOException, InterruptedException {
        Batch batch;
        try {
            batch = formatted.get();
        } catch (ExecutionException e) {
            if (e.getCause() instanceof RuntimeException cause) {
                throw cause;
            }
            throw new IllegalStateException("formatting a batch of the replay failed", e.getCause());
        }
        out.write(batch.bytes);
        batchesFree.release();
    }

    /** Rows with their results and, once formatted, their text in UTF-8. */
    private static final class Batch {
        final TraceRow[] rows = new TraceRow[ROWS_PER_BATCH];
        final double[] output = new double[ROWS_PER_BATCH];
        final double[] proportional = new double[ROWS_PER_BATCH];
        final double[] integral = new double[ROWS_PER_BATCH];
        final double[] derivative = new double[ROWS_PER_BATCH];
        final Fault[] status = new Fault[ROWS_PER_BATCH];
        byte[] bytes;
        int size;
        boolean last;
        Throwable failure;

        Batch format() {
            RepeatedDecimal outputText = new RepeatedDecimal();
            RepeatedDecimal proportionalText = new RepeatedDecimal();
            RepeatedDecimal integralText = new RepeatedDecimal();
            RepeatedDecimal derivativeText = new RepeatedDecimal();
            StringBuilder text = new StringBuilder(ROWS_PER_BATCH * 96);
            for (int k = 0; k < size; k++) {
                Replay.appendResultRow(text, rows[k].cells(), outputText.text(output[k]),
                        proportionalText.text(proportional[k]), integralText.text(integral[k]),
                        derivativeText.text(derivative[k]), ReplayResult.statusWord(status[k]));
            }
            bytes = text.toString().getBytes(StandardCharsets.UTF_8);
            return this;
        }
    }
}
