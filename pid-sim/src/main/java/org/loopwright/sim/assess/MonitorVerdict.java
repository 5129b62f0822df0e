package org.loopwright.sim.assess;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.monitor.ConditionStatus;
import org.loopwright.pid.monitor.LoopCondition;
import org.loopwright.pid.monitor.LoopMonitor;
import org.loopwright.pid.monitor.MonitorSettings;
import org.loopwright.pid.monitor.MonitorSummary;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Trajectory;

/**
 * The loop monitor's verdict on a simulated run, in one line, for {@code simulate}: the monitor is fed
 * every sample as it would be beside the running controller, with the time scale from the controller's
 * integral time (Hägglund 1995's choice when the ultimate period is unknown) and an acceptable
 * amplitude of 1 % of the largest setpoint or measurement. Oscillation and a frozen measurement are
 * reported at their worst during the run; saturation, sluggishness and noise as they stand at its end
 * (a run that starts with a setpoint step saturates on the way up by design).
 */
public final class MonitorVerdict {

    private MonitorVerdict() {
    }

    /** The line, e.g. "Monitor: oscillation ALARM (period 8.2 s, amplitude 0.036): the loop hunts". */
    public static String of(Scenario scenario, Trajectory t) {
        if (t.hasInnerLoop()) {
            return "Monitor: not run (a two-loop scenario: watch each loop with a monitor of its own)";
        }
        if (scenario.controller().isEmpty()) {
            return "Monitor: not run (on-off control cycles by design)";
        }
        ControllerSettings c = scenario.controller().get();
        if (!c.gains().hasIntegralAction()) {
            return "Monitor: not run (no integral time to set its time scale)";
        }
        double largest = 0.0;
        for (int k = 0; k < t.length(); k++) {
            largest = Math.max(largest, Math.max(finiteAbs(t.setpoint(k)), finiteAbs(t.measurement(k))));
        }
        double integralTime = c.gains().toParallel().toIdeal().integralTime();
        if (largest == 0.0 || integralTime < 2.0 * c.samplePeriodSeconds()) {
            return "Monitor: not run (the run stays at zero, or Ti is under two sample periods)";
        }
        MonitorSettings.Builder settings = MonitorSettings.builder().samplePeriodSeconds(c.samplePeriodSeconds())
                .timeScaleSeconds(integralTime).acceptableAmplitude(0.01 * largest).action(c.action());
        if (Double.isFinite(c.outputMax() - c.outputMin()) && c.outputMax() > c.outputMin()) {
            settings.outputRange(c.outputMin(), c.outputMax());
        } else {
            settings.frozenOutputMove(0.01 * Math.max(1.0, largest));
        }
        LoopMonitor monitor = new LoopMonitor(settings.build());
        ConditionStatus[] worst = new ConditionStatus[LoopCondition.values().length];
        java.util.Arrays.fill(worst, ConditionStatus.OK);
        MonitorSummary atWorst = new MonitorSummary();
        double peak = 0.0;
        MonitorSummary now = new MonitorSummary();
        for (int k = 0; k < t.length(); k++) {
            monitor.sample(t.setpoint(k), t.measurement(k), t.output(k), true);
            for (LoopCondition condition : LoopCondition.values()) {
                if (monitor.status(condition).compareTo(worst[condition.ordinal()]) > 0) {
                    worst[condition.ordinal()] = monitor.status(condition);
                }
            }
            if (monitor.readSummary(now).oscillationEvents() > peak) {
                peak = now.oscillationEvents();
                monitor.readSummary(atWorst);
            }
        }
        for (LoopCondition condition : new LoopCondition[] {LoopCondition.SATURATION, LoopCondition.SLUGGISH,
                LoopCondition.NOISE}) {
            worst[condition.ordinal()] = monitor.status(condition);
        }
        List<String> flagged = new ArrayList<>();
        for (LoopCondition condition : LoopCondition.values()) {
            if (worst[condition.ordinal()] != ConditionStatus.OK) {
                flagged.add(condition.label() + " " + worst[condition.ordinal()].name());
            }
        }
        if (flagged.isEmpty()) {
            return "Monitor: nothing flagged (oscillation, sluggish, saturation, frozen-measurement, noise all ok)";
        }
        String line = "Monitor: " + String.join(", ", flagged);
        if (worst[LoopCondition.OSCILLATION.ordinal()] != ConditionStatus.OK) {
            line += String.format(Locale.ROOT, " (period %.3g s, amplitude %.3g): the loop hunts",
                    atWorst.oscillationPeriodSeconds(), atWorst.oscillationAmplitude());
        }
        return line;
    }

    private static double finiteAbs(double v) {
        return Double.isFinite(v) ? Math.abs(v) : 0.0;
    }
}
