package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.tuning.ControllerType;
import org.loopwright.pid.tuning.RelayStatus;
import org.loopwright.pid.tuning.TunedGains;
import org.loopwright.pid.tuning.TuningResult;
import org.loopwright.pid.tuning.UltimatePointRule;
import org.loopwright.pid.tuning.UltimatePoint;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.tuning.RelaySimulation;
import org.loopwright.sim.tuning.TuningCandidate;
import org.loopwright.sim.tuning.TuningEvaluation;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code autotune}: runs the relay experiment on a scenario's plant in simulation (see
 * {@link RelaySimulation} for the procedure and defaults), then tunes from the measured ultimate
 * point by Ziegler–Nichols and Tyreus–Luyben, PI and PID, and verifies each suggestion on the
 * scenario (its own setpoint profile and disturbances, margins when the plant is linear). Exit code
 * 2 for bad input or when the experiment aborts (the reason is printed).
 */
@Command(name = "autotune", mixinStandardHelpOptions = true,
        description = "Relay experiment on a scenario's plant in simulation, then tune from the ultimate point and"
                + " verify each suggestion on the scenario.")
public final class AutotuneCommand implements Callable<Integer> {

    /** The relay settings' field names as the options that set them. */
    private static final Map<String, String> OPTION_OF_FIELD = Map.of("relayAmplitude", "--relay-amplitude",
            "hysteresis", "--hysteresis", "excursionLimit", "--excursion-limit");

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO.yaml", description = "The scenario (plant, controller, sensor...).")
    private Path scenarioFile;

    @Option(names = "--relay-amplitude", paramLabel = "D",
            description = "Relay amplitude d: the output switches between bias - d and bias + d (default: 10 %% of the"
                    + " controller's output range).")
    private Double relayAmplitude;

    @Option(names = "--hysteresis", paramLabel = "E",
            description = "Relay hysteresis around the setpoint, process units (default: 3 sigma of the sensor noise).")
    private Double hysteresis;

    @Option(names = "--excursion-limit", paramLabel = "BAND",
            description = "Abort when the process variable leaves setpoint +/- BAND (default: 25 %% of the setpoint, or 1 at setpoint 0).")
    private Double excursionLimit;

    @Option(names = "--write-controller", paramLabel = "FILE.yaml",
            description = "Write one suggestion as a controller file: the scenario's controller with its gains"
                    + " (choose it with --rule and --type).")
    private Path controllerOut;

    @Option(names = "--rule", paramLabel = "R", defaultValue = "tyreus-luyben",
            converter = OptionWords.UltimatePointRules.class, completionCandidates = OptionWords.UltimatePointRules.class,
            description = "The suggestion --write-controller writes: ${COMPLETION-CANDIDATES}"
                    + " (default: ${DEFAULT-VALUE}, the better damped of the two).")
    private UltimatePointRule written;

    @Option(names = "--type", paramLabel = "TYPE", defaultValue = "pi", converter = OptionWords.ControllerTypes.class,
            completionCandidates = OptionWords.ControllerTypes.class,
            description = "${COMPLETION-CANDIDATES} for --write-controller (default: ${DEFAULT-VALUE}).")
    private ControllerType writtenType;

    @Mixin
    private JsonOption output;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        Scenario scenario = ScenarioFile.read(scenarioFile);
        if (scenario.inner().isPresent() || scenario.schedule().isPresent() || scenario.splitRange().isPresent()) {
            throw new InputException(scenarioFile + ": autotune runs a relay on a single loop with fixed gains and one"
                    + " actuator: " + (scenario.inner().isPresent() ? "inner" : scenario.schedule().isPresent()
                    ? "controller.schedule" : "split-range") + " is given");
        }
        // the relay settings name their fields; a refusal is said with the options the user typed
        RelaySimulation.Outcome relay = OptionChecks.inOptionTerms(OPTION_OF_FIELD, () -> RelaySimulation.run(scenario,
                orNaN(relayAmplitude), orNaN(hysteresis), orNaN(excursionLimit)));
        if (relay.status() != RelayStatus.SUCCEEDED) {
            throw new InputException("relay experiment " + relay.status().name().toLowerCase(Locale.ROOT) + ": "
                    + relay.message());
        }
        if (relay.periodSetBySampling()) {
            throw new InputException("relay experiment: ultimate gain Ku " + TuningReport.num(relay.ultimateGain())
                    + ", ultimate period Pu " + TuningReport.num(relay.ultimatePeriodSeconds()) + " s; "
                    + relay.warnings().get(0));
        }
        UltimatePoint point = new UltimatePoint(relay.ultimateGain(), relay.ultimatePeriodSeconds());
        ControllerSettings base = scenario.controller().orElseThrow();
        List<TuningCandidate> suggestions = new ArrayList<>();
        for (ControllerType type : ControllerType.values()) {
            for (UltimatePointRule rule : UltimatePointRule.values()) {
                TuningResult result = rule.tune(point, type);
                if (result instanceof TunedGains tuned) {
                    suggestions.add(TuningEvaluation.onScenario(tuned, scenario, base));
                }
            }
        }
        TuningCandidate chosen = suggestions.stream().filter(c -> c.tuning().rule() == written
                && c.tuning().type() == writtenType).findFirst().orElseThrow();
        if (controllerOut != null) {
            if (chosen.stable().orElse(true) == Boolean.FALSE) {
                throw new InputException("--write-controller: " + written.label() + " makes the sampled loop"
                        + " UNSTABLE; no file written");
            }
            TuneCommand.write(controllerOut, ControllerFile.toYaml(chosen.settings()));
        }
        if (output.json()) {
            out.println(JsonOutput.text(new AutotuneJson(relay.ultimateGain(), relay.ultimatePeriodSeconds(),
                    relay.amplitude(), relay.cycles(), relay.settings().setpoint(), relay.settings().bias(),
                    relay.settings().relayAmplitude(), relay.settings().hysteresis(), relay.warnings(),
                    TuningReport.json(suggestions))));
        } else {
            RelaySimulationText.print(out, relay);
            TuningReport.printTable(out, suggestions, List.of());
            if (controllerOut != null) {
                out.println("Wrote " + controllerOut + " (" + written.label() + ", "
                        + OptionWords.CONTROLLER_TYPES.word(writtenType) + ")");
            }
        }
        out.flush();
        return 0;
    }

    /**
     * The relay experiment and the suggestions as JSON.
     *
     * @param ultimateGain         Ku from the relay's describing function
     * @param ultimatePeriod       Pu, s
     * @param oscillationAmplitude the process variable's oscillation amplitude
     * @param cycles               the cycles measured
     * @param setpoint             the relay's setpoint
     * @param bias                 the relay's output bias
     * @param relayAmplitude       the relay's output amplitude
     * @param hysteresis           the relay's hysteresis
     * @param warnings             what limits the result, in words
     * @param suggestions          each rule's settings, checked on the scenario
     */
    record AutotuneJson(double ultimateGain, double ultimatePeriod, double oscillationAmplitude, int cycles,
            double setpoint, double bias, double relayAmplitude, double hysteresis, List<String> warnings,
            List<TuningReport.CandidateJson> suggestions) {
    }

    private static double orNaN(Double value) {
        return value == null ? Double.NaN : value;
    }

    /** The relay experiment's account in text. */
    private static final class RelaySimulationText {
        private RelaySimulationText() {
        }

        static void print(PrintWriter out, RelaySimulation.Outcome relay) {
            out.println("Relay experiment (simulated): setpoint " + TuningReport.num(relay.settings().setpoint())
                    + ", bias " + TuningReport.num(relay.settings().bias()) + ", relay amplitude "
                    + TuningReport.num(relay.settings().relayAmplitude()) + ", hysteresis "
                    + TuningReport.num(relay.settings().hysteresis()));
            out.println("  " + relay.message() + " (" + relay.cycles() + " cycles in all)");
            out.println("  ultimate gain Ku " + TuningReport.num(relay.ultimateGain()) + ", ultimate period Pu "
                    + TuningReport.num(relay.ultimatePeriodSeconds()) + " s (describing function,"
                    + " Astrom & Hagglund 1984)");
            relay.warnings().forEach(w -> out.println("  WARNING: " + w));
            out.println("Suggestions, each simulated on the scenario:");
        }
    }
}
