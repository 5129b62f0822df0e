package org.loopwright.examples;

import java.io.PrintStream;
import java.util.Locale;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.plant.Plant;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.simulate.Simulation;

/**
 * A booster pump holding its discharge pressure at 4 bar while the demand flow steps, in simulated
 * time, run twice: with feedback alone, and with feedforward from the measured demand added. The
 * drive's speed command is slew-limited to 25 %/s, as a variable-speed drive's ramp would be.
 *
 * <p>The pump: pressure responds to the drive command (0–100 %) as
 * 0.06 bar/% · e^(−0.2 s) / ((2 s·s + 1)(0.4 s·s + 1)), and every m³/h drawn lowers it by as much as
 * 0.8 % of drive would raise it (the demand enters at the pump's input, as a load). The demand is
 * 10 m³/h, steps to 30 m³/h at 30.05 s and back to 15 m³/h at 60.05 s. The pump starts at rest and
 * the setpoint ramps from 0 to 4 bar over the first 10 s (a soft start). Every one of these numbers is
 * invented for this demonstration; none describes a real pump. The PI gains (Kc = 30 %/bar,
 * Ti = 2.2 s) follow the SIMC rule (Skogestad, J. Process Control 13, 2003) for the half-rule
 * first-order-plus-dead-time model (K = 0.06 bar/%, T = 2.2 s, θ = 0.4 s) with τc = 2θ:
 * Kc = T/(K·(τc + θ)) ≈ 30.6, rounded to 30, and Ti = min(T, 4·(τc + θ)) = 2.2 s.
 *
 * <p>The feedforward is the static inverse of the load: 0.8 % of drive per m³/h measured. The IAE
 * after the first demand step is measured as the simulation harness's
 * {@link ResponseMetrics#loadIae} measures it; the run without feedforward is also run through the
 * harness itself ({@link Simulation}) and both figures are printed, which shows that this program's
 * loop is the harness's loop. (The harness has no feedforward input, so the loop with feedforward is
 * stepped here, in the harness's sampled-data order.)
 *
 * <p>Run it with {@code mvn -q -pl examples -am compile -Dexample=BoosterPump} (an optional argument,
 * {@code -Dexec.args=90}, sets the simulated duration in seconds).
 *
 * <p>Thread-safe: stateless; every run builds its own plant and controller.
 */
public final class BoosterPump {

    /** The sample period, seconds. */
    public static final double SAMPLE_PERIOD_SECONDS = 0.1;
    /** The discharge pressure setpoint, bar. */
    public static final double SETPOINT_BAR = 4.0;
    /** How long the soft start ramps the setpoint from 0 bar to the setpoint, seconds. */
    public static final double SOFT_START_SECONDS = 10.0;
    /** The drive's slew limit, % per second. */
    public static final double DRIVE_SLEW_PERCENT_PER_SECOND = 25.0;
    /** The invented pump: pressure in bar from the drive command in %. */
    public static final TransferFunction PUMP = TransferFunction.sopdt(0.06, 2.0, 0.4, 0.2);
    /** The drive, in %, whose pressure one m³/h of demand takes away. */
    public static final double DRIVE_PERCENT_PER_FLOW = 0.8;
    /** When the demand changes, seconds. */
    public static final double[] DEMAND_AT_SECONDS = {0.0, 30.05, 60.05};
    /** The demand from each of those instants on, m³/h. */
    public static final double[] DEMAND_CUBIC_METRES_PER_HOUR = {10.0, 30.0, 15.0};
    /** The simulated duration that {@link #main} runs when given none, seconds. */
    public static final double DEFAULT_DURATION_SECONDS = 90.0;

    private static final double PRINT_EVERY_SECONDS = 3.0;
    private static final double RECOVERED_WITHIN_BAR = 0.04;

    private BoosterPump() {
    }

    /** The controller settings: PI, drive 0–100 % with a 25 %/s slew limit, back-calculation. */
    public static ControllerSettings settings() {
        return ControllerSettings.builder()
                .gains(IdealGains.pi(30.0, 2.2))
                .samplePeriodSeconds(SAMPLE_PERIOD_SECONDS)
                .outputRange(0.0, 100.0)
                .outputSlewPerSecond(DRIVE_SLEW_PERCENT_PER_SECOND)
                .windupProtection(WindupProtection.BACK_CALCULATION)
                .build();
    }

    /**
     * The run without feedforward as a harness scenario: the setpoint ramps to 4 bar over the first
     * 10 s and each demand is a load of −0.8 %/(m³/h) on the pump's input.
     *
     * @param durationSeconds simulated time
     * @return the scenario, for {@link Simulation#run}
     */
    public static Scenario scenarioWithoutFeedforward(double durationSeconds) {
        Scenario.Builder b = Scenario.builder().plant(PUMP).controller(settings())
                .setpoint(new SetpointChange(0.0, SETPOINT_BAR, SOFT_START_SECONDS)).durationSeconds(durationSeconds);
        for (int i = 0; i < DEMAND_AT_SECONDS.length; i++) {
            b.disturbance(new LoadStep(DEMAND_AT_SECONDS[i], load(DEMAND_CUBIC_METRES_PER_HOUR[i])));
        }
        return b.build();
    }

    /**
     * Runs the comparison with the default duration, or the duration in seconds given as the first
     * argument, and prints it.
     */
    public static void main(String[] args) {
        double duration = DurationArgument.seconds(args, DEFAULT_DURATION_SECONDS);
        run(duration, System.out);
    }

    /**
     * Runs the pump without and with feedforward for a simulated duration and prints a side-by-side
     * table and the figures of merit to {@code out}.
     *
     * @param durationSeconds simulated time, &gt; the first demand step (30.05 s), finite
     * @param out             where the account goes
     * @return both responses, for a test to judge
     */
    public static Outcome run(double durationSeconds, PrintStream out) {
        if (!(durationSeconds > DEMAND_AT_SECONDS[1]) || Double.isInfinite(durationSeconds)) {
            throw new IllegalArgumentException("duration must be finite and > " + DEMAND_AT_SECONDS[1]
                    + " (the first demand step): duration=" + durationSeconds);
        }
        SafetyNotice.print(out);
        Response feedback = simulate(durationSeconds, false);
        Response withFeedforward = simulate(durationSeconds, true);
        double harnessIae = ResponseMetrics.loadIae(Simulation.run(scenarioWithoutFeedforward(durationSeconds)),
                DEMAND_AT_SECONDS[1]);

        out.printf(Locale.ROOT, "Booster pump: setpoint %.1f bar, drive slew limit %.0f %%/s, sample period %.1f s%n",
                SETPOINT_BAR, DRIVE_SLEW_PERCENT_PER_SECOND, SAMPLE_PERIOD_SECONDS);
        out.println("                        feedback only          with feedforward");
        out.println("   time s   demand m³/h   pressure bar  drive %   pressure bar  drive %");
        double[] time = feedback.timeSeconds;
        int every = (int) Math.round(PRINT_EVERY_SECONDS / SAMPLE_PERIOD_SECONDS);
        for (int k = 0; k < time.length; k++) {
            if (k % every == 0 || k == time.length - 1) {
                out.printf(Locale.ROOT, "  %6.1f   %11.1f   %12.3f  %7.2f   %12.3f  %7.2f%n", time[k],
                        feedback.demandCubicMetresPerHour[k], feedback.pressureBar[k], feedback.drivePercent[k],
                        withFeedforward.pressureBar[k], withFeedforward.drivePercent[k]);
            }
        }
        out.printf(Locale.ROOT, "From the first demand step (%.2f s) on:%n", DEMAND_AT_SECONDS[1]);
        print(out, "feedback only   ", feedback);
        print(out, "with feedforward", withFeedforward);
        out.printf(Locale.ROOT, "  (the simulation harness, running the feedback-only scenario itself, measures"
                + " IAE %.4f bar·s)%n", harnessIae);
        return new Outcome(feedback, withFeedforward, harnessIae);
    }

    private static void print(PrintStream out, String name, Response r) {
        StringBuilder recovery = new StringBuilder();
        for (double seconds : r.recoverySeconds) {
            recovery.append(recovery.length() == 0 ? "" : ", ")
                    .append(Double.isNaN(seconds) ? "not recovered" : String.format(Locale.ROOT, "%.1f s", seconds));
        }
        out.printf(Locale.ROOT, "  %s: IAE %.4f bar·s, peak deviation %.3f bar, back within ±%.2f bar after %s%n",
                name, r.iaeBarSeconds, r.peakDeviationBar, RECOVERED_WITHIN_BAR, recovery);
    }

    /**
     * One closed loop, stepped in the harness's sampled-data order (see
     * {@link org.loopwright.sim.simulate.ClosedLoop}): advance the pump to the sample instant with the
     * last drive command held (splitting the interval at a demand step), read the pressure and the
     * demand, update, hold the new command.
     */
    private static Response simulate(double durationSeconds, boolean feedforward) {
        int samples = Scenario.builder().plant(PUMP).controller(settings()).durationSeconds(durationSeconds)
                .build().sampleCount();
        Plant pump = PUMP.newPlant();
        PidController controller = new PidController(settings());
        controller.feedforwardOn(feedforward);
        double[] time = new double[samples];
        double[] pressure = new double[samples];
        double[] drive = new double[samples];
        double[] demand = new double[samples];
        int nextChange = 0;
        double flow = 0.0;
        double held = 0.0;
        double previousInstant = 0.0;
        for (int k = 0; k < samples; k++) {
            double t = k * SAMPLE_PERIOD_SECONDS;
            double from = previousInstant;
            double left = SAMPLE_PERIOD_SECONDS;
            while (nextChange < DEMAND_AT_SECONDS.length && DEMAND_AT_SECONDS[nextChange] <= t) {
                double piece = DEMAND_AT_SECONDS[nextChange] - from;
                if (k > 0 && piece > 0.0) {
                    pump.advance(held + load(flow), piece);
                    left -= piece;
                    from = DEMAND_AT_SECONDS[nextChange];
                }
                flow = DEMAND_CUBIC_METRES_PER_HOUR[nextChange++];
            }
            if (k > 0) {
                pump.advance(held + load(flow), left);
            }
            previousInstant = t;
            // the flow meter reads the demand; the feedforward cancels its load at the pump's input
            controller.feedforward(DRIVE_PERCENT_PER_FLOW * flow);
            held = controller.update(setpointAt(t), pump.output());
            time[k] = t;
            pressure[k] = pump.output();
            drive[k] = held;
            demand[k] = flow;
        }
        return new Response(time, pressure, drive, demand);
    }

    /** The soft start: a ramp from 0 bar, computed as the harness computes its setpoint ramps. */
    private static double setpointAt(double t) {
        return t >= SOFT_START_SECONDS ? SETPOINT_BAR : SETPOINT_BAR * t / SOFT_START_SECONDS;
    }

    private static double load(double cubicMetresPerHour) {
        return -DRIVE_PERCENT_PER_FLOW * cubicMetresPerHour;
    }

    /**
     * Both runs and the harness's IAE of the feedback-only scenario.
     *
     * @param feedbackOnly         the run with feedback alone
     * @param withFeedforward      the run with feedforward from the measured demand
     * @param harnessIaeBarSeconds ∫|r − p|dt from the first demand step, as the harness measures the
     *                             feedback-only scenario it ran itself, bar·s
     */
    public record Outcome(Response feedbackOnly, Response withFeedforward, double harnessIaeBarSeconds) {
    }

    /**
     * One run's samples and its figures of merit after the first demand step.
     *
     * <p>Thread-safe: immutable (the accessors return copies).
     */
    public static final class Response {
        private final double[] timeSeconds;
        private final double[] pressureBar;
        private final double[] drivePercent;
        private final double[] demandCubicMetresPerHour;
        private final double iaeBarSeconds;
        private final double peakDeviationBar;
        private final double[] recoverySeconds;

        Response(double[] timeSeconds, double[] pressureBar, double[] drivePercent,
                double[] demandCubicMetresPerHour) {
            this.timeSeconds = timeSeconds;
            this.pressureBar = pressureBar;
            this.drivePercent = drivePercent;
            this.demandCubicMetresPerHour = demandCubicMetresPerHour;
            int first = firstSampleAtOrAfter(DEMAND_AT_SECONDS[1]);
            double iae = 0.0;
            double peak = 0.0;
            for (int k = first; k < timeSeconds.length; k++) {
                double error = Math.abs(SETPOINT_BAR - pressureBar[k]);
                if (k + 1 < timeSeconds.length) {
                    // each sample's error held until the next, as ResponseMetrics.loadIae integrates it
                    iae += error * (timeSeconds[k + 1] - timeSeconds[k]);
                }
                peak = Math.max(peak, error);
            }
            this.iaeBarSeconds = iae;
            this.peakDeviationBar = peak;
            int steps = 0;
            while (steps + 1 < DEMAND_AT_SECONDS.length
                    && DEMAND_AT_SECONDS[steps + 1] <= timeSeconds[timeSeconds.length - 1]) {
                steps++;
            }
            this.recoverySeconds = new double[steps];
            for (int step = 1; step <= steps; step++) {
                recoverySeconds[step - 1] = recovery(step);
            }
        }

        private int firstSampleAtOrAfter(double seconds) {
            int k = 0;
            while (k < timeSeconds.length && timeSeconds[k] < seconds) {
                k++;
            }
            return k;
        }

        /** Seconds from demand step {@code step} until the pressure stays within the band up to the next step. */
        private double recovery(int step) {
            double at = DEMAND_AT_SECONDS[step];
            double until = step + 1 < DEMAND_AT_SECONDS.length ? DEMAND_AT_SECONDS[step + 1] : Double.POSITIVE_INFINITY;
            int first = firstSampleAtOrAfter(at);
            int end = Math.min(firstSampleAtOrAfter(until), timeSeconds.length);
            if (first >= end) {
                return Double.NaN;
            }
            int lastOutside = -1;
            for (int k = first; k < end; k++) {
                if (Math.abs(SETPOINT_BAR - pressureBar[k]) > RECOVERED_WITHIN_BAR) {
                    lastOutside = k;
                }
            }
            if (lastOutside == end - 1) {
                return Double.NaN;
            }
            return (lastOutside < 0 ? timeSeconds[first] : timeSeconds[lastOutside + 1]) - at;
        }

        /** A copy of the sample instants, seconds. */
        public double[] timeSeconds() {
            return timeSeconds.clone();
        }

        /** A copy of the discharge pressures, bar. */
        public double[] pressureBar() {
            return pressureBar.clone();
        }

        /** A copy of the drive commands, %. */
        public double[] drivePercent() {
            return drivePercent.clone();
        }

        /** A copy of the measured demand at each sample, m³/h. */
        public double[] demandCubicMetresPerHour() {
            return demandCubicMetresPerHour.clone();
        }

        /** ∫|r − p|dt from the first demand step to the end, bar·s. */
        public double iaeBarSeconds() {
            return iaeBarSeconds;
        }

        /** The largest |r − p| from the first demand step on, bar. */
        public double peakDeviationBar() {
            return peakDeviationBar;
        }

        /**
         * For each demand step within the run, the seconds until the pressure is back within ±0.04 bar
         * of the setpoint for good (up to the next step or the end); NaN when it is not back by then.
         */
        public double[] recoverySeconds() {
            return recoverySeconds.clone();
        }
    }
}
