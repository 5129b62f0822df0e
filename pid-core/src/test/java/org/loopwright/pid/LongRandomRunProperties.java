package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;
import org.loopwright.pid.testing.Draws;

/**
 * Long random runs (issue 11): the controller driven by {@link #OPERATIONS} random operations per
 * run of the test suite, extreme values included (±1e308, the largest double, subnormals, NaN, ±∞,
 * zero and negative periods), mixed with mode switches, operator and tracking values, feedforward,
 * retunes between two settings, snapshot and restore through the text form, and resets. After
 * every sample:
 * <ul>
 *   <li>the output is never NaN or infinite, and the position is within the current range;</li>
 *   <li>between two good automatic samples under unchanged settings, the position moves by no more
 *       than the slew limit times the period;</li>
 *   <li>in manual the position is the operator's value, within the range and one slew step;</li>
 *   <li>the snapshot's text form parses back to the same snapshot.</li>
 * </ul>
 * A release runs 10⁸ operations:
 * {@code mvn -B -pl pid-core -am test -Dtest=LongRandomRunProperties -Dsurefire.failIfNoSpecifiedTests=false
 * -Dloopwright.randomOperations=100000000} (about 15 minutes on two cores).
 */
class LongRandomRunProperties {

    /** Operations per run of the suite; a system property raises it for a release. */
    static final int OPERATIONS = Integer.getInteger("loopwright.randomOperations", 1_000_000);
    private static final int TRIES = 200;
    private static final int PER_TRY = OPERATIONS / TRIES;

    enum Kind { FIXED, VARIABLE, MANUAL, AUTOMATIC, TRACKING, OPERATOR, TRACK_VALUE, ACTUATOR, FEEDFORWARD,
        FEEDFORWARD_SWITCH, RETUNE, RESTORE, RESET }

    /** One operation with its values; which of them are used depends on the kind. */
    record Operation(Kind kind, double setpoint, double measurement, double value) {
    }

    /** Mostly ordinary values, with the extremes and the bad ones often enough to meet every path. */
    static Arbitrary<Double> values() {
        return Arbitraries.frequencyOf(
                Tuple.of(12, Arbitraries.doubles().between(-100.0, 100.0)),
                Tuple.of(2, Arbitraries.of(1e308, -1e308, Double.MAX_VALUE, -Double.MAX_VALUE, 6e307, -6e307,
                        Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_NORMAL, 0.0, -0.0)),
                Tuple.of(1, Arbitraries.of(Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY)),
                Tuple.of(1, Arbitraries.doubles()));
    }

    static Arbitrary<Double> periods() {
        return Arbitraries.frequencyOf(
                Tuple.of(12, Draws.logUniform(1e-4, 2.0)),
                Tuple.of(1, Arbitraries.of(0.0, -0.1, -Double.MIN_VALUE, Double.MIN_VALUE, Double.NaN,
                        Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 1e308)));
    }

    @Provide
    Arbitrary<List<Operation>> operations() {
        Arbitrary<Kind> kinds = Arbitraries.frequency(
                Tuple.of(40, Kind.FIXED), Tuple.of(20, Kind.VARIABLE), Tuple.of(3, Kind.MANUAL),
                Tuple.of(4, Kind.AUTOMATIC), Tuple.of(2, Kind.TRACKING), Tuple.of(3, Kind.OPERATOR),
                Tuple.of(2, Kind.TRACK_VALUE), Tuple.of(2, Kind.ACTUATOR), Tuple.of(2, Kind.FEEDFORWARD),
                Tuple.of(2, Kind.FEEDFORWARD_SWITCH), Tuple.of(3, Kind.RETUNE), Tuple.of(2, Kind.RESTORE),
                Tuple.of(1, Kind.RESET));
        Arbitrary<Operation> operation = Combinators.combine(kinds, values(), values(), periods())
                .as((kind, r, y, v) -> new Operation(kind, r, y, kind == Kind.VARIABLE ? v : y));
        return operation.list().ofSize(PER_TRY);
    }

    @Provide
    Arbitrary<ControllerSettings> settings() {
        return SettingsArbitraries.settings();
    }

    @Property(tries = TRIES)
    void everyGuaranteeHoldsOverRandomOperations(@ForAll("settings") ControllerSettings first,
            @ForAll("settings") ControllerSettings second, @ForAll("operations") List<Operation> operations) {
        Run run = new Run(first, second);
        for (Operation op : operations) {
            run.apply(op);
        }
    }

    /** The controller, the settings in force and what the invariants need to remember. */
    private static final class Run {
        private final ControllerSettings[] choices;
        private final PidController c;
        private ControllerSettings current;
        private boolean lastWasNormalAutomatic;

        Run(ControllerSettings first, ControllerSettings second) {
            choices = new ControllerSettings[] {first, sameInterface(second, first)};
            current = first;
            c = new PidController(first);
        }

        /** The second settings with the first's action, output kind, range and wrap, so a snapshot restores into either. */
        private static ControllerSettings sameInterface(ControllerSettings s, ControllerSettings plant) {
            ControllerSettings.Builder b = s.toBuilder().action(plant.action()).outputKind(plant.outputKind())
                    .outputRange(plant.outputMin(), plant.outputMax()).wrapSpan(plant.wrapSpan())
                    .faultPolicy(plant.faultPolicy(), plant.safeOutput());
            if (plant.wrapSpan() > 0.0) {
                b.setpointWeights(1.0, s.derivativeSetpointWeight());
            }
            return b.build();
        }

        void apply(Operation op) {
            switch (op.kind()) {
                case FIXED -> sample(op, current.samplePeriodSeconds(), false);
                case VARIABLE -> sample(op, op.value(), true);
                case MANUAL -> forget(c::switchToManual);
                case AUTOMATIC -> forget(c::switchToAutomatic);
                case TRACKING -> forget(c::switchToTracking);
                case OPERATOR -> {
                    boolean taken = c.manualOutput(op.value());
                    assertThat(taken).isEqualTo(Double.isFinite(op.value()));
                    if (taken) {
                        assertThat(c.snapshot().values().manualValue()).isEqualTo(op.value());
                    }
                    lastWasNormalAutomatic = false;
                }
                case TRACK_VALUE -> forget(() -> c.trackValue(op.value()));
                case ACTUATOR -> c.actuatorPosition(op.value());
                case FEEDFORWARD -> forget(() -> c.feedforward(op.value()));
                case FEEDFORWARD_SWITCH -> forget(() -> c.feedforwardOn(op.value() > 0.0));
                case RETUNE -> {
                    current = choices[op.value() > 0.0 ? 1 : 0];
                    forget(() -> c.retune(current));
                }
                case RESTORE -> {
                    StateSnapshot snapshot = c.snapshot();
                    StateSnapshot parsed = StateSnapshot.parse(snapshot.toText());
                    assertThat(parsed).isEqualTo(snapshot);
                    forget(() -> c.restore(parsed));
                }
                case RESET -> forget(c::reset);
            }
        }

        /** An operation after which the next sample is not compared with the last for the slew. */
        private void forget(Runnable action) {
            action.run();
            lastWasNormalAutomatic = false;
        }

        private void sample(Operation op, double h, boolean variablePeriod) {
            double from = c.position();
            // plain checks, not AssertJ, on this path: it runs 10⁶ times per suite
            StateSnapshot.Values state = c.mode() == Mode.MANUAL ? c.snapshot().values() : null;
            double u = variablePeriod ? c.update(op.setpoint(), op.measurement(), h)
                    : c.update(op.setpoint(), op.measurement());
            check(Double.isFinite(u), "output %s is not finite after %s", u, op);
            double position = c.position();
            // compared as numbers (−0.0 is within a range that starts at 0.0)
            check(position >= current.outputMin() && position <= current.outputMax(),
                    "position %s outside %s..%s after %s", position, current.outputMin(), current.outputMax(), op);
            boolean normal = c.fault() == Fault.NONE;
            if (state != null && c.mode() == Mode.MANUAL) {
                // a good first sample is limited by the range only; a bad one moves at the configured period
                // (a first sample emits no increment, so its position step is not limited either)
                boolean first = normal && !state.started();
                double target = first ? Math.min(Math.max(state.manualValue(), current.outputMin()), current.outputMax())
                        : manualTarget(state.manualValue(), from, normal ? h : current.samplePeriodSeconds());
                check(position == target, "manual position %s, not the operator's %s (from %s, %s), after %s",
                        position, target, from, state, op);
            }
            if (normal && c.mode() == Mode.AUTOMATIC && lastWasNormalAutomatic) {
                double step = current.outputSlewPerSecond() * h;
                check(Math.abs(position - from) <= step * (1.0 + 1e-12) + Math.ulp(from),
                        "position moved %s -> %s, beyond the slew step %s, after %s", from, position, step, op);
            }
            lastWasNormalAutomatic = normal && c.mode() == Mode.AUTOMATIC;
        }

        private static void check(boolean holds, String format, Object... values) {
            if (!holds) {
                throw new AssertionError(String.format(format, values));
            }
        }

        /** The operator's value within the range and one slew step at the period. */
        private double manualTarget(double operator, double from, double period) {
            double step = Math.min(current.outputSlewPerSecond() * period,
                    current.outputKind() == OutputKind.INCREMENT ? OutputKind.LARGEST_INCREMENT : Double.POSITIVE_INFINITY);
            double lo = Math.max(current.outputMin(), from - step);
            double hi = Math.min(current.outputMax(), from + step);
            return Math.min(Math.max(operator, lo), hi);
        }
    }
}
