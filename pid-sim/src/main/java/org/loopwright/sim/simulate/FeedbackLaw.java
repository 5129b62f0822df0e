package org.loopwright.sim.simulate;

import org.loopwright.pid.OutputKind;
import org.loopwright.pid.PidController;
import org.loopwright.pid.multiloop.Cascade;
import org.loopwright.pid.multiloop.ScheduledController;
import org.loopwright.pid.onoff.OnOffController;

/**
 * The controller in a closed loop behind one call: a PID controller (alone, scheduled, or the
 * inner and outer controllers of a cascade) or an on-off controller.
 */
abstract sealed class FeedbackLaw {

    /**
     * u(k) at the sample instant.
     *
     * @param setpoint         r(k)
     * @param measurement      y(k), the loop's (outer) measurement
     * @param innerMeasurement the inner measurement of a cascade (NaN otherwise)
     * @param external         an external scheduling value: the load in effect
     * @param nowSeconds       the instant
     */
    abstract double update(double setpoint, double measurement, double innerMeasurement, double external,
            double nowSeconds);

    /** The inner loop's setpoint after the last update (NaN for a single loop). */
    double innerSetpoint() {
        return Double.NaN;
    }

    /** Whether the last output sits at one of the controller's own finite limits. */
    abstract boolean atLimit();

    /** What the actuator delivered from this sample on, for a controller that tracks its actuator. */
    abstract void delivered(double value);

    abstract void reset();

    static final class Pid extends FeedbackLaw {
        private final PidController controller;
        private final ScheduledController scheduled;
        private final Cascade cascade;
        private final double min;
        private final double max;
        private final boolean incremental;
        private double last;

        /** A PID controller alone. */
        Pid(PidController controller) {
            this(controller, null, null);
        }

        /** A scheduled controller. */
        Pid(ScheduledController scheduled) {
            this(scheduled.controller(), scheduled, null);
        }

        /** A cascade: the inner controller drives the actuator. */
        Pid(Cascade cascade) {
            this(cascade.inner(), null, cascade);
        }

        private Pid(PidController controller, ScheduledController scheduled, Cascade cascade) {
            this.controller = controller;
            this.scheduled = scheduled;
            this.cascade = cascade;
            this.min = controller.settings().outputMin();
            this.max = controller.settings().outputMax();
            this.incremental = controller.settings().outputKind() == OutputKind.INCREMENT;
        }

        /** An incremental controller drives an integrating actuator: the loop sees the position it reaches. */
        @Override
        double update(double setpoint, double measurement, double innerMeasurement, double external,
                double nowSeconds) {
            double u;
            if (cascade != null) {
                u = cascade.update(setpoint, measurement, innerMeasurement);
            } else if (scheduled != null) {
                scheduled.externalValue(external);
                u = scheduled.update(setpoint, measurement);
            } else {
                u = controller.update(setpoint, measurement);
            }
            last = incremental ? controller.position() : u;
            return last;
        }

        @Override
        double innerSetpoint() {
            return cascade != null ? cascade.innerSetpoint() : Double.NaN;
        }

        @Override
        void delivered(double value) {
            controller.actuatorPosition(value);
        }

        @Override
        boolean atLimit() {
            return (last >= max && max != Double.POSITIVE_INFINITY) || (last <= min && min != Double.NEGATIVE_INFINITY);
        }

        @Override
        void reset() {
            if (cascade != null) {
                cascade.reset();
            } else if (scheduled != null) {
                scheduled.reset();
            } else {
                controller.reset();
            }
            last = 0.0;
        }
    }

    static final class OnOff extends FeedbackLaw {
        private final OnOffController controller;

        OnOff(OnOffController controller) {
            this.controller = controller;
        }

        @Override
        double update(double setpoint, double measurement, double innerMeasurement, double external,
                double nowSeconds) {
            return controller.update(setpoint, measurement, nowSeconds);
        }

        @Override
        boolean atLimit() {
            return false;
        }

        @Override
        void delivered(double value) {
            // an on-off controller does not track its actuator
        }

        @Override
        void reset() {
            controller.reset();
        }
    }
}
