package org.loopwright.sim.cli;

import java.util.Map;

import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.IntegratingModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.sim.config.InputException;

import picocli.CommandLine.Option;

/**
 * The options of a process model given on the command line ({@code --process-gain}, {@code --time-constant},
 * {@code --second-time-constant}, {@code --integrating}, {@code --dead-time}) and the device's output
 * limits, declared once for {@code tune} and {@code design}, with their one reading.
 */
final class ModelOptions {

    /** The models' field names as the options the user typed. */
    static final Map<String, String> OPTION_OF_FIELD = Map.of(
            "processGain", "--process-gain", "timeConstantSeconds", "--time-constant",
            "deadTimeSeconds", "--dead-time", "ultimateGain", "--ultimate-gain",
            "ultimatePeriodSeconds", "--ultimate-period", "secondTimeConstantSeconds", "--second-time-constant",
            "lagSeconds", "--time-constant");

    @Option(names = "--process-gain", paramLabel = "K",
            description = "Process gain K (measurement units per output unit; per second for --integrating).")
    private Double processGain;

    @Option(names = "--time-constant", paramLabel = "T",
            description = "Time constant T in seconds (the lag of an integrating process, optional there).")
    private Double timeConstant;

    @Option(names = "--second-time-constant", paramLabel = "T2",
            description = "Second time constant T2 <= T in seconds: a second-order-plus-dead-time model.")
    private Double secondTimeConstant;

    @Option(names = "--integrating", description = "The process integrates (a level, a position): K is its rate.")
    private boolean integrating;

    @Option(names = "--dead-time", paramLabel = "L", description = "Dead time L in seconds.")
    private Double deadTime;

    @Option(names = "--output-min", paramLabel = "A", description = "Lower output limit (default: none).")
    private Double outputMin;

    @Option(names = "--output-max", paramLabel = "B", description = "Upper output limit (default: none).")
    private Double outputMax;

    /** @return whether any model option was given */
    boolean given() {
        return processGain != null || timeConstant != null || deadTime != null || secondTimeConstant != null
                || integrating;
    }

    /**
     * The model the options describe: integrating, second or first order plus dead time.
     *
     * @return the model
     * @throws InputException naming the missing or conflicting option, or the bad value in option terms
     */
    ProcessModel model() {
        return OptionChecks.inOptionTerms(OPTION_OF_FIELD, this::modelOrInvalid);
    }

    private ProcessModel modelOrInvalid() {
        if (processGain == null || deadTime == null) {
            throw new InputException("a model needs --process-gain and --dead-time"
                    + (integrating ? "" : ", and --time-constant"));
        }
        if (integrating) {
            if (secondTimeConstant != null) {
                throw new InputException("--integrating takes one lag (--time-constant), not --second-time-constant:"
                        + " --second-time-constant=" + secondTimeConstant);
            }
            return new IntegratingModel(processGain, timeConstant == null ? 0.0 : timeConstant, deadTime);
        }
        if (timeConstant == null) {
            throw new InputException("a self-regulating model needs --time-constant (or give --integrating)");
        }
        return secondTimeConstant == null ? new FopdtModel(processGain, timeConstant, deadTime)
                : new SopdtModel(processGain, timeConstant, secondTimeConstant, deadTime);
    }

    /** @return the lower output limit, minus infinity when not given */
    double outputMin() {
        return outputMin == null ? Double.NEGATIVE_INFINITY : outputMin;
    }

    /** @return the upper output limit, infinity when not given */
    double outputMax() {
        return outputMax == null ? Double.POSITIVE_INFINITY : outputMax;
    }
}
