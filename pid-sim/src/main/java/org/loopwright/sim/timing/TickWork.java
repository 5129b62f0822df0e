package org.loopwright.sim.timing;

import org.loopwright.pid.PidController;
import org.loopwright.pid.runner.MeasurementSource;
import org.loopwright.pid.runner.OutputSink;
import org.loopwright.pid.runner.SetpointSource;

/**
 * The work of every timed tick, the same for the runner and the baseline: the setpoint steps between
 * 0 and 1 every {@link #STEP_TICKS} ticks, the measurement comes from a first-order plant
 * y' = (u − y)/T with T = {@link #TIME_CONSTANT_PERIODS} periods, stepped exactly over one period with
 * the output held (zero-order hold: y ← a·y + (1 − a)·u, a = e^(−h/T)), in the same tick. The plant
 * gives the update real work; its response is not judged. The time from the end of the read to the
 * start of the write is the update's own cost (plus two clock reads). Allocates nothing.
 */
final class TickWork implements SetpointSource, MeasurementSource, OutputSink {

    /** The setpoint steps every this many ticks. */
    static final int STEP_TICKS = 500;
    /** The plant's time constant in periods. */
    static final double TIME_CONSTANT_PERIODS = 50.0;

    private final double decay = Math.exp(-1.0 / TIME_CONSTANT_PERIODS);
    private long ticks;
    private double y;
    private long readEnd;
    private long updateNanosSum;
    private long updates;

    @Override
    public double setpoint() {
        return (ticks / STEP_TICKS) % 2 == 0 ? 1.0 : 0.0;
    }

    @Override
    public double readMeasurement() {
        readEnd = System.nanoTime();
        return y;
    }

    @Override
    public void writeOutput(double u) {
        updateNanosSum += System.nanoTime() - readEnd;
        updates++;
        if (Double.isFinite(u)) {
            y = decay * y + (1.0 - decay) * u;
        }
        ticks++;
    }

    /** One baseline tick: the same calls the runner makes. */
    void tick(PidController controller) {
        double r = setpoint();
        writeOutput(controller.update(r, readMeasurement()));
    }

    /** Mean update cost in nanoseconds. */
    double meanUpdateNanos() {
        return updates == 0 ? Double.NaN : (double) updateNanosSum / updates;
    }
}
