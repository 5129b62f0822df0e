package org.loopwright.examples;

import java.io.PrintStream;
import java.util.Locale;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Fault;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.StateSnapshot;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.nonideal.Sensor;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.Plant;
import org.loopwright.sim.plant.ThermalZoneModel;

/**
 * A water bath heater held at 60 °C, in simulated time: a manual start-up at a fixed heater power,
 * a bumpless switch to automatic, a temperature probe that reads NaN for a few samples, and a warm
 * restart of the controller from a text snapshot.
 *
 * <p>The bath is a {@link ThermalZoneModel}: about 2 L of water (C = 8.4 kJ/K) losing 4 W/K to a
 * 20 °C room, heated by a 1 kW element that the controller drives 0–100 %. The probe reads with
 * 0.02 °C noise, 0.01 °C resolution and 5 s of lag. Every one of these numbers is invented for this
 * demonstration; none describes a real product. The PI gains (Kc = 21 %/°C, Ti = 160 s) follow the
 * SIMC rule (Skogestad, J. Process Control 13, 2003) for the bath seen as first order plus dead time
 * (K = 2.5 °C/%, T = 2100 s, θ = 5 s) with a gentle closed-loop time constant τc = 35 s, which keeps
 * the probe's noise off the heater: Kc = T/(K·(τc + θ)), Ti = min(T, 4·(τc + θ)).
 *
 * <p>What happens, one sample per second:
 * <ol>
 * <li>from 0 s the operator heats in manual at 50 %;</li>
 * <li>when the probe reads 55 °C the controller goes to automatic: its first output equals the last
 *     manual one;</li>
 * <li>from 1500 s the probe reads NaN for 5 samples: the fault policy holds the heater where it was,
 *     and the status shows the fault and counts it;</li>
 * <li>at 2000 s the device restarts: the controller's state is written to text, a new controller is
 *     built from the same settings and restored from that text, and its first output equals the
 *     last output before the restart.</li>
 * </ol>
 *
 * <p>Run it with {@code mvn -q -pl examples -am compile -Dexample=WaterBath} (an optional argument,
 * {@code -Dexec.args=3000}, sets the simulated duration in seconds).
 *
 * <p>Thread-safe: stateless; every run builds its own plant and controller.
 */
public final class WaterBath {

    /** The sample period, seconds. */
    public static final double SAMPLE_PERIOD_SECONDS = 1.0;
    /** The bath's setpoint, °C. */
    public static final double SETPOINT_CELSIUS = 60.0;
    /** The operator's heater power during the manual start-up, %. */
    public static final double MANUAL_PERCENT = 50.0;
    /** The probe reading at which the operator switches to automatic, °C. */
    public static final double SWITCH_AT_CELSIUS = 55.0;
    /** When the probe starts to read NaN, seconds. */
    public static final double DROPOUT_AT_SECONDS = 1500.0;
    /** How many samples the probe reads NaN. */
    public static final int DROPOUT_SAMPLES = 5;
    /** When the device restarts, seconds. */
    public static final double RESTART_AT_SECONDS = 2000.0;
    /** The simulated duration that {@link #main} runs when given none, seconds. */
    public static final double DEFAULT_DURATION_SECONDS = 3000.0;

    /** The invented bath: C = 8.4 kJ/K, G = 4 W/K, 20 °C room, 1 kW element, 1 s integration step. */
    public static final ThermalZoneModel BATH = new ThermalZoneModel(8_400.0, 4.0, 20.0, 1_000.0, 1.0);
    /** The invented probe: 0.02 °C noise, 0.01 °C resolution, 5 samples of lag. */
    public static final SensorModel PROBE = new SensorModel(0.02, 0.01, 5, 0.0, 0.0);

    private static final long PROBE_SEED = 7L;
    private static final int PRINT_EVERY_SAMPLES = 250;

    private WaterBath() {
    }

    /** The controller settings: PI, 0–100 % heater, back-calculation, hold the output on a bad sample. */
    public static ControllerSettings settings() {
        return ControllerSettings.builder()
                .gains(IdealGains.pi(21.0, 160.0))
                .samplePeriodSeconds(SAMPLE_PERIOD_SECONDS)
                .outputRange(0.0, 100.0)
                .windupProtection(WindupProtection.BACK_CALCULATION)
                .faultPolicy(FaultPolicy.HOLD, 0.0)
                .build();
    }

    /**
     * Runs the demonstration with the default duration, or the duration in seconds given as the
     * first argument, and prints what happens.
     */
    public static void main(String[] args) {
        double duration = DurationArgument.seconds(args, DEFAULT_DURATION_SECONDS);
        run(duration, System.out);
    }

    /**
     * Runs the demonstration for a simulated duration and prints a table and each event to
     * {@code out}. Events that fall after the duration do not happen.
     *
     * @param durationSeconds simulated time, &gt; 0
     * @param out             where the account goes
     * @return what happened, for a test to judge
     */
    public static Outcome run(double durationSeconds, PrintStream out) {
        if (!(durationSeconds > 0.0) || Double.isInfinite(durationSeconds)) {
            throw new IllegalArgumentException("duration must be finite and > 0: duration=" + durationSeconds);
        }
        SafetyNotice.print(out);
        ControllerSettings settings = settings();
        int samples = (int) Math.floor(durationSeconds / SAMPLE_PERIOD_SECONDS) + 1;
        long dropoutFrom = Math.round(DROPOUT_AT_SECONDS / SAMPLE_PERIOD_SECONDS);
        long restartAt = Math.round(RESTART_AT_SECONDS / SAMPLE_PERIOD_SECONDS);

        Plant bath = BATH.newPlant();
        Sensor probe = new Sensor(PROBE, PROBE_SEED);
        probe.reset(bath.output());
        PidController controller = new PidController(settings);
        controller.switchToManual();
        controller.manualOutput(MANUAL_PERCENT);

        double[] time = new double[samples];
        double[] temperature = new double[samples];
        double[] heater = new double[samples];
        Outcome.Builder outcome = new Outcome.Builder();

        out.printf(Locale.ROOT, "Water bath: setpoint %.1f °C, heater %.0f W, sample period %.1f s%n",
                SETPOINT_CELSIUS, BATH.maxPowerWatts(), SAMPLE_PERIOD_SECONDS);
        out.println("    time s   probe °C   bath °C   heater %   mode        fault                   faults");
        for (int k = 0; k < samples; k++) {
            double t = k * SAMPLE_PERIOD_SECONDS;
            if (k > 0) {
                bath.advance(watts(heater[k - 1]), SAMPLE_PERIOD_SECONDS);
            }
            double reading = probe.read(bath.output());
            boolean probeFailed = k >= dropoutFrom && k < dropoutFrom + DROPOUT_SAMPLES;
            if (probeFailed) {
                reading = Double.NaN; // the probe's cable is loose
            }

            if (k > 0 && controller.mode() == Mode.MANUAL && reading >= SWITCH_AT_CELSIUS) {
                controller.switchToAutomatic();
                outcome.switchSeconds = t;
                outcome.lastManualPercent = heater[k - 1];
            }
            if (k == restartAt) {
                String text = controller.snapshot().toText();
                outcome.snapshotText = text;
                outcome.beforeRestartPercent = heater[k - 1];
                outcome.coldStartPercent = new PidController(settings).update(SETPOINT_CELSIUS, reading);
                controller = new PidController(settings);
                controller.restore(StateSnapshot.parse(text));
            }

            heater[k] = controller.update(SETPOINT_CELSIUS, reading);
            time[k] = t;
            temperature[k] = bath.output();

            if (t == outcome.switchSeconds) {
                outcome.firstAutomaticPercent = heater[k];
                out.printf(Locale.ROOT, "  -> %.0f s: probe reads %.2f °C, switch to automatic: last manual output"
                        + " %.3f %%, first automatic output %.3f %%%n", t, reading, outcome.lastManualPercent,
                        heater[k]);
            }
            if (k == dropoutFrom - 1) {
                outcome.heldPercent = heater[k];
            }
            if (probeFailed) {
                outcome.dropoutFault = controller.fault();
                outcome.maxDropoutDeviationPercent = Math.max(outcome.maxDropoutDeviationPercent,
                        Math.abs(heater[k] - outcome.heldPercent));
                printRow(out, t, reading, temperature[k], heater[k], controller);
            } else if (k == dropoutFrom + DROPOUT_SAMPLES) {
                out.printf(Locale.ROOT, "  -> the probe is back: fault %s, fault count %d%n", controller.fault(),
                        controller.faultCount());
            }
            if (k == restartAt) {
                outcome.afterRestartPercent = heater[k];
                out.printf(Locale.ROOT, "  -> %.0f s: warm restart from a %d-line snapshot; output before %.3f %%,"
                        + " after %.3f %% (a cold start would have output %.3f %%)%n", t,
                        outcome.snapshotText.lines().count(), outcome.beforeRestartPercent, heater[k],
                        outcome.coldStartPercent);
                outcome.snapshotText.lines().forEach(line -> out.println("       | " + line));
            }
            if (!probeFailed && (k % PRINT_EVERY_SAMPLES == 0 || k == samples - 1)) {
                printRow(out, t, reading, temperature[k], heater[k], controller);
            }
        }
        outcome.faultCount = controller.faultCount();
        out.printf(Locale.ROOT, "Energy balance: holding %.1f °C takes G·(T − T_room) = %.1f W, %.1f %% of the"
                + " element%n", SETPOINT_CELSIUS, steadyWatts(), steadyHeaterPercent());
        return outcome.build(time, temperature, heater);
    }

    /** The heater power that holds the setpoint once settled: G·(T − T_room), in % of the element. */
    public static double steadyHeaterPercent() {
        return 100.0 * steadyWatts() / BATH.maxPowerWatts();
    }

    private static double steadyWatts() {
        return BATH.lossWattsPerKelvin() * (SETPOINT_CELSIUS - BATH.ambientCelsius());
    }

    private static double watts(double heaterPercent) {
        return heaterPercent / 100.0 * BATH.maxPowerWatts();
    }

    private static void printRow(PrintStream out, double t, double reading, double temperature, double heater,
            PidController controller) {
        out.printf(Locale.ROOT, "  %8.0f   %8.2f   %7.2f   %8.3f   %-10s  %-22s  %6d%n", t, reading, temperature,
                heater, controller.mode(), controller.fault(), controller.faultCount());
    }

    /**
     * What a run showed. Times are seconds, temperatures °C, heater outputs % of the element. A value
     * whose event fell after the end of the run is NaN (or null, or {@link Fault#NONE}).
     *
     * @param switchSeconds              when the controller went to automatic
     * @param lastManualPercent          the last output in manual
     * @param firstAutomaticPercent      the first output in automatic
     * @param heldPercent                the output just before the probe failed
     * @param maxDropoutDeviationPercent the largest distance of an output during the failure from the held one
     * @param dropoutFault               the controller's fault status during the failure
     * @param faultCount                 faulty samples counted by the end (carried across the restart)
     * @param snapshotText               the state written at the restart
     * @param beforeRestartPercent       the last output before the restart
     * @param afterRestartPercent        the restored controller's first output
     * @param coldStartPercent           what a controller without the snapshot would have output instead
     * @param timeSeconds                the sample instants
     * @param bathCelsius                the true bath temperature at each sample
     * @param heaterPercent              the controller output at each sample
     */
    public record Outcome(double switchSeconds, double lastManualPercent, double firstAutomaticPercent,
            double heldPercent, double maxDropoutDeviationPercent, Fault dropoutFault, long faultCount,
            String snapshotText, double beforeRestartPercent, double afterRestartPercent, double coldStartPercent,
            double[] timeSeconds, double[] bathCelsius, double[] heaterPercent) {

        /** Copies the arrays. */
        public Outcome {
            timeSeconds = timeSeconds.clone();
            bathCelsius = bathCelsius.clone();
            heaterPercent = heaterPercent.clone();
        }

        /** A copy of the sample instants. */
        @Override
        public double[] timeSeconds() {
            return timeSeconds.clone();
        }

        /** A copy of the bath temperatures. */
        @Override
        public double[] bathCelsius() {
            return bathCelsius.clone();
        }

        /** A copy of the heater outputs. */
        @Override
        public double[] heaterPercent() {
            return heaterPercent.clone();
        }

        @Override
        public String toString() {
            return "Outcome[switch at " + switchSeconds + " s: " + lastManualPercent + " % -> " + firstAutomaticPercent
                    + " %; held " + heldPercent + " % (" + dropoutFault + ", " + faultCount + " faults); restart "
                    + beforeRestartPercent + " % -> " + afterRestartPercent + " %; " + timeSeconds.length + " samples]";
        }

        /** Collects the events as they happen. */
        private static final class Builder {
            private double switchSeconds = Double.NaN;
            private double lastManualPercent = Double.NaN;
            private double firstAutomaticPercent = Double.NaN;
            private double heldPercent = Double.NaN;
            private double maxDropoutDeviationPercent;
            private Fault dropoutFault = Fault.NONE;
            private long faultCount;
            private String snapshotText;
            private double beforeRestartPercent = Double.NaN;
            private double afterRestartPercent = Double.NaN;
            private double coldStartPercent = Double.NaN;

            Outcome build(double[] time, double[] bath, double[] heater) {
                return new Outcome(switchSeconds, lastManualPercent, firstAutomaticPercent, heldPercent,
                        maxDropoutDeviationPercent, dropoutFault, faultCount, snapshotText, beforeRestartPercent,
                        afterRestartPercent, coldStartPercent, time, bath, heater);
            }
        }
    }
}
