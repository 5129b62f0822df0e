package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Random;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.IdealGains;

/**
 * The properties of issue 3 over random operation: a random industrial configuration runs through
 * a random sequence of samples (NaN and infinite inputs and bad periods mixed in), fixed and
 * variable periods, mode switches, manual and tracking values, feedforward switches and retunes.
 * After every step:
 * <ul>
 *   <li>the output is never NaN and the position is within the range;</li>
 *   <li>the position moves by no more than slew·h on a good sample (a safe output on a fault is a
 *       safety action and may move at once);</li>
 *   <li>a fault leaves the dynamic state exactly as it was (snapshot compared; the fault counter
 *       counts it, and under {@link FaultPolicy#SAFE_OUTPUT} the last output is the safe output,
 *       except in manual, where the operator's output stands);</li>
 *   <li>a mode switch is bumpless: the first output after it equals the last one before it (to
 *       tracking, with the tracked value at the last output, as when the actuator is tracked);</li>
 *   <li>a retune or a feedforward switch is bumpless, defined at unchanged inputs (setpoint ramp
 *       finished): the output moves by no more than the controller's own increment at those inputs,
 *       |Δu| ≤ Ki·h·|e| + |1 − ad|·|D| + min(h/Tt, 1)·|u − v| + (slew·h when the last output was
 *       limited), with Ki, ad, Tt those of the controller after the change, D the last derivative
 *       term, u and v the last output after and before the limits. The proportional term, whose
 *       gain or weight may have changed, contributes nothing: that is the rebalance.</li>
 * </ul>
 */
class IndustrialProperties {

    private static final int STEPS = 80;

    /** A retune of the same plant interface: new gains, form, weights, filter and methods. */
    private static ControllerSettings retuned(Random rnd, ControllerSettings from) {
        ControllerSettings.Builder b = from.toBuilder()
                .gains(RandomSettings.inRandomForm(rnd, RandomSettings.idealGains(rnd)))
                .setpointWeights(from.wrapSpan() > 0.0 ? 1.0 : rnd.nextDouble(), rnd.nextDouble())
                .derivativeFilterRatio(2.0 + 18.0 * rnd.nextDouble())
                .integralMethod(RandomSettings.pick(rnd, IntegralMethod.values()))
                .windupProtection(RandomSettings.pick(rnd, WindupProtection.values()));
        return RandomSettings.stableDerivative(b, RandomSettings.pick(rnd, DerivativeMethod.values())).build();
    }

    /** The error the settings see, as the controller forms it: action, wrap and deadband. */
    private static double errorOf(ControllerSettings s, double r, double y) {
        double d = r - y;
        double span = s.wrapSpan();
        if (span > 0.0) {
            d -= span * Math.floor(d / span + 0.5);
        }
        double e = s.action().sign() * d;
        double band = s.errorDeadband();
        return e > band ? e - band : (e < -band ? e + band : 0.0);
    }

    /** The bound of the class comment, for the controller's state before the change and settings after. */
    private static double ownIncrement(PidController c, ControllerSettings s, double r, double y) {
        StateSnapshot.Values state = c.snapshot().values();
        double h = s.samplePeriodSeconds();
        double ki = s.parallelGains().integralGain();
        double ad = s.discretePid().derivativePole();
        double saturation = Math.abs(state.previousOutput() - state.previousUnlimited());
        boolean tracks = s.windupProtection() == WindupProtection.BACK_CALCULATION
                || s.windupProtection() == WindupProtection.ACTUATOR_TRACKING;
        double backCalculation = tracks && ki > 0.0 ? Math.min(h / s.trackingTimeSeconds(), 1.0) * saturation : 0.0;
        double slew = saturation > 0.0 && Double.isFinite(s.outputSlewPerSecond()) ? s.outputSlewPerSecond() * h : 0.0;
        return ki * h * Math.abs(errorOf(s, r, y)) + Math.abs(1.0 - ad) * Math.abs(c.derivativeTerm())
                + backCalculation + slew;
    }

    private static double roundingScale(PidController c) {
        StateSnapshot.Values state = c.snapshot().values();
        return 1e-9 * (1.0 + Math.abs(c.proportionalTerm()) + Math.abs(state.integral())
                + Math.abs(c.derivativeTerm()) + Math.abs(c.feedforwardTerm()) + Math.abs(state.previousUnlimited()));
    }

    /** The state with its last output and fault counter replaced, for an exact comparison. */
    static StateSnapshot.Values sameCounters(StateSnapshot.Values s, double previousOutput, long faultCount) {
        return new StateSnapshot.Values(s.action(), s.outputKind(), s.outputMin(), s.outputMax(), s.wrapSpan(),
                s.mode(), s.started(), s.integral(), s.derivativeState(), s.previousError(), s.previousSetpoint(),
                s.previousMeasurement(), s.previousUnlimited(), previousOutput, s.previousFeedforward(),
                s.feedforwardApplied(), s.manualValue(), faultCount);
    }

    private static final class Run {
        final Random rnd;
        final ControllerSettings[] settings;
        final PidController c;
        ControllerSettings current;
        boolean started;
        double r;
        double y;
        double feedforward;
        boolean feedforwardOn;

        Run(long seed) {
            rnd = new Random(seed);
            IdealGains gains = RandomSettings.idealGains(rnd);
            ControllerSettings first = RandomSettings.full(rnd, RandomSettings.inRandomForm(rnd, gains)).build();
            settings = new ControllerSettings[] {first, retuned(rnd, first), retuned(rnd, first)};
            current = first;
            c = new PidController(first);
            r = 20.0 * rnd.nextGaussian();
            y = r + 5.0 * rnd.nextGaussian();
        }

        /** One good sample at the given inputs, with every invariant of a good sample checked. */
        double goodSample(double setpoint, double measurement, boolean fixedPeriod) {
            double before = c.position();
            double h = fixedPeriod ? current.samplePeriodSeconds()
                    : current.samplePeriodSeconds() * (0.5 + 1.5 * rnd.nextDouble());
            double u = fixedPeriod ? c.update(setpoint, measurement) : c.update(setpoint, measurement, h);
            c.actuatorPosition(c.position());
            assertThat(c.fault()).isEqualTo(Fault.NONE);
            checkOutput(u, before);
            if (started) {
                double slew = current.outputSlewPerSecond() * h;
                assertThat(Math.abs(c.position() - before)).isLessThanOrEqualTo(slew * (1.0 + 1e-12) + 1e-12);
            }
            started = true;
            r = setpoint;
            y = measurement;
            return u;
        }

        void checkOutput(double u, double positionBefore) {
            assertThat(u).isNotNaN();
            assertThat(c.position()).isBetween(current.outputMin(), current.outputMax());
            if (current.outputKind() == OutputKind.POSITION) {
                assertThat(u).isEqualTo(c.position());
            } else {
                // the first sample emits 0: there is no previous position to move from
                assertThat(u).isEqualTo(started ? c.position() - positionBefore : 0.0);
            }
        }

        void faultySample() {
            StateSnapshot.Values before = c.snapshot().values();
            double position = c.position();
            long faults = c.faultCount();
            double bad = RandomSettings.pick(rnd,
                    new Double[] {Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY});
            double u;
            switch (rnd.nextInt(4)) {
                case 0 -> u = c.update(bad, y);
                case 1 -> u = c.update(r, bad);
                case 2 -> u = c.update(r, y, RandomSettings.pick(rnd, new Double[] {0.0, -0.1, Double.NaN, bad}));
                default -> {
                    c.feedforward(bad);
                    c.feedforwardOn(true);
                    u = c.update(r, y);
                    c.feedforward(feedforward);
                    c.feedforwardOn(feedforwardOn);
                }
            }
            assertThat(c.fault()).isNotEqualTo(Fault.NONE);
            assertThat(c.faultCount()).isEqualTo(faults + 1);
            double slewStep = current.outputSlewPerSecond() * current.samplePeriodSeconds();
            // manual obeys the operator on a bad sample too, within the range and one slew step
            double expected = c.mode() == Mode.MANUAL
                    ? Math.min(Math.max(before.manualValue(), Math.max(current.outputMin(), position - slewStep)),
                            Math.min(current.outputMax(), position + slewStep))
                    : current.faultPolicy() == FaultPolicy.HOLD ? position
                    : Math.min(Math.max(current.safeOutput(), current.outputMin()), current.outputMax());
            assertThat(c.position()).isEqualTo(expected);
            if (current.outputKind() == OutputKind.INCREMENT) {
                assertThat(u).isEqualTo(expected - position);
            }
            StateSnapshot.Values after = c.snapshot().values();
            assertThat(after.faultCount()).isEqualTo(before.faultCount() + 1);
            assertThat(sameCounters(after, before.previousOutput(), before.faultCount())).isEqualTo(before);
        }

        void switchMode() {
            Mode target = RandomSettings.pick(rnd, Mode.values());
            Mode from = c.mode();
            double last = c.position();
            switch (target) {
                case AUTOMATIC -> c.switchToAutomatic();
                case MANUAL -> c.switchToManual();
                case TRACKING -> {
                    c.trackValue(last);
                    c.switchToTracking();
                }
            }
            double scale = roundingScale(c);
            boolean wasStarted = started;
            goodSample(r + rnd.nextGaussian(), y + rnd.nextGaussian(), rnd.nextBoolean());
            if (wasStarted && target != from) {
                assertThat(c.position()).as("first output after %s -> %s", from, target)
                        .isCloseTo(last, within(target == Mode.AUTOMATIC ? scale : 0.0));
            }
        }

        void retune() {
            ControllerSettings next = settings[rnd.nextInt(settings.length)];
            boolean atRest = started && c.snapshot().values().previousSetpoint() == r;
            double last = c.position();
            double bound = ownIncrement(c, next, r, y);
            double scale = roundingScale(c);
            c.retune(next);
            current = next;
            goodSample(r, y, true);
            if (atRest && c.mode() == Mode.AUTOMATIC) {
                assertThat(Math.abs(c.position() - last)).as("retune bump").isLessThanOrEqualTo(bound + scale);
            }
            if (atRest && c.mode() == Mode.MANUAL && c.snapshot().values().manualValue() == last) {
                assertThat(c.position()).isEqualTo(last);
            }
        }

        void switchFeedforward() {
            boolean atRest = started && c.snapshot().values().previousSetpoint() == r;
            double last = c.position();
            if (!feedforwardOn) {
                feedforward = 10.0 * rnd.nextGaussian();
                c.feedforward(feedforward);
            }
            double bound = ownIncrement(c, current, r, y);
            double scale = roundingScale(c) + 1e-9 * Math.abs(feedforward);
            feedforwardOn = !feedforwardOn;
            c.feedforwardOn(feedforwardOn);
            goodSample(r, y, true);
            if (atRest && c.mode() == Mode.AUTOMATIC) {
                assertThat(Math.abs(c.position() - last)).as("feedforward bump").isLessThanOrEqualTo(bound + scale);
            }
        }
    }

    @Property(tries = 1000)
    void randomOperationKeepsEveryGuarantee(@ForAll long seed) {
        Run run = new Run(seed);
        Random rnd = run.rnd;
        for (int step = 0; step < STEPS; step++) {
            int action = rnd.nextInt(100);
            if (action < 55) {
                double r = rnd.nextInt(5) == 0 ? 20.0 * rnd.nextGaussian() : run.r;
                run.goodSample(r, r + 5.0 * rnd.nextGaussian(), rnd.nextBoolean());
            } else if (action < 67) {
                run.faultySample();
            } else if (action < 77) {
                run.switchMode();
            } else if (action < 82) {
                run.c.manualOutput(run.current.outputMin() - 10.0 + rnd.nextDouble() * (run.current.outputMax()
                        - run.current.outputMin() + 20.0));
            } else if (action < 85) {
                run.c.trackValue(rnd.nextInt(4) == 0 ? Double.NaN : run.c.position() + 5.0 * rnd.nextGaussian());
            } else if (action < 93) {
                run.retune();
            } else {
                run.switchFeedforward();
            }
        }
    }
}
