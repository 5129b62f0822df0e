package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.stream.Stream;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.pid.tuning.IntegratingModel;
import org.loopwright.pid.tuning.ProcessModel;
import org.loopwright.pid.tuning.SopdtModel;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.design.Design;
import org.loopwright.sim.design.DesignModel;
import org.loopwright.sim.design.DesignResult;
import org.loopwright.sim.design.DesignSpec;
import org.loopwright.sim.identify.IdentifiedModel;
import org.loopwright.sim.identify.ModelKind;
import org.loopwright.sim.identify.StepIdentification;
import org.loopwright.sim.identify.StepTest;
import org.loopwright.sim.identify.StepTestFile;
import org.loopwright.sim.plant.PlantModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.report.ReportRecord;
import org.loopwright.sim.scenario.ScenarioFile;
import org.loopwright.sim.sweep.Spread;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code design}: from a step test or a model to settings one can load, with the evidence. Fits the
 * model (or takes the one given), proposes every published rule that applies and the optimised design
 * (largest integral gain with a stable sampled loop and Ms within the limit), checks each on the
 * sampled loop, in simulation with the device's limits and across plant uncertainty, recommends one,
 * and writes {@code controller.yaml}, {@code scenario.yaml}, {@code candidates.csv}, {@code design.json}
 * and {@code report.html} into DIR. See {@link Design} and {@link org.loopwright.sim.design.DesignExperiment}.
 * Exit code 2 for bad input; 0 also when no candidate meets the constraints (the verdict says so).
 */
@Command(name = "design", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"From a step test or a model to verified settings: candidates by every published rule that"
                + " applies and the optimised design (max-integral-gain: the largest integral gain with a stable"
                + " sampled loop and Ms within the limit), each checked on the sampled loop, in simulation with the"
                + " output limits and across plant uncertainty; one recommendation, a controller file, a scenario and"
                + " a report.",
                "Give one of: --step-test STEP.csv | --plant PLANT.yaml | --process-gain K --time-constant T"
                        + " [--second-time-constant T2] --dead-time L | --process-gain K --integrating --dead-time L"
                        + " [--time-constant T]."})
public final class DesignCommand implements Callable<Integer> {

    /** SOPDT is kept over FOPDT when it lowers the step test's RMSE by at least this share. */
    public static final double SOPDT_RMSE_GAIN = 0.2;

    @Spec
    private CommandSpec spec;

    @Option(names = "--step-test", paramLabel = "STEP.csv", description = "A bump test, CSV with columns time,input,output.")
    private Path stepTest;

    @Option(names = "--model", paramLabel = "KIND", defaultValue = "auto", converter = OptionWords.ModelChoices.class,
            completionCandidates = OptionWords.ModelChoices.class,
            description = "The model fitted to the step test, ${COMPLETION-CANDIDATES}; auto keeps sopdt when it lowers"
                    + " the RMSE by 20 %% or more (default: ${DEFAULT-VALUE}).")
    private OptionWords.ModelChoices.Choice modelChoice;

    @Option(names = "--plant", paramLabel = "PLANT.yaml",
            description = "A file with one plant: block of the scenario format (fopdt, sopdt with real time constants,"
                    + " integrating; as identify --write-plant writes it).")
    private Path plantFile;

    @Mixin
    private ModelOptions modelOptions;

    @Option(names = "--sample-period", paramLabel = "H", required = true,
            description = "The controller's sample period on the device in seconds (required).")
    private double samplePeriod;

    @Option(names = "--output-slew", paramLabel = "S", description = "Output slew limit, units per second (default: none).")
    private Double outputSlew;

    @Option(names = "--sensor-delay-samples", paramLabel = "N", defaultValue = "0",
            description = "Whole samples of measurement delay (default: ${DEFAULT-VALUE}).")
    private int sensorDelay;

    @Option(names = "--max-sensitivity", paramLabel = "MS", defaultValue = "1.4",
            description = "The limit on the sampled loop's Ms (default: ${DEFAULT-VALUE}).")
    private double maxSensitivity;

    @Option(names = "--type", paramLabel = "TYPE", defaultValue = "auto", converter = OptionWords.DesignTypes.class,
            completionCandidates = OptionWords.DesignTypes.class,
            description = "${COMPLETION-CANDIDATES}: PI, PID, or both (default: ${DEFAULT-VALUE}).")
    private OptionWords.DesignTypes.Choice types;

    @Option(names = "--integral-method", paramLabel = "M", defaultValue = "tustin",
            converter = OptionWords.IntegralMethods.class, completionCandidates = OptionWords.IntegralMethods.class,
            description = "${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
    private IntegralMethod integralMethod;

    @Option(names = "--derivative-method", paramLabel = "M", defaultValue = "backward-euler",
            converter = OptionWords.DerivativeMethods.class, completionCandidates = OptionWords.DerivativeMethods.class,
            description = "${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
    private DerivativeMethod derivativeMethod;

    @Option(names = "--spread", paramLabel = "KEY=P%[,...]", defaultValue = "gain=20%,time-constant=20%,dead-time=20%",
            description = "Plant uncertainty of the robustness sweep (default: ${DEFAULT-VALUE}).")
    private String spreadText;

    @Option(names = "--runs", paramLabel = "N", defaultValue = "200",
            description = "Sweep runs per candidate (default: ${DEFAULT-VALUE}).")
    private int runs;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Seed of the sweep (default: ${DEFAULT-VALUE}).")
    private long seed;

    /** --json prints design.json. */
    @Mixin
    private OutputOptions output;

    @Mixin
    private ProgressOption progressOption;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        DesignSpec designSpec = specification();
        DesignModel model = model();
        int threads = Runtime.getRuntime().availableProcessors();
        DesignResult result;
        try (SweepProgress progress = progressOption.progress(output.json(), Design.progressSteps(designSpec))) {
            result = Design.run(model, designSpec, threads, progress);
        }
        // the report's record: the command line, the input files with their SHA-256, the recommended settings in full
        List<Path> inputs = Stream.of(stepTest, plantFile).filter(Objects::nonNull).toList();
        ReportRecord record = ReportRecord.of(BuildVersion.line(), spec.root().commandLine().getParseResult()
                .originalArgs(), inputs, result.recommended().map(c -> ControllerFile.resolved(c.device()))
                .orElse(Map.of()));
        List<String> files;
        // staged, then moved: a run that fails half way leaves no half-written file behind
        try (OutputStage stage = output.stage()) {
            files = DesignFiles.write(result, stage.directory(), record);
            stage.commit();
        }
        if (output.json()) {
            out.println(JsonOutput.text(DesignFiles.json(result, files)));
        } else {
            DesignFiles.printText(out, result, files, output.directory());
        }
        out.flush();
        return 0;
    }

    private DesignSpec specification() {
        return new DesignSpec(samplePeriod, modelOptions.outputMin(), modelOptions.outputMax(),
                outputSlew == null ? Double.POSITIVE_INFINITY : outputSlew, sensorDelay, maxSensitivity, types.types(),
                integralMethod, derivativeMethod, Spread.parse(spreadText), runs, seed);
    }

    private DesignModel model() {
        boolean fromOptions = modelOptions.given();
        int sources = (stepTest != null ? 1 : 0) + (plantFile != null ? 1 : 0) + (fromOptions ? 1 : 0);
        if (sources != 1) {
            throw new InputException("give one model: --step-test STEP.csv, --plant PLANT.yaml, or"
                    + " --process-gain with --time-constant and --dead-time (or --integrating and --dead-time)"
                    + (sources == 0 ? "" : "; more than one was given"));
        }
        if (stepTest == null && modelChoice.kind().isPresent()) {
            throw new InputException("--model applies to --step-test only: --model=" + modelChoice.kind().get().label());
        }
        if (stepTest != null) {
            return fromStepTest();
        }
        if (plantFile != null) {
            return DesignModel.given(fromPlant(plantFile), "plant-file");
        }
        return DesignModel.given(modelOptions.model(), "options");
    }

    private DesignModel fromStepTest() {
        StepTest test = StepTestFile.read(stepTest);
        if (modelChoice.kind().isPresent()) {
            IdentifiedModel fit = StepIdentification.identify(test, modelChoice.kind().get());
            String choice = modelChoice.kind().get().label();
            return new DesignModel(fit.processModel(), "step-test", Optional.of(test), Optional.of(fit),
                    choice + " as asked (--model " + choice + ")");
        }
        IdentifiedModel first = StepIdentification.identify(test, ModelKind.FOPDT);
        IdentifiedModel second;
        try {
            second = StepIdentification.identify(test, ModelKind.SOPDT);
        } catch (InputFileException noFit) {
            return new DesignModel(first.processModel(), "step-test", Optional.of(test),
                    Optional.of(first), "fopdt: the second-order fit did not converge");
        }
        double gain = 1.0 - second.rmse() / first.rmse();
        // whole percent, as a long: a sopdt fit no better than fopdt's reads "0 % lower", never "-0 %"
        String figures = String.format(Locale.ROOT, "RMSE %.4g against %.4g for fopdt, %d %% lower",
                second.rmse(), first.rmse(), Math.round(100.0 * gain));
        if (gain >= SOPDT_RMSE_GAIN) {
            return new DesignModel(second.processModel(), "step-test", Optional.of(test),
                    Optional.of(second), "sopdt kept: " + figures + " (at least "
                            + Math.round(100 * SOPDT_RMSE_GAIN) + " % lower asked): the data shows a second lag");
        }
        return new DesignModel(first.processModel(), "step-test", Optional.of(test),
                Optional.of(first), "fopdt kept: sopdt's " + figures + ", less than the "
                        + Math.round(100 * SOPDT_RMSE_GAIN) + " % that would justify a parameter more");
    }

    /** The plant file's model as a process model the rules take, or why it is none. */
    static ProcessModel fromPlant(Path file) {
        PlantModel plant = ScenarioFile.readPlant(file);
        TransferFunction tf = plant.linear().orElseThrow(() -> InputFileException.whole(file.toString(),
                "design needs a linear plant (fopdt, sopdt, integrating): plant.type=" + plant.type().word()));
        double[] num = tf.numerator();
        double[] den = tf.denominator();
        double l = tf.deadTimeSeconds();
        String unsupported = "design needs a first-order, second-order (real time constants) or integrating plant"
                + " with a constant numerator: plant=" + tf;
        if (num.length != 1) {
            throw InputFileException.whole(file.toString(), unsupported);
        }
        double k = num[0];
        double last = den[den.length - 1];
        try {
            if (den.length == 2 && last != 0.0) {
                return new FopdtModel(k / last, den[0] / last, l);
            }
            if (den.length == 3 && last != 0.0) {
                double sum = den[1] / last;
                double product = den[0] / last;
                double discriminant = sum * sum - 4.0 * product;
                if (discriminant >= 0.0 && product > 0.0 && sum > 0.0) {
                    double root = Math.sqrt(discriminant);
                    return new SopdtModel(k / last, 0.5 * (sum + root), 0.5 * (sum - root), l);
                }
            }
            if (den.length == 2 && last == 0.0) {
                return new IntegratingModel(k / den[0], 0.0, l);
            }
            if (den.length == 3 && last == 0.0 && den[1] != 0.0) {
                return new IntegratingModel(k / den[1], den[0] / den[1], l);
            }
        } catch (InvalidSettingException e) {
            throw InputFileException.whole(file.toString(), unsupported);
        }
        throw InputFileException.whole(file.toString(), unsupported);
    }
}
