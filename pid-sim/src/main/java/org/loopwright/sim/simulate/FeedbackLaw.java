package org.loopwright.sim.simulate;

import org.loopwright.pid.OutputKind;
import org.loopwright.pid.PidController;
import org.loopwright.pid.onoff.OnOffController;

/** The controller in a closed loop: a PID controller or an on-off controller behind one call. */
abstract sealed class FeedbackLaw {

    /** u(k) from r(k), y(k) at the sample instant. */
    abstract double update(double setpoint, double measurement, double nowSeconds);

    /** Whether the last output sits at one of the controller's own finite limits. */
    abstract boolean atLimit();

    /** What the actuator delivered from this sample on, for a controller that tracks its actuator. */
    abstract void delivered(double value);

    abstract void reset();

    static final class Pid extends FeedbackLaw {
        private final PidController controller;
        private final double min;
        private final double max;
        private final boolean incremental;
        private double last;

        Pid(PidController controller) {
            this.controller = controller;
            this.min = controller.settings().outputMin();
            this.max = controller.settings().outputMax();
            this.incremental = controller.settings().outputKind() == OutputKind.INCREMENT;
        }

        /** An incremental controller drives an integrating actuator: the loop sees the position it reaches. */
        @Override
        double update(double setpoint, double measurement, double nowSeconds) {
            double u = controller.update(setpoint, measurement);
            last = incremental ? controller.position() : u;
            return last;
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
            controller.reset();
            last = 0.0;
        }
    }

    static final class OnOff extends FeedbackLaw {
        private final OnOffController controller;

        OnOff(OnOffController controller) {
            this.controller = controller;
        }

        @Override
        double update(double setpoint, double measurement, double nowSeconds) {
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
