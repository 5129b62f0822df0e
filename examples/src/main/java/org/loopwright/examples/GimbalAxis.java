package org.loopwright.examples;

import java.io.PrintStream;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.HdrHistogram.Histogram;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.runner.CommandRefusedException;
import org.loopwright.pid.runner.LoopClock;
import org.loopwright.pid.runner.LoopRunner;
import org.loopwright.pid.runner.LoopStatus;
import org.loopwright.pid.runner.OperatorChannel;
import org.loopwright.pid.runner.OverrunPolicy;
import org.loopwright.pid.runner.PeriodMode;
import org.loopwright.pid.runner.RunnerSettings;
import org.loopwright.pid.runner.RunnerState;
import org.loopwright.pid.runner.StopReason;
import org.loopwright.pid.runner.WaitStrategy;
import org.loopwright.sim.plant.DcMotorModel;
import org.loopwright.sim.plant.MotorOutput;

/**
 * One axis of a camera gimbal holding an angle, run by the fixed-rate loop runner at 1 kHz against a
 * simulated DC motor that is advanced, on every tick, by the time that really passed on the runner's
 * clock. The angle is circular: the encoder reads 0–360°, the controller's wrap span is 360°, so a
 * move from 350° to 10° turns 20° forward through 0°, never 340° back.
 *
 * <p>The motor: R = 2 Ω, L = 1 mH, Kt = Ke = 0.05 N·m/A, J = 1e-5 kg·m², b = 1e-5 N·m·s/rad, with
 * Coulomb friction 0.008 N·m and breakaway friction 0.01 N·m, driven with ±12 V; a 12-bit absolute
 * encoder mounted so that it reads 350° at the motor's start. The setpoint is 350° (hold), then 10°
 * from 0.1 s, then 300° from 0.6 s. Every one of these numbers is invented for this demonstration;
 * none describes a real product. The PID (Kc = 0.5 V/°, Ti = 0.1 s, Td = 6 ms, derivative filter
 * 1 ms, derivative on the measurement) was tuned on this model in simulation.
 *
 * <p>While the loop runs, the main thread plays the operator through the runner's operator channel
 * (the controller's own mode methods are not thread-safe): once the axis has held 300° for a while
 * ({@value #OPERATOR_AT_SECONDS} s), it takes the axis to manual (the drive holds its voltage, no
 * bump), retunes to a softer PID (Kc = 0.4 V/°, Ti = 0.12 s) and hands back to automatic (no bump
 * either); every command lands at the next tick boundary. It also reads the runner's published
 * status, one consistent tick at a time, and prints it every {@value #STATUS_EVERY_SECONDS} s.
 *
 * <p>The runner gives the controller the measured period of each tick and skips deadlines it has
 * missed; the period error |measured − 1 ms| of every tick is recorded in an HdrHistogram and printed
 * (p50, p99, max). Those figures depend on the machine and its load.
 *
 * <p>Run it with {@code mvn -q -pl examples -am compile -Dexample=GimbalAxis} (an optional argument,
 * {@code -Dexec.args=1.5}, sets the duration in seconds of real time).
 *
 * <p>Thread-safe: every run builds its own runner, controller and motor.
 */
public final class GimbalAxis {

    /** The loop period: 1 kHz. */
    public static final long PERIOD_NANOS = 1_000_000L;
    /** The supply: the drive outputs −12 V to +12 V. */
    public static final double SUPPLY_VOLTS = 12.0;
    /** The invented motor, position output in radians. */
    public static final DcMotorModel MOTOR = new DcMotorModel(2.0, 1e-3, 0.05, 0.05, 1e-5, 1e-5, 0.0, 0.008, 0.01,
            MotorOutput.POSITION, 1e-5);
    /** The encoder reading at the motor's start, degrees. */
    public static final double START_DEGREES = 350.0;
    /** When each setpoint of the profile starts, seconds. */
    public static final double[] PROFILE_FROM_SECONDS = {0.0, 0.1, 0.6};
    /** The setpoints, degrees. */
    public static final double[] PROFILE_DEGREES = {350.0, 10.0, 300.0};
    /** The duration that {@link #main} runs when given none, seconds. */
    public static final double DEFAULT_DURATION_SECONDS = 1.5;

    /** When the operator takes over, seconds after the start (the axis has settled on 300°). */
    public static final double OPERATOR_AT_SECONDS = 1.0;
    /** How often the main thread prints the published status, seconds of loop time. */
    public static final double STATUS_EVERY_SECONDS = 0.25;

    private static final double PRINT_EVERY_SECONDS = 0.05;
    private static final Duration COMMAND_PATIENCE = Duration.ofSeconds(5);

    private GimbalAxis() {
    }

    /** The controller settings: PID with a filtered derivative, ±12 V, a 360° circular angle, 1 ms. */
    public static ControllerSettings settings() {
        return ControllerSettings.builder()
                .gains(new IdealGains(0.5, 0.1, 0.006))
                .derivativeFilterTimeSeconds(0.001)
                .samplePeriodSeconds(PERIOD_NANOS * 1e-9)
                .outputRange(-SUPPLY_VOLTS, SUPPLY_VOLTS)
                .windupProtection(WindupProtection.BACK_CALCULATION)
                .wrapSpan(360.0)
                .faultPolicy(FaultPolicy.SAFE_OUTPUT, 0.0)
                .build();
    }

    /** The operator's retune: a softer PID (Kc = 0.4 V/°, Ti = 0.12 s), same period and limits. */
    public static ControllerSettings softerSettings() {
        return settings().toBuilder().gains(new IdealGains(0.4, 0.12, 0.006)).build();
    }

    /** Runs the axis in real time for the default duration, or the seconds given as the first argument. */
    public static void main(String[] args) throws InterruptedException {
        double duration = DurationArgument.seconds(args, DEFAULT_DURATION_SECONDS);
        run(duration, LoopClock.SYSTEM, System.out);
    }

    /**
     * Runs the axis on the loop runner until {@code clock} has advanced by the duration, then prints
     * the angles over time, the runner's counts and the period-error histogram.
     *
     * @param durationSeconds how long to run, on the clock, finite and &gt; 0
     * @param clock           the runner's clock: {@link LoopClock#SYSTEM} for real time
     * @param out             where the account goes
     * @return what happened, for a test to judge
     * @throws InterruptedException when this thread is interrupted while the loop runs
     */
    public static Outcome run(double durationSeconds, LoopClock clock, PrintStream out) throws InterruptedException {
        if (!(durationSeconds > 0.0) || Double.isInfinite(durationSeconds)) {
            throw new IllegalArgumentException("duration must be finite and > 0: duration=" + durationSeconds);
        }
        SafetyNotice.print(out);
        RunnerSettings runnerSettings = RunnerSettings.builder()
                .waitStrategy(WaitStrategy.PARK_THEN_SPIN)
                .overrunPolicy(OverrunPolicy.SKIP_MISSED)
                .periodMode(PeriodMode.MEASURED)
                .threadName("gimbal-axis-loop")
                .daemon(true)
                .clock(clock)
                .build();
        PidController controller = new PidController(settings());
        SimulatedGimbal gimbal = new SimulatedGimbal(MOTOR, clock, START_DEGREES, PERIOD_NANOS, durationSeconds,
                PROFILE_FROM_SECONDS, PROFILE_DEGREES);
        LoopRunner runner = new LoopRunner(runnerSettings, controller, gimbal, gimbal, gimbal, gimbal);
        gimbal.stopsAtTheEnd(runner);

        runner.start();
        List<String> operatorLog = operate(runner, out);
        if (!runner.awaitStop(Duration.ofMillis(Math.round(durationSeconds * 1000.0)).plusSeconds(30))) {
            runner.stop();
        }

        LoopStatus last = runner.status();
        Outcome outcome = new Outcome(last.tickCount(), last.overrunCount(), last.skippedTickCount(),
                last.failedTickCount(), runner.stopReason(), gimbal.periodErrorNanos().copy(),
                gimbal.timeSeconds(), gimbal.setpointDegrees(), gimbal.encoderDegrees(), gimbal.shaftDegreesLog(),
                gimbal.volts(), last.appliedCommandCount(), last.mode(), controller.settings(), operatorLog);
        print(out, outcome);
        return outcome;
    }

    /**
     * The operator, on the calling thread: prints the published status now and then, and at
     * {@link #OPERATOR_AT_SECONDS} switches to manual, retunes and switches back through the operator
     * channel. Returns what it did, one line per step. A loop that ends first refuses the commands,
     * which is said, not hidden.
     */
    private static List<String> operate(LoopRunner runner, PrintStream out) throws InterruptedException {
        List<String> log = new ArrayList<>();
        OperatorChannel operator = runner.operator();
        LoopStatus status = new LoopStatus();
        // the loop's time in periods is its deadline count: ticks run plus deadlines skipped
        long operatorAt = Math.round(OPERATOR_AT_SECONDS * 1e9 / PERIOD_NANOS);
        long statusEvery = Math.round(STATUS_EVERY_SECONDS * 1e9 / PERIOD_NANOS);
        long nextStatus = statusEvery;
        boolean acted = false;
        while (runner.state() != RunnerState.STOPPED) {
            runner.readStatus(status);
            long deadlines = status.tickCount() + status.skippedTickCount();
            if (deadlines >= nextStatus) {
                out.println("  status: " + describe(status));
                nextStatus = (deadlines / statusEvery + 1) * statusEvery;
            }
            if (!acted && deadlines >= operatorAt) {
                acted = true;
                try {
                    long manual = operator.requestMode(Mode.MANUAL);
                    operator.awaitApplied(manual, COMMAND_PATIENCE);
                    log.add("manual: " + describe(runner.readStatus(status)));
                    operator.requestRetune(softerSettings());
                    long automatic = operator.requestMode(Mode.AUTOMATIC);
                    operator.awaitApplied(automatic, COMMAND_PATIENCE);
                    log.add("retuned to Kc 0.4 V/°, Ti 0.12 s, back in automatic: "
                            + describe(runner.readStatus(status)));
                } catch (CommandRefusedException e) {
                    log.add("the loop ended before the operator acted: " + e.getMessage());
                }
                log.forEach(line -> out.println("  operator " + line));
            }
            Thread.sleep(1);
        }
        if (!acted) {
            log.add("the loop ended before " + OPERATOR_AT_SECONDS + " s: the operator sent nothing");
            out.println("  operator: " + log.get(0));
        }
        return log;
    }

    private static String describe(LoopStatus s) {
        return String.format(Locale.ROOT, "tick %d, setpoint %.1f°, encoder %.2f°, drive %.3f V, %s, %d commands"
                + " applied", s.tickCount(), s.setpoint(), s.measurement(), s.output(),
                s.mode().name().toLowerCase(Locale.ROOT), s.appliedCommandCount());
    }

    private static void print(PrintStream out, Outcome o) {
        out.printf(Locale.ROOT, "Gimbal axis: %d Hz loop runner, measured period, encoder %d counts/rev%n",
                1_000_000_000L / PERIOD_NANOS, SimulatedGimbal.ENCODER_COUNTS);
        out.println("    time ms   setpoint °   encoder °   shaft turned °   drive V");
        double[] time = o.timeSeconds;
        double nextPrint = 0.0;
        for (int k = 0; k < time.length; k++) {
            if (time[k] >= nextPrint || k == time.length - 1) {
                out.printf(Locale.ROOT, "  %8.1f   %10.1f   %9.2f   %14.2f   %7.3f%n", time[k] * 1e3,
                        o.setpointDegrees[k], o.encoderDegrees[k], o.shaftDegrees[k] - START_DEGREES, o.volts[k]);
                nextPrint = Math.floor(time[k] / PRINT_EVERY_SECONDS + 1.0) * PRINT_EVERY_SECONDS;
            }
        }
        out.printf(Locale.ROOT, "Runner: %d ticks, %d overruns, %d skipped, %d failed, stopped: %s; %d operator"
                + " commands applied, ending in %s%n", o.ticks, o.overruns, o.skippedTicks, o.failedTicks, o.stopReason,
                o.appliedCommands, o.finalMode.name().toLowerCase(Locale.ROOT));
        Histogram h = o.periodErrorNanos;
        out.printf(Locale.ROOT, "Period error |measured - %d µs| over %d periods: p50 %.1f µs, p99 %.1f µs,"
                + " max %.1f µs (depends on this machine and its load)%n", PERIOD_NANOS / 1000, h.getTotalCount(),
                h.getValueAtPercentile(50.0) / 1e3, h.getValueAtPercentile(99.0) / 1e3, h.getMaxValue() / 1e3);
    }

    /**
     * What a run showed: the runner's counts, the period-error histogram (nanoseconds) and, per tick,
     * the time since the start, the setpoint, the encoder reading, the shaft's unwrapped angle (in
     * the encoder's degrees, starting at {@link #START_DEGREES}) and the drive voltage.
     *
     * <p>Not thread-safe: the histogram is mutable; the accessors of the logs return copies.
     */
    public static final class Outcome {
        private final long ticks;
        private final long overruns;
        private final long skippedTicks;
        private final long failedTicks;
        private final StopReason stopReason;
        private final Histogram periodErrorNanos;
        private final double[] timeSeconds;
        private final double[] setpointDegrees;
        private final double[] encoderDegrees;
        private final double[] shaftDegrees;
        private final double[] volts;
        private final long appliedCommands;
        private final Mode finalMode;
        private final ControllerSettings finalSettings;
        private final List<String> operatorLog;

        Outcome(long ticks, long overruns, long skippedTicks, long failedTicks, StopReason stopReason,
                Histogram periodErrorNanos, double[] timeSeconds, double[] setpointDegrees, double[] encoderDegrees,
                double[] shaftDegrees, double[] volts, long appliedCommands, Mode finalMode,
                ControllerSettings finalSettings, List<String> operatorLog) {
            this.appliedCommands = appliedCommands;
            this.finalMode = finalMode;
            this.finalSettings = finalSettings;
            this.operatorLog = List.copyOf(operatorLog);
            this.ticks = ticks;
            this.overruns = overruns;
            this.skippedTicks = skippedTicks;
            this.failedTicks = failedTicks;
            this.stopReason = stopReason;
            this.periodErrorNanos = periodErrorNanos;
            this.timeSeconds = timeSeconds;
            this.setpointDegrees = setpointDegrees;
            this.encoderDegrees = encoderDegrees;
            this.shaftDegrees = shaftDegrees;
            this.volts = volts;
        }

        /** Ticks the runner ran. */
        public long ticks() {
            return ticks;
        }

        /** Ticks that ended after the next deadline. */
        public long overruns() {
            return overruns;
        }

        /** Deadlines skipped after overruns. */
        public long skippedTicks() {
            return skippedTicks;
        }

        /** Ticks with a failed callback. */
        public long failedTicks() {
            return failedTicks;
        }

        /** Why the runner stopped. */
        public StopReason stopReason() {
            return stopReason;
        }

        /** |measured period − nominal period| of every tick after the first, nanoseconds. */
        public Histogram periodErrorNanos() {
            return periodErrorNanos;
        }

        /** A copy of each tick's time since the start, seconds. */
        public double[] timeSeconds() {
            return timeSeconds.clone();
        }

        /** A copy of each tick's setpoint, degrees. */
        public double[] setpointDegrees() {
            return setpointDegrees.clone();
        }

        /** A copy of each tick's encoder reading, degrees in [0, 360). */
        public double[] encoderDegrees() {
            return encoderDegrees.clone();
        }

        /** A copy of each tick's unwrapped shaft angle, degrees (350 at the start). */
        public double[] shaftDegrees() {
            return shaftDegrees.clone();
        }

        /** Operator commands the loop applied (3 when the operator acted: manual, retune, automatic). */
        public long appliedCommands() {
            return appliedCommands;
        }

        /** The controller's mode at the last tick, as the published status said. */
        public Mode finalMode() {
            return finalMode;
        }

        /** The controller's settings at the end (the softer ones once the operator has retuned). */
        public ControllerSettings finalSettings() {
            return finalSettings;
        }

        /** What the operator did, one line per step. */
        public List<String> operatorLog() {
            return operatorLog;
        }

        /** A copy of each tick's drive voltage. */
        public double[] volts() {
            return volts.clone();
        }
    }
}
