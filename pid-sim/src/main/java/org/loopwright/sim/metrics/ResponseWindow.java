package org.loopwright.sim.metrics;

import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

/**
 * The stretch of a run that the step figures describe: from the first setpoint change (0 without
 * one) to the next setpoint change or load step after it (or the end of the run, +infinity).
 *
 * @param startSeconds where the step figures start
 * @param endSeconds   where they stop looking (the integral criteria run to the end of the run)
 */
public record ResponseWindow(double startSeconds, double endSeconds) {

    /** The window of a scenario. */
    public static ResponseWindow of(Scenario scenario) {
        double start = scenario.setpoint().isEmpty() ? 0.0 : scenario.setpoint().get(0).atSeconds();
        double end = Double.POSITIVE_INFINITY;
        for (SetpointChange change : scenario.setpoint()) {
            if (change.atSeconds() > start) {
                end = change.atSeconds();
                break;
            }
        }
        for (LoadStep load : scenario.disturbances()) {
            if (load.atSeconds() > start) {
                end = Math.min(end, load.atSeconds());
                break;
            }
        }
        return new ResponseWindow(start, end);
    }

    /** "from 0 s to 3600 s", or "from 0 s to the end" for an open window. */
    public String describe() {
        return "from " + seconds(startSeconds) + " s to "
                + (Double.isInfinite(endSeconds) ? "the end" : seconds(endSeconds) + " s");
    }

    private static String seconds(double value) {
        return value == Math.rint(value) && Math.abs(value) < 1e15 ? Long.toString((long) value) : Double.toString(value);
    }
}
