package org.loopwright.sim.tuning;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.PidController;
import org.loopwright.pid.tuning.RelayExperiment;
import org.loopwright.pid.tuning.RelaySettings;
import org.loopwright.pid.tuning.RelayStatus;
import org.loopwright.sim.nonideal.Actuator;
import org.loopwright.sim.nonideal.Sensor;
import org.loopwright.sim.plant.Plant;
import org.loopwright.sim.scenario.Scenario;

/**
 * Runs pid-core's {@link RelayExperiment} on a scenario's plant in simulation, the way it would run
 * on the device: first the scenario's own PID controller holds the setpoint (the last value of the
 * scenario's setpoint profile, or the plant's rest value) for the scenario's duration; its last
 * output becomes the relay's bias and the output restored afterwards; then the relay drives the
 * plant through the scenario's actuator and sensor at the controller's sample period. Sample
 * jitter and load steps are not applied during the experiment.
 *
 * <p>Defaults (ours): relay amplitude d = 10 % of the controller's output range when it is finite,
 * else 10 % of |bias| (1 when the bias is 0), reduced so that bias ± d stays inside the range;
 * hysteresis ε = 3σ of the sensor noise, or the quantisation step when larger (common practice:
 * the hysteresis must exceed the noise band, or the relay chatters); excursion limit 25 % of |setpoint|
 * (1 at setpoint 0); timeout 20 scenario durations; the relay must switch at least once per
 * scenario duration.
 *
 * <p>Thread-safe: stateless.
 */
public final class RelaySimulation {

    /** Timeout of the experiment, in scenario durations. */
    public static final double TIMEOUT_DURATIONS = 20.0;

    private RelaySimulation() {
    }

    /**
     * What the experiment found.
     *
     * @param status                how it ended
     * @param message               the experiment's own account
     * @param ultimateGain          Ku, NaN unless it succeeded
     * @param ultimatePeriodSeconds Pu, NaN unless it succeeded
     * @param amplitude             a, NaN unless it succeeded
     * @param cycles                complete relay cycles seen
     * @param settings              the relay settings used
     * @param samplePeriodSeconds   the period the relay ran at
     */
    public record Outcome(RelayStatus status, String message, double ultimateGain, double ultimatePeriodSeconds,
                          double amplitude, int cycles, RelaySettings settings, double samplePeriodSeconds) {

        /**
         * Whether the measured period is within {@value RelaySimulation#MIN_SAMPLES_PER_PERIOD} sample
         * periods: then it is set by the sampling, not the plant, and no rule may use it.
         */
        public boolean periodSetBySampling() {
            return status == RelayStatus.SUCCEEDED
                    && ultimatePeriodSeconds < MIN_SAMPLES_PER_PERIOD * samplePeriodSeconds;
        }

        /**
         * Doubts about a successful estimate: an amplitude below twice the hysteresis makes
         * √(a² − ε²) sensitive to noise, and such a small swing usually means the plant has too little
         * phase lag (first order, no dead time) for the relay to find a true ultimate point.
         */
        public List<String> warnings() {
            List<String> doubts = new ArrayList<>();
            if (periodSetBySampling()) {
                doubts.add(String.format(Locale.ROOT, "the measured period %.4g s is only %.3g sample periods (h = %s s),"
                        + " fewer than %d: it is set by the sampling, not the plant, so no setting is suggested;"
                        + " sample faster or add the plant's dead time to the model", ultimatePeriodSeconds,
                        ultimatePeriodSeconds / samplePeriodSeconds, samplePeriodSeconds, MIN_SAMPLES_PER_PERIOD));
            }
            if (status == RelayStatus.SUCCEEDED && amplitude < HYSTERESIS_MARGIN * settings.hysteresis()) {
                doubts.add("the oscillation amplitude " + String.format(Locale.ROOT, "%.4g", amplitude)
                        + " is less than twice the hysteresis " + String.format(Locale.ROOT, "%.4g", settings.hysteresis())
                        + ": the ultimate gain is unreliable; a plant with little phase lag (first order, no dead time)"
                        + " has no true ultimate point");
            }
            return doubts;
        }
    }

    /**
     * The fewest sample periods a measured relay period may span. Below it the period is quantised to
     * whole samples (an error up to h/Pu, over 10 %) and the hold's delay of about h/2 is a large part
     * of the phase lag that makes the loop oscillate: a relay on a lag with no dead time swings at 2 to
     * 4 samples a cycle whatever the plant's time constant (Åström &amp; Wittenmark, Computer-Controlled
     * Systems, 3rd ed., §7 on the hold as a delay of h/2; the threshold of ten is common practice).
     */
    public static final int MIN_SAMPLES_PER_PERIOD = 10;

    /** An amplitude below this multiple of the hysteresis makes the estimate doubtful. */
    public static final double HYSTERESIS_MARGIN = 2.0;

    /**
     * Runs the experiment.
     *
     * @param scenario        the scenario; it must have a PID controller
     * @param relayAmplitude  d, or NaN for the default
     * @param hysteresis      ε, or NaN for the default
     * @param excursionLimit  the safety band around the setpoint, or NaN for the default
     * @throws InvalidSettingException when the scenario has no PID controller or the relay settings
     *                                 are not allowed (named by field)
     */
    public static Outcome run(Scenario scenario, double relayAmplitude, double hysteresis, double excursionLimit) {
        ControllerSettings base = scenario.controller().orElseThrow(() -> new InvalidSettingException("controller",
                "on-off", "must be a PID controller for autotune (its sample period and output range are used)"));
        double h = scenario.samplePeriodSeconds();
        Plant plant = scenario.plant().newPlant();
        Actuator actuator = new Actuator(scenario.actuator());
        Sensor sensor = new Sensor(scenario.sensor(), scenario.seed());
        sensor.reset(plant.output());
        double setpoint = scenario.setpoint().isEmpty() ? plant.output()
                : scenario.setpoint().get(scenario.setpoint().size() - 1).value();

        PidController holding = new PidController(base);
        double bias = 0.0;
        for (long k = 0; k * h < scenario.durationSeconds(); k++) {
            bias = holding.update(setpoint, sensor.read(plant.output()));
            plant.advance(actuator.deliver(bias, h), h);
        }

        double d = Double.isNaN(relayAmplitude) ? defaultAmplitude(base, bias) : relayAmplitude;
        double epsilon = Double.isNaN(hysteresis)
                ? Math.max(3.0 * scenario.sensor().noiseStdDev(), scenario.sensor().quantisationStep()) : hysteresis;
        double band = Double.isNaN(excursionLimit) ? (setpoint == 0.0 ? 1.0 : 0.25 * Math.abs(setpoint)) : excursionLimit;
        RelaySettings settings = RelaySettings.builder().setpoint(setpoint).bias(bias).relayAmplitude(d)
                .hysteresis(epsilon).excursionLimit(band).action(base.action())
                .timeoutSeconds(TIMEOUT_DURATIONS * scenario.durationSeconds())
                .maxHalfPeriodSeconds(scenario.durationSeconds()).build();
        RelayExperiment relay = new RelayExperiment(settings, bias);
        double output = relay.step(h, sensor.read(plant.output()));
        while (!relay.status().finished()) {
            plant.advance(actuator.deliver(output, h), h);
            output = relay.step(h, sensor.read(plant.output()));
        }
        return new Outcome(relay.status(), relay.message(), relay.ultimateGain(), relay.ultimatePeriodSeconds(),
                relay.oscillationAmplitude(), relay.completedCycles(), settings, h);
    }

    private static double defaultAmplitude(ControllerSettings base, double bias) {
        double min = base.outputMin();
        double max = base.outputMax();
        double d = Double.isFinite(max - min) ? 0.1 * (max - min) : bias == 0.0 ? 1.0 : 0.1 * Math.abs(bias);
        return Math.min(d, Math.min(bias - min, max - bias));
    }
}
