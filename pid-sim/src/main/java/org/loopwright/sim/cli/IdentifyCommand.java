package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.sim.identify.IdentificationPlot;
import org.loopwright.sim.identify.IdentifiedModel;
import org.loopwright.sim.identify.ModelKind;
import org.loopwright.sim.identify.StepIdentification;
import org.loopwright.sim.identify.StepTest;
import org.loopwright.sim.identify.StepTestFile;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.scenario.PlantBlock;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code identify}: fits a first- or second-order-plus-dead-time model to a step test (CSV columns
 * {@code time,input,output}), prints the parameters with RMSE and R², and writes a PNG of the data
 * with the fitted response to the output directory. Exit code 2 for bad input (a file error names
 * the file, row and column; data without a step says so).
 */
@Command(name = "identify", mixinStandardHelpOptions = true,
        description = {"Fit a first- or second-order-plus-dead-time model to a step test (CSV: time,input,output).",
                "The file is read a row at a time; a record longer than " + 2 * StepTestFile.FIT_ROWS + " rows is"
                        + " thinned to every k-th row (k a power of two) and the output says so."})
public final class IdentifyCommand implements Callable<Integer> {

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STEP.csv", description = "The step test: CSV with columns time,input,output.")
    private Path file;

    @Option(names = "--model", paramLabel = "KIND", defaultValue = "fopdt", converter = OptionWords.ModelKinds.class,
            completionCandidates = OptionWords.ModelKinds.class,
            description = "First or second order plus dead time: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
    private ModelKind kind;

    /** The plot identify-MODEL.png goes into --out (default: loopwright-identify). */
    @Mixin
    private OutputOptions output;

    @Option(names = "--write-plant", paramLabel = "FILE.yaml",
            description = "Write the fitted model as a plant: block of the scenario format (design --plant reads it).")
    private Path plantOut;


    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        StepTest test = StepTestFile.read(file);
        IdentifiedModel fit = StepIdentification.identify(test, kind);
        Path plot = writePlot(test, fit, kind);
        if (plantOut != null) {
            writePlant(fit);
        }
        if (output.json()) {
            out.println(JsonOutput.text(ModelJson.of(fit, test)));
        } else {
            if (test.keptEvery() > 1) {
                out.println(thinningNote(test));
            }
            printText(out, fit, plot);
            if (plantOut != null) {
                out.println("Wrote " + plantOut);
            }
        }
        out.flush();
        return 0;
    }

    private Path writePlot(StepTest test, IdentifiedModel fit, ModelKind kind) throws IOException {
        String name = "identify-" + kind.label() + ".png";
        Path directory = output.directory();
        try (OutputStage stage = output.stage()) {
            IdentificationPlot.writePng(stage.directory().resolve(name), test, fit);
            stage.commit();
        }
        return directory.resolve(name);
    }

    private static String thinningNote(StepTest test) {
        return "Note: " + test.rowsInFile() + " rows are more than the fit takes (" + 2 * StepTestFile.FIT_ROWS
                + "): fitted on every " + test.keptEvery() + "th row (" + test.length() + " rows, the rows at each"
                + " change of the input kept), so times are resolved to " + test.keptEvery() + " sample periods";
    }

    private void writePlant(IdentifiedModel fit) throws IOException {
        String text = String.format(Locale.ROOT, "# %s fitted by identify to %s: RMSE %.4g, R² %.5f%n", fit.kind().label(),
                file.getFileName(), fit.rmse(), fit.rSquared()) + PlantBlock.yaml(fit.processModel());
        Path absolute = plantOut.toAbsolutePath();
        try (OutputStage stage = OutputStage.in(absolute.getParent(), "--write-plant")) {
            Files.writeString(stage.directory().resolve(absolute.getFileName().toString()), text,
                    StandardCharsets.UTF_8);
            stage.commit();
        }
    }

    /**
     * The fitted model as JSON; {@code tune --model-file} and {@code design} read it back.
     *
     * @param model          fopdt or sopdt
     * @param gain           process gain K
     * @param timeConstant   T of a first-order model, s; null for sopdt
     * @param timeConstants  [T1, T2] of a second-order model, s; null for fopdt
     * @param deadTime       L, s
     * @param baseline       the output before the step
     * @param stepTime       when the input stepped, s
     * @param inputChange    the input's step
     * @param rmse           root-mean-square error of the fit
     * @param rSquared       coefficient of determination of the fit
     * @param rowsInFile     rows read from the file
     * @param keptEvery      every how many rows were kept (a long record is thinned)
     */
    record ModelJson(String model, double gain, double timeConstant, List<Double> timeConstants, double deadTime,
            double baseline, double stepTime, double inputChange, double rmse, double rSquared, long rowsInFile,
            int keptEvery) {

        static ModelJson of(IdentifiedModel fit, StepTest test) {
            double[] lags = fit.timeConstants();
            boolean first = fit.kind() == ModelKind.FOPDT;
            return new ModelJson(fit.kind().label(), fit.gain(), first ? lags[0] : Double.NaN,
                    first ? null : List.of(lags[0], lags[1]), fit.deadTimeSeconds(), fit.baseline(),
                    fit.step().timeSeconds(), fit.step().change(), fit.rmse(), fit.rSquared(), test.rowsInFile(),
                    test.keptEvery());
        }
    }

    private static void printText(PrintWriter out, IdentifiedModel fit, Path plot) {
        double[] lags = fit.timeConstants();
        out.println("Step in the input at t=" + TuningReport.num(fit.step().timeSeconds()) + " s: "
                + TuningReport.num(fit.step().initialInput()) + " -> " + TuningReport.num(fit.step().finalInput()));
        out.println("Model: " + fit.kind().label() + ", gain " + TuningReport.num(fit.gain())
                + (fit.kind() == ModelKind.FOPDT ? ", time constant " + TuningReport.num(lags[0]) + " s"
                        : ", time constants " + TuningReport.num(lags[0]) + " s and " + TuningReport.num(lags[1]) + " s")
                + ", dead time " + TuningReport.num(fit.deadTimeSeconds()) + " s");
        out.println(String.format(Locale.ROOT, "Fit: RMSE %.4g, R² %.5f (least squares, Levenberg-Marquardt, from"
                + " Smith's two-point estimate)", fit.rmse(), fit.rSquared()));
        FopdtModel reduced = fit.toFopdt();
        out.println("Tune it with: tune --process-gain " + TuningReport.num(reduced.processGain()) + " --time-constant "
                + TuningReport.num(reduced.timeConstantSeconds()) + " --dead-time "
                + TuningReport.num(reduced.deadTimeSeconds())
                + (fit.kind() == ModelKind.SOPDT ? "  (reduced to first order by Skogestad's half rule)" : ""));
        out.println("Wrote " + plot.toAbsolutePath());
    }
}
