package org.loopwright.sim.design;

import java.nio.file.Path;
import java.util.Locale;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.PidGains;
import org.loopwright.pid.tuning.IntegratingModel;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.scenario.PlantBlock;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;

/**
 * The closed-loop experiment every candidate is checked with, and the settings it runs: a setpoint
 * step at t = 0, a load step once the loop has settled, the device's output limits and slew, the
 * sensor delay — written as scenario text and read back through {@link ScenarioFile}, so the
 * candidate's figures are those of {@code simulate}, {@code margins} and {@code sweep} on the written
 * {@code scenario.yaml} by construction.
 *
 * <p>The model is linear and at rest at zero, so the scenario is in deviation from the operating
 * point: the output u0 (the step test's initial input when it lies within the limits, else the middle
 * of the output range, else 0) and the measurement there; the output limits are shifted by −u0. Our
 * choices, so that the loop works within its range: the output moves 10 % of its span (of the step
 * test's input change without a range, 1 without either) towards the side with more room for the
 * setpoint step, and the load step asks it to move as much again; the setpoint step is the
 * measurement change that output change makes (for an integrating process, in 2·(L + T) seconds).
 * The load step comes at 10·(L + ΣT) (40·(L + T) for an integrating process) and the run lasts twice
 * that.
 *
 * <p>Thread-safe: immutable.
 */
public final class DesignExperiment {

    /** The share of the output span each step asks for. */
    public static final double STEP_SHARE = 0.1;
    /** The most samples one simulation may take (bounded work for the sweep). */
    public static final int MAX_SAMPLES = 100_000;
    /** The most sample periods of dead time (plant and sensor) the sampled-loop analysis takes. */
    public static final int MAX_DELAY_PERIODS = 100;

    private final DesignModel model;
    private final DesignSpec spec;
    private final double operatingOutput;
    private final double outputStep;
    private final double setpointStep;
    private final double loadAtSeconds;
    private final double durationSeconds;

    private DesignExperiment(DesignModel model, DesignSpec spec) {
        this.model = model;
        this.spec = spec;
        double min = spec.outputMin();
        double max = spec.outputMax();
        double testInput = model.fit().map(f -> f.step().initialInput()).orElse(Double.NaN);
        double u0;
        if (!Double.isNaN(testInput) && testInput >= min && testInput <= max) {
            u0 = testInput;
        } else if (spec.hasOutputRange()) {
            u0 = 0.5 * (min + max);
        } else {
            u0 = Math.min(Math.max(0.0, min), max);
        }
        operatingOutput = u0;
        double span = spec.hasOutputRange() ? max - min
                : model.fit().map(f -> Math.abs(f.step().change()) / STEP_SHARE).orElse(1.0 / STEP_SHARE);
        double direction = max - u0 >= u0 - min ? 1.0 : -1.0;
        outputStep = direction * STEP_SHARE * span;
        double lag = model.model() instanceof IntegratingModel m ? m.lagSeconds() : 0.0;
        boolean integrating = model.model() instanceof IntegratingModel;
        setpointStep = model.model().processGain() * outputStep
                * (integrating ? 2.0 * (model.model().deadTimeSeconds() + lag) : 1.0);
        loadAtSeconds = (integrating ? 40.0 : 10.0) * model.timeScaleSeconds();
        durationSeconds = 2.0 * loadAtSeconds;
    }

    /**
     * The experiment for a model and a specification.
     *
     * @throws InputException naming {@code --sample-period} when the runs would take more
     *                                  than {@value #MAX_SAMPLES} samples or the delay more than
     *                                  {@value #MAX_DELAY_PERIODS} periods, or when the model has no
     *                                  time scale (a pure integrator without dead time)
     */
    public static DesignExperiment of(DesignModel model, DesignSpec spec) {
        double h = spec.samplePeriodSeconds();
        if (!(model.timeScaleSeconds() > 0.0)) {
            throw new InputException("a pure integrator without dead time has no time scale to design for:"
                    + " --dead-time=0.0");
        }
        DesignExperiment e = new DesignExperiment(model, spec);
        double samples = e.durationSeconds / h;
        if (samples > MAX_SAMPLES) {
            throw new InputException(String.format(Locale.ROOT, "--sample-period is too short for the"
                    + " model's time scale (%.4g s): each check would simulate %.0f samples, at most %d:"
                    + " --sample-period=%s", model.timeScaleSeconds(), samples, MAX_SAMPLES, h));
        }
        double delayPeriods = model.model().deadTimeSeconds() / h + spec.sensorDelaySamples();
        if (delayPeriods > MAX_DELAY_PERIODS) {
            throw new InputException(String.format(Locale.ROOT, "--sample-period is too short for the dead"
                    + " time: L/h + sensor delay = %.4g periods, the sampled-loop analysis takes at most %d:"
                    + " --sample-period=%s", delayPeriods, MAX_DELAY_PERIODS, h));
        }
        return e;
    }

    /** The settings to load on the device: these gains with the specification's period, limits and methods. */
    public ControllerSettings deviceSettings(PidGains gains) {
        return ControllerSettings.builder().gains(gains).samplePeriodSeconds(spec.samplePeriodSeconds())
                .outputRange(spec.outputMin(), spec.outputMax()).outputSlewPerSecond(spec.outputSlewPerSecond())
                .integralMethod(spec.integralMethod()).derivativeMethod(spec.derivativeMethod())
                .action(model.model().processGain() < 0.0 ? org.loopwright.pid.Action.DIRECT
                        : org.loopwright.pid.Action.REVERSE)
                .build();
    }

    /** The device's settings in deviation from the operating point: the output limits shifted by −u0. */
    public ControllerSettings simulatedSettings(PidGains gains) {
        ControllerSettings device = deviceSettings(gains);
        return device.toBuilder().outputRange(spec.outputMin() - operatingOutput, spec.outputMax() - operatingOutput)
                .build();
    }

    /** The scenario text for these settings (in deviation from the operating point). */
    public String scenarioText(ControllerSettings simulated) {
        StringBuilder text = new StringBuilder();
        text.append("# Written by loopwright design. The plant is the model, linear and at rest at zero, so every\n")
                .append("# value here is a deviation from the operating point: controller output ")
                .append(operatingOutput).append(model.fit().map(f -> ", measurement " + f.baseline()).orElse(""))
                .append(".\n");
        if (operatingOutput != 0.0 && (Double.isFinite(spec.outputMin()) || Double.isFinite(spec.outputMax()))) {
            text.append("# The output limits ").append(spec.outputMin()).append(" .. ").append(spec.outputMax())
                    .append(" of controller.yaml are shifted by ").append(-operatingOutput).append(" here.\n");
        }
        text.append("controller:\n");
        for (String line : ControllerFile.toYaml(simulated).split("\n")) {
            if (!line.startsWith("#")) {
                text.append("  ").append(line).append('\n');
            }
        }
        text.append(PlantBlock.yaml(model.model()));
        text.append("setpoint: [{at: 0.0, value: ").append(setpointStep).append("}]\n");
        text.append("disturbances: [{at: ").append(loadAtSeconds).append(", value: ").append(-outputStep)
                .append("}]   # a load the output must make up for\n");
        if (spec.sensorDelaySamples() > 0) {
            text.append("sensor: {delay-samples: ").append(spec.sensorDelaySamples()).append("}\n");
        }
        text.append("duration: ").append(durationSeconds).append('\n');
        return text.toString();
    }

    /** The scenario the text describes, read as {@code simulate} reads the file. */
    public static Scenario scenario(String text) {
        return ScenarioFile.read(YamlDocument.parse("scenario.yaml", text), Path.of(""));
    }

    /** u0, the output at the operating point. */
    public double operatingOutput() {
        return operatingOutput;
    }

    /** The setpoint step, measurement units. */
    public double setpointStep() {
        return setpointStep;
    }

    /** The load step added to the plant input (the negative of the output change it asks for). */
    public double loadStep() {
        return -outputStep;
    }

    /** When the load step comes, seconds. */
    public double loadAtSeconds() {
        return loadAtSeconds;
    }

    /** How long each run lasts, seconds. */
    public double durationSeconds() {
        return durationSeconds;
    }
}
