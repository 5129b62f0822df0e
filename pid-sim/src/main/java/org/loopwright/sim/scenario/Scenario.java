package org.loopwright.sim.scenario;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;
import org.loopwright.pid.multiloop.Cascade;
import org.loopwright.pid.multiloop.GainSchedule;
import org.loopwright.pid.onoff.OnOffSettings;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.nonideal.ActuatorModel;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.TransferFunction;

/**
 * One closed-loop experiment, immutable: a controller (PID settings, or an on-off controller with
 * its sample period), a plant, a setpoint profile, load disturbances, the actuator and sensor, the
 * duration and the random seed. Samples are taken at 0, h, 2h, … up to the duration.
 *
 * <p>Before its first entry the setpoint equals the plant's output at rest, so a loop starts in
 * balance. The profile and the load steps are kept sorted by time (stable for equal times).
 *
 * <p>Example, a unit setpoint step on 1/(10s+1) under a PI controller for 100 s:
 * <pre>{@code
 * Scenario s = Scenario.setpointStep(TransferFunction.firstOrder(1.0, 10.0), settings, 1.0, 100.0);
 * Trajectory t = Simulation.run(s);
 * }</pre>
 *
 * <p>Thread-safe: immutable.
 */
public final class Scenario {

    /** The most samples a scenario may ask for (about 300 MB of trajectory). */
    public static final long MAX_SAMPLES = 5_000_000L;
    /** The most integrator sub-steps a nonlinear plant may take per sample period. */
    public static final long MAX_SUB_STEPS_PER_SAMPLE = 10_000L;

    private final ControllerSettings controller;
    private final OnOffSettings onOffController;
    private final double samplePeriodSeconds;
    private final PlantModel plant;
    private final List<SetpointChange> setpoint;
    private final List<LoadStep> disturbances;
    private final ActuatorModel actuator;
    private final SensorModel sensor;
    private final double durationSeconds;
    private final long seed;
    private final InnerLoop inner;
    private final GainSchedule schedule;
    private final SplitRangeSpec splitRange;
    private final Units units;

    private Scenario(Builder b) {
        plant = Objects.requireNonNull(b.plant, "plant");
        if ((b.controller == null) == (b.onOffController == null)) {
            throw new IllegalArgumentException("a scenario needs exactly one controller, PID or on-off");
        }
        controller = b.controller;
        onOffController = b.onOffController;
        inner = b.inner;
        schedule = b.schedule;
        splitRange = b.splitRange;
        if (inner != null) {
            if (controller == null) {
                throw new InvalidSettingException("onOffController", "given",
                        "cannot be the outer controller of a cascade; give a PID controller");
            }
            if (schedule != null) {
                throw new InvalidSettingException("schedule", "given",
                        "applies to a single loop's controller, not to a cascade's outer one");
            }
            Cascade.requireCompatible(controller, inner.controller());
        }
        if (schedule != null && controller == null) {
            throw new InvalidSettingException("schedule", "given", "needs a PID controller");
        }
        if (splitRange != null) {
            if (drivingController().isEmpty()) {
                throw new InvalidSettingException("splitRange", "given", "needs a PID controller");
            }
            splitRange.forController(drivingController().get());
        }
        samplePeriodSeconds = inner != null ? inner.controller().samplePeriodSeconds()
                : controller != null ? controller.samplePeriodSeconds()
                : SettingChecks.positive("samplePeriodSeconds", b.samplePeriodSeconds);
        setpoint = sorted(b.setpoint, Comparator.comparingDouble(SetpointChange::atSeconds));
        disturbances = sorted(b.disturbances, Comparator.comparingDouble(LoadStep::atSeconds));
        actuator = Objects.requireNonNull(b.actuator, "actuator");
        sensor = Objects.requireNonNull(b.sensor, "sensor");
        durationSeconds = SettingChecks.positive("durationSeconds", b.durationSeconds);
        if (sensor.jitterSeconds() >= samplePeriodSeconds) {
            throw new InvalidSettingException("jitterSeconds", sensor.jitterSeconds(),
                    "must be < the sample period (" + samplePeriodSeconds + ")");
        }
        if (samplePeriodSeconds / plant.integrationStepSeconds() > MAX_SUB_STEPS_PER_SAMPLE) {
            throw new InvalidSettingException("integrationStepSeconds", plant.integrationStepSeconds(),
                    "must give at most " + MAX_SUB_STEPS_PER_SAMPLE + " sub-steps per sample at the sample period "
                    + samplePeriodSeconds + " (>= " + samplePeriodSeconds / MAX_SUB_STEPS_PER_SAMPLE + ")");
        }
        if (sampleCount() > MAX_SAMPLES) {
            throw new InvalidSettingException("durationSeconds", durationSeconds, "must give at most "
                    + MAX_SAMPLES + " samples at the sample period " + samplePeriodSeconds);
        }
        seed = b.seed;
        units = Objects.requireNonNull(b.units, "units");
    }

    private static <T> List<T> sorted(List<T> items, Comparator<T> order) {
        List<T> copy = new ArrayList<>(items);
        copy.sort(order);
        return List.copyOf(copy);
    }

    /** An empty builder: a plant, a controller and a duration are required; the rest has defaults. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder that starts from this scenario. */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.controller = controller;
        b.onOffController = onOffController;
        b.samplePeriodSeconds = samplePeriodSeconds;
        b.plant = plant;
        b.setpoint.addAll(setpoint);
        b.disturbances.addAll(disturbances);
        b.actuator = actuator;
        b.sensor = sensor;
        b.durationSeconds = durationSeconds;
        b.seed = seed;
        b.inner = inner;
        b.schedule = schedule;
        b.splitRange = splitRange;
        b.units = units;
        return b;
    }

    /**
     * A setpoint step from rest at t = 0 on a linear plant, with an ideal actuator and sensor.
     *
     * @param plant           the plant
     * @param settings        the PID settings (their sample period is the scenario's)
     * @param setpoint        the step's size, process units
     * @param durationSeconds how long to simulate
     */
    public static Scenario setpointStep(PlantModel plant, ControllerSettings settings, double setpoint,
            double durationSeconds) {
        return builder().plant(plant).controller(settings).setpoint(SetpointChange.step(0.0, setpoint))
                .durationSeconds(durationSeconds).build();
    }

    /**
     * A load step at t = 0 on a linear plant at rest, setpoint held at 0, ideal actuator and sensor:
     * the regulator's response to a disturbance.
     *
     * @param plant           the plant
     * @param settings        the PID settings
     * @param load            the step added to the plant input, input units
     * @param durationSeconds how long to simulate
     */
    public static Scenario loadStep(PlantModel plant, ControllerSettings settings, double load,
            double durationSeconds) {
        return builder().plant(plant).controller(settings).disturbance(new LoadStep(0.0, load))
                .durationSeconds(durationSeconds).build();
    }

    /** The PID settings, when the controller is a PID controller. */
    public Optional<ControllerSettings> controller() {
        return Optional.ofNullable(controller);
    }

    /** The inner loop, when this is a cascade (the controller is then the outer one). */
    public Optional<InnerLoop> inner() {
        return Optional.ofNullable(inner);
    }

    /** The gain schedule of a single loop's PID controller, when it has one. */
    public Optional<GainSchedule> schedule() {
        return Optional.ofNullable(schedule);
    }

    /** The split range of the controller that drives the actuator, when it has one. */
    public Optional<SplitRangeSpec> splitRange() {
        return Optional.ofNullable(splitRange);
    }

    /** The PID controller whose output drives the actuator: the inner one in a cascade. */
    public Optional<ControllerSettings> drivingController() {
        return inner != null ? Optional.of(inner.controller()) : Optional.ofNullable(controller);
    }

    /** The on-off settings, when the controller is an on-off controller. */
    public Optional<OnOffSettings> onOffController() {
        return Optional.ofNullable(onOffController);
    }

    /** This scenario with another PID controller (whose sample period becomes the scenario's). */
    public Scenario withController(ControllerSettings settings) {
        Builder b = toBuilder();
        b.onOffController = null;
        return b.controller(settings).build();
    }

    /** This scenario with another duration. */
    public Scenario withDuration(double seconds) {
        return toBuilder().durationSeconds(seconds).build();
    }

    /** This scenario with another plant. */
    public Scenario withPlant(PlantModel model) {
        return toBuilder().plant(model).build();
    }

    /** The sample period h in seconds: the inner controller's in a cascade, the fastest. */
    public double samplePeriodSeconds() {
        return samplePeriodSeconds;
    }

    /** The number of samples: at 0, h, 2h, … up to the duration. */
    public int sampleCount() {
        // the relative margin keeps 400 s / 0.1 s at 4001 samples despite rounding
        return (int) Math.min(Integer.MAX_VALUE, (long) Math.floor(durationSeconds / samplePeriodSeconds
                * (1.0 + 1e-12)) + 1L);
    }

    /** The plant model. */
    public PlantModel plant() {
        return plant;
    }

    /** The plant as a transfer function, when it is linear. */
    public Optional<TransferFunction> linearPlant() {
        return plant.linear();
    }

    /**
     * The linear part of this loop as it runs sampled (plant, PID controller at its period, the
     * sensor's whole samples of delay), for analysis; empty for a nonlinear plant or an on-off controller.
     */
    public Optional<SampledLoop> sampledLoop() {
        if (controller == null) {
            return Optional.empty();
        }
        return linearPlant().map(p -> new SampledLoop(p, controller, samplePeriodSeconds, sensor.delaySamples()));
    }

    /** The setpoint profile, sorted by time. */
    public List<SetpointChange> setpoint() {
        return setpoint;
    }

    /** The load steps, sorted by time. */
    public List<LoadStep> disturbances() {
        return disturbances;
    }

    /** The actuator. */
    public ActuatorModel actuator() {
        return actuator;
    }

    /** The sensor. */
    public SensorModel sensor() {
        return sensor;
    }

    /** How long to simulate, in seconds. */
    public double durationSeconds() {
        return durationSeconds;
    }

    /** @return the engineering units the scenario names, for axes, tables and CSV headers */
    public Units units() {
        return units;
    }

    /** The seed of every random stream (noise, dropouts, jitter). */
    public long seed() {
        return seed;
    }

    @Override
    public String toString() {
        return "Scenario[plant=" + plant + ", controller=" + (controller != null ? controller : onOffController)
                + ", h=" + samplePeriodSeconds + ", setpoint=" + setpoint + ", disturbances=" + disturbances
                + ", actuator=" + actuator + ", sensor=" + sensor + ", duration=" + durationSeconds + ", seed="
                + seed + (inner != null ? ", inner=" + inner : "") + (schedule != null ? ", schedule" : "")
                + (splitRange != null ? ", splitRange=" + splitRange : "") + "]";
    }

    /** Collects a scenario's parts; {@link #build()} validates them together. Not thread-safe. */
    public static final class Builder {
        private ControllerSettings controller;
        private OnOffSettings onOffController;
        private double samplePeriodSeconds = Double.NaN;
        private PlantModel plant;
        private final List<SetpointChange> setpoint = new ArrayList<>();
        private final List<LoadStep> disturbances = new ArrayList<>();
        private ActuatorModel actuator = ActuatorModel.IDEAL;
        private SensorModel sensor = SensorModel.IDEAL;
        private double durationSeconds = Double.NaN;
        private long seed = 1L;
        private InnerLoop inner;
        private GainSchedule schedule;
        private SplitRangeSpec splitRange;
        private Units units = Units.NONE;

        private Builder() {
        }

        /** The inner loop of a cascade (null for a single loop); the controller becomes the outer one. */
        public Builder inner(InnerLoop loop) {
            inner = loop;
            return this;
        }

        /** A gain schedule for a single loop's PID controller (null for none). */
        public Builder schedule(GainSchedule table) {
            schedule = table;
            return this;
        }

        /** A split range for the controller that drives the actuator (null for none). */
        public Builder splitRange(SplitRangeSpec split) {
            splitRange = split;
            return this;
        }

        /** The PID controller (replaces an on-off controller). */
        public Builder controller(ControllerSettings settings) {
            controller = Objects.requireNonNull(settings, "settings");
            onOffController = null;
            return this;
        }

        /** An on-off controller sampled every {@code periodSeconds} (replaces a PID controller). */
        public Builder onOffController(OnOffSettings settings, double periodSeconds) {
            onOffController = Objects.requireNonNull(settings, "settings");
            samplePeriodSeconds = periodSeconds;
            controller = null;
            return this;
        }

        /** The plant. */
        public Builder plant(PlantModel model) {
            plant = model;
            return this;
        }

        /** Adds setpoint profile entries. */
        public Builder setpoint(SetpointChange... changes) {
            setpoint.addAll(List.of(changes));
            return this;
        }

        /** Adds load steps. */
        public Builder disturbance(LoadStep... steps) {
            disturbances.addAll(List.of(steps));
            return this;
        }

        /** The actuator (default: ideal). */
        public Builder actuator(ActuatorModel model) {
            actuator = model;
            return this;
        }

        /** The sensor (default: ideal). */
        public Builder sensor(SensorModel model) {
            sensor = model;
            return this;
        }

        /** How long to simulate. */
        public Builder durationSeconds(double seconds) {
            durationSeconds = seconds;
            return this;
        }

        /** The random seed (default 1). */
        public Builder seed(long value) {
            seed = value;
            return this;
        }

        /** @param value the units the scenario names (default none) @return this builder */
        public Builder units(Units value) {
            units = value;
            return this;
        }

        /** The scenario, validated. */
        public Scenario build() {
            return new Scenario(this);
        }
    }
}
