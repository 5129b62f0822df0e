package org.loopwright.sim.replay;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Mode;
import org.loopwright.pid.PidController;

/** The controller and what one row's update needs from the rows before it. Not thread-safe. */
final class ReplayEngine {
    final PidController controller;
    final ControllerSettings settings;
    final boolean measuredPeriod;
    final boolean hasTrackValue;
    final boolean hasFeedforward;
    boolean startFromLoggedOutput;
    boolean first = true;
    double previousTime;
    double period;

    ReplayEngine(ControllerSettings settings, boolean measuredPeriod, boolean startFromLoggedOutput,
            boolean hasFeedforward, boolean hasTrackValue) {
        this.controller = new PidController(settings);
        this.settings = settings;
        this.measuredPeriod = measuredPeriod;
        this.startFromLoggedOutput = startFromLoggedOutput;
        this.hasTrackValue = hasTrackValue;
        this.hasFeedforward = hasFeedforward;
        controller.feedforwardOn(hasFeedforward);
    }

    void step(TraceRow row) {
        applyInputs(row);
        boolean fromLogged = startFromLoggedOutput && Double.isFinite(row.loggedOutput())
                && (row.mode() == null || row.mode() == Mode.AUTOMATIC);
        if (fromLogged) {
            controller.switchToTracking();
            controller.trackValue(row.loggedOutput());
        }
        period = measuredPeriod && !first ? row.timeSeconds() - previousTime : settings.samplePeriodSeconds();
        if (measuredPeriod) {
            controller.update(row.setpoint(), row.measurement(), period);
        } else {
            controller.update(row.setpoint(), row.measurement());
        }
        if (fromLogged) {
            controller.switchToAutomatic();
            startFromLoggedOutput = false;
        }
        previousTime = row.timeSeconds();
        first = false;
    }

    private void applyInputs(TraceRow row) {
        Mode mode = row.mode();
        if (mode != null) {
            switch (mode) {
                case AUTOMATIC -> controller.switchToAutomatic();
                case MANUAL -> controller.switchToManual();
                case TRACKING -> controller.switchToTracking();
            }
        }
        // a NaN manual output is refused by the controller, which keeps the last one
        controller.manualOutput(row.manualOutput());
        if (hasTrackValue) {
            controller.trackValue(row.trackValue());
            controller.actuatorPosition(row.trackValue());
        }
        if (hasFeedforward) {
            controller.feedforward(row.feedforward());
        }
    }
}
