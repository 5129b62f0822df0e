package org.loopwright.sim.simulate;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.multiloop.Cascade;
import org.loopwright.pid.multiloop.ScheduledController;
import org.loopwright.pid.multiloop.SplitRange;
import org.loopwright.pid.onoff.OnOffController;
import org.loopwright.sim.nonideal.Actuator;
import org.loopwright.sim.nonideal.Sensor;
import org.loopwright.sim.plant.LinearPlant;
import org.loopwright.sim.plant.Plant;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

/**
 * One running closed loop, advanced a sample at a time in the standard sampled-data order. At the
 * sample instant t(k) = k·h (+ jitter):
 * <ol>
 * <li>the plant is advanced from t(k−1) to t(k) with u(k−1), as delivered by the actuator, held
 *     (zero-order hold) plus the load in effect; a load step that falls inside the interval splits
 *     the advance at its own time;</li>
 * <li>y(k) is read through the sensor (delay, noise, quantisation, dropout) and r(k) is taken from
 *     the setpoint profile at t(k);</li>
 * <li>u(k) is computed and handed to the actuator, which delivers it over [t(k), t(k+1)); the
 *     controller is told what was delivered (for actuator-tracking anti-windup).</li>
 * </ol>
 * An incremental (velocity-form) PID controller is taken to drive an integrating actuator: u(k) is
 * then the position that actuator reaches, as the controller reports it.
 *
 * <p>A cascade runs at the inner controller's period: the outer controller acts on every n-th
 * sample; the plant is the inner plant and the scenario's plant in series ({@link SeriesPlant}),
 * the sensor reads the outer measurement and the inner measurement is read as it is. A split range
 * spreads the delivered output over two actuators and the plant sees second − first.
 *
 * <p>A run whose process output diverges (see {@link Divergence}) stops at that sample.
 *
 * <p>Each sample goes to a {@link SampleRecorder}: the loop's own {@link Trajectory}, or the caller's.
 * {@link #step()} allocates nothing (the trajectory is sized at construction; a linear plant has
 * cached its discretisation after the first samples). Usable from a benchmark:
 * {@code if (!loop.step()) loop.rewind();}. A sweep runs many plants on one loop with
 * {@link #rewind(PlantModel)}.
 *
 * <p>Not thread-safe: one thread runs a loop; build one loop per thread from a shared scenario.
 */
public final class ClosedLoop {

    private final Scenario scenario;
    private Plant plant;
    private final SeriesPlant series;
    private final SplitRange split;
    private final FeedbackLaw law;
    private final Actuator actuator;
    private final Sensor sensor;
    private final SampleRecorder recorder;
    // the recorder when it is the loop's own trajectory, which also takes the cascade and split-range columns
    private final Trajectory trajectory;
    private final double periodSeconds;
    private final int samples;

    private final double[] changeAt;
    private final double[] changeValue;
    private final double[] changeRamp;
    private final double[] loadAt;
    private final double[] loadValue;

    private double divergenceBound;
    private int k;
    private double previousInstant;
    private double previousDelay;
    private double delivered;
    private double load;
    private int nextLoad;
    private int nextChange;
    private double rampStart;
    private double rampFrom;
    private double rampTo;
    private double rampSeconds;

    /** A loop at rest, at sample 0, for the scenario, recording into a {@link Trajectory} of its own. */
    public ClosedLoop(Scenario scenario) {
        this(scenario, null);
    }

    /**
     * A loop at rest, at sample 0, for the scenario, handing each sample to {@code recorder} and keeping
     * no trajectory ({@link #run()} and {@link #trajectory()} are then not available); a null recorder
     * means a trajectory of the loop's own, as {@link #ClosedLoop(Scenario)}.
     */
    public ClosedLoop(Scenario scenario, SampleRecorder recorder) {
        this.scenario = scenario;
        this.series = scenario.inner().map(i -> new SeriesPlant(i.plant().newPlant(), scenario.plant().newPlant()))
                .orElse(null);
        this.plant = series != null ? series : scenario.plant().newPlant();
        this.law = scenario.controller().map(s -> pidLaw(scenario, s))
                .orElseGet(() -> new FeedbackLaw.OnOff(new OnOffController(scenario.onOffController().orElseThrow())));
        this.split = scenario.splitRange().map(sr -> sr.forController(scenario.drivingController().orElseThrow()))
                .orElse(null);
        this.actuator = new Actuator(scenario.actuator());
        this.sensor = new Sensor(scenario.sensor(), scenario.seed());
        this.periodSeconds = scenario.samplePeriodSeconds();
        this.samples = scenario.sampleCount();
        this.trajectory = recorder == null ? new Trajectory(samples, series != null, split != null) : null;
        this.recorder = recorder == null ? trajectory : recorder;
        int changes = scenario.setpoint().size();
        changeAt = new double[changes];
        changeValue = new double[changes];
        changeRamp = new double[changes];
        for (int i = 0; i < changes; i++) {
            SetpointChange c = scenario.setpoint().get(i);
            changeAt[i] = c.atSeconds();
            changeValue[i] = c.value();
            changeRamp[i] = c.rampSeconds();
        }
        int loads = scenario.disturbances().size();
        loadAt = new double[loads];
        loadValue = new double[loads];
        for (int i = 0; i < loads; i++) {
            LoadStep l = scenario.disturbances().get(i);
            loadAt[i] = l.atSeconds();
            loadValue[i] = l.value();
        }
        rewind();
    }

    private static FeedbackLaw pidLaw(Scenario scenario, ControllerSettings settings) {
        if (scenario.inner().isPresent()) {
            return new FeedbackLaw.Pid(new Cascade(new PidController(settings),
                    new PidController(scenario.inner().get().controller())));
        }
        return scenario.schedule().map(table -> new FeedbackLaw.Pid(new ScheduledController(settings, table)))
                .orElseGet(() -> new FeedbackLaw.Pid(new PidController(settings)));
    }

    /** Back to rest at sample 0 with the same random streams; the trajectory is emptied. */
    public void rewind() {
        plant.reset();
        law.reset();
        actuator.reset();
        double rest = plant.output();
        sensor.reset(rest);
        recorder.clear();
        double scale = Math.abs(rest);
        for (double value : changeValue) {
            scale = Math.max(scale, Math.abs(value));
        }
        for (double value : loadValue) {
            scale = Math.max(scale, Math.abs(value));
        }
        divergenceBound = Divergence.bound(scale);
        k = 0;
        previousInstant = 0.0;
        previousDelay = 0.0;
        delivered = 0.0;
        load = 0.0;
        nextLoad = 0;
        nextChange = 0;
        rampStart = 0.0;
        rampFrom = rest;
        rampTo = rest;
        rampSeconds = 0.0;
    }

    /**
     * Back to rest at sample 0 as {@link #rewind()} does, on another model of the scenario's plant (the
     * outer plant of a cascade): everything else — controller, setpoint, loads, actuator, sensor and its
     * random streams — stays the scenario's. A linear plant of the same order takes the model in place
     * ({@link LinearPlant#adopt}), allocating nothing per step afterwards; any other model gets a new
     * plant. {@link #scenario()} stays the scenario the loop was built for.
     */
    public void rewind(PlantModel model) {
        Plant current = series != null ? series.outer() : plant;
        if (current instanceof LinearPlant linear && model instanceof TransferFunction transfer
                && linear.fits(transfer)) {
            linear.adopt(transfer);
        } else if (series != null) {
            series.replaceOuter(model.newPlant());
        } else {
            plant = model.newPlant();
        }
        rewind();
    }

    /**
     * One sample: advance the plant to the next sample instant, read, update, deliver, record.
     *
     * @return false, doing nothing, when every sample of the scenario has been taken; false also when
     *         the process output at this instant has diverged ({@link Divergence}): the run stops there,
     *         the sample is not recorded and the trajectory is marked diverged
     */
    public boolean step() {
        if (k >= samples) {
            return false;
        }
        double delay = sensor.nextSampleDelaySeconds();
        double instant = k * periodSeconds + delay;
        if (k > 0) {
            // exactly h without jitter, so a linear plant's cached discretisation is hit every time
            double left = periodSeconds + (delay - previousDelay);
            double from = previousInstant;
            while (nextLoad < loadAt.length && loadAt[nextLoad] <= instant) {
                double piece = loadAt[nextLoad] - from;
                if (piece > 0.0) {
                    plant.advance(plantInput(), piece);
                    left -= piece;
                    from = loadAt[nextLoad];
                }
                load = loadValue[nextLoad++];
            }
            plant.advance(plantInput(), left);
        } else {
            while (nextLoad < loadAt.length && loadAt[nextLoad] <= instant) {
                load = loadValue[nextLoad++];
            }
        }
        double process = plant.output();
        if (Divergence.beyond(process, divergenceBound)) {
            recorder.markDiverged(instant);
            k = samples;
            return false;
        }
        double r = setpointAt(instant);
        double y = sensor.read(process);
        double innerMeasurement = series != null ? series.innerOutput() : Double.NaN;
        double u = law.update(r, y, innerMeasurement, load, instant);
        delivered = actuator.deliver(u, periodSeconds);
        law.delivered(delivered);
        recorder.record(instant, r, y, u, load, process, delivered, law.atLimit() || actuator.limited());
        if (series != null && trajectory != null) {
            trajectory.recordInner(law.innerSetpoint(), innerMeasurement);
        }
        if (split != null && trajectory != null) {
            trajectory.recordSplit(split.first(delivered), split.second(delivered));
        }
        previousInstant = instant;
        previousDelay = delay;
        k++;
        return true;
    }

    /** What the plant's input sees: the delivered output (spread by a split range) plus the load. */
    private double plantInput() {
        return (split != null ? split.second(delivered) - split.first(delivered) : delivered) + load;
    }

    private double setpointAt(double t) {
        while (nextChange < changeAt.length && changeAt[nextChange] <= t) {
            rampFrom = rampValue(changeAt[nextChange]);
            rampStart = changeAt[nextChange];
            rampTo = changeValue[nextChange];
            rampSeconds = changeRamp[nextChange];
            nextChange++;
        }
        return rampValue(t);
    }

    private double rampValue(double t) {
        if (rampSeconds == 0.0 || t >= rampStart + rampSeconds) {
            return rampTo;
        }
        return rampFrom + (rampTo - rampFrom) * (t - rampStart) / rampSeconds;
    }

    /**
     * Runs the remaining samples and returns the trajectory.
     *
     * @throws IllegalStateException for a loop that records into a recorder of the caller's
     */
    public Trajectory run() {
        runToEnd();
        return trajectory();
    }

    /** Runs the remaining samples, each handed to the recorder. */
    public void runToEnd() {
        while (step()) {
            // every sample handed to the recorder
        }
    }

    /**
     * The samples recorded so far.
     *
     * @throws IllegalStateException for a loop that records into a recorder of the caller's
     */
    public Trajectory trajectory() {
        if (trajectory == null) {
            throw new IllegalStateException("this loop keeps no trajectory: it records into " + recorder);
        }
        return trajectory;
    }

    /** The scenario this loop runs. */
    public Scenario scenario() {
        return scenario;
    }

    /** The number of samples taken so far. */
    public int samplesTaken() {
        return k;
    }
}
