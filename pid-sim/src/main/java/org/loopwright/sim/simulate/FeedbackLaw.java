package org.loopwright.sim.simulate;

import org.loopwright.pid.PidController;
import org.loopwright.pid.onoff.OnOffController;

/** The controller in a closed loop: a PID controller or an on-off controller behind one call. */
abstract sealed class FeedbackLaw {

    /** u(k) from r(k), y(k) at the sample instant. */
    abstract double update(double setpoint, double measurement, double nowSeconds);

    /** Whether the last output sits at one of the controller's own finite limits. */
    abstract boolean atLimit();

    abstract void reset();

    static final class Pid extends FeedbackLaw {
        private final PidController controller;
        private final double min;
        private final double max;
        private double last;

        Pid(PidController controller) {
            this.controller = controller;
            this.min = controller.settings().outputMin();
            this.max = controller.settings().outputMax();
        }

        @Override
        double update(double setpoint, double measurement, double nowSeconds) {
            last = controller.update(setpoint, measurement);
            return last;
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
        void reset() {
            controller.reset();
        }
    }
}
