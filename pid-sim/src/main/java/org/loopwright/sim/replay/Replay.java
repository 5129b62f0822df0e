package org.loopwright.sim.replay;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;

/**
 * Runs a logged trace through a controller, one update per row, as the controller would have run
 * on the device: the measurements are the logged ones (the replay does not close the loop).
 *
 * <p>Before each row's update: a non-blank {@code mode} switches the mode (bumpless); a
 * {@code manual_output} sets the operator's output; a {@code track_value} sets the tracking value
 * and the actuator position; a {@code feedforward} sets the feedforward, which is on for the
 * whole replay when the column exists. The period is the configured sample period, or with
 * measured periods h(k) = time(k) − time(k−1) (the configured period for the first row); a period
 * that is not positive is a fault the controller handles by its policy, like a missing sample.
 *
 * <p>Thread-safe: stateless.
 */
public final class Replay {

    private Replay() {
    }

    /**
     * Replays every row.
     *
     * @param measuredPeriod take each row's period from the {@code time} column
     */
    public static ReplayResult run(ControllerSettings settings, Trace trace, boolean measuredPeriod) {
        int rows = trace.rowCount();
        ReplayResult.Columns out = new ReplayResult.Columns(rows);
        PidController controller = new PidController(settings);
        controller.feedforwardOn(trace.hasFeedforward());
        for (int k = 0; k < rows; k++) {
            applyInputs(controller, trace, k);
            double period = measuredPeriod && k > 0
                    ? trace.timeSeconds(k) - trace.timeSeconds(k - 1) : settings.samplePeriodSeconds();
            if (measuredPeriod) {
                controller.update(trace.setpoint(k), trace.measurement(k), period);
            } else {
                controller.update(trace.setpoint(k), trace.measurement(k));
            }
            out.output[k] = controller.output();
            out.position[k] = controller.position();
            out.proportional[k] = controller.proportionalTerm();
            out.integral[k] = controller.integralTerm();
            out.derivative[k] = controller.derivativeTerm();
            out.status[k] = controller.fault();
            out.periodSeconds[k] = period;
            out.mode[k] = controller.mode();
        }
        return new ReplayResult(settings, trace, measuredPeriod, out);
    }

    private static void applyInputs(PidController controller, Trace trace, int k) {
        Mode mode = trace.mode(k);
        if (mode != null) {
            switch (mode) {
                case AUTOMATIC -> controller.switchToAutomatic();
                case MANUAL -> controller.switchToManual();
                case TRACKING -> controller.switchToTracking();
            }
        }
        // a NaN manual output is refused by the controller, which keeps the last one
        controller.manualOutput(trace.manualOutput(k));
        if (trace.hasTrackValue()) {
            controller.trackValue(trace.trackValue(k));
            controller.actuatorPosition(trace.trackValue(k));
        }
        if (trace.hasFeedforward()) {
            controller.feedforward(trace.feedforward(k));
        }
    }
}
