package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

import com.fasterxml.jackson.databind.node.ObjectNode;

import org.loopwright.pid.tuning.FopdtModel;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.identify.IdentificationPlot;
import org.loopwright.sim.identify.IdentifiedModel;
import org.loopwright.sim.identify.ModelKind;
import org.loopwright.sim.identify.StepIdentification;
import org.loopwright.sim.identify.StepTest;
import org.loopwright.sim.identify.StepTestFile;
import org.loopwright.sim.scenario.PlantBlock;

import picocli.CommandLine.Command;
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

    @Option(names = "--out", paramLabel = "DIR", defaultValue = ".",
            description = "Where to write the plot identify-<model>.png (default: the current directory).")
    private Path outDirectory;

    @Option(names = "--write-plant", paramLabel = "FILE.yaml",
            description = "Write the fitted model as a plant: block of the scenario format (design --plant reads it).")
    private Path plantOut;

    @Option(names = "--json", description = "Print JSON instead of text.")
    private boolean json;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        StepTest test = StepTestFile.read(file);
        IdentifiedModel fit = StepIdentification.identify(test, kind);
        Path plot = writePlot(test, fit, kind);
        if (plantOut != null) {
            writePlant(fit);
        }
        if (json) {
            ObjectNode node = json(fit);
            node.put("rows_in_file", test.rowsInFile());
            node.put("kept_every", test.keptEvery());
            out.println(Json.pretty(node));
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
        try (OutputStage stage = OutputStage.in(outDirectory, "--out")) {
            IdentificationPlot.writePng(stage.directory().resolve(name), test, fit);
            stage.commit();
        }
        return outDirectory.resolve(name);
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

    private static ObjectNode json(IdentifiedModel fit) {
        ObjectNode node = Json.object();
        node.put("model", fit.kind().label());
        Json.number(node, "gain", fit.gain());
        double[] lags = fit.timeConstants();
        if (fit.kind() == ModelKind.FOPDT) {
            Json.number(node, "time_constant", lags[0]);
        } else {
            node.putArray("time_constants").add(lags[0]).add(lags[1]);
        }
        Json.number(node, "dead_time", fit.deadTimeSeconds());
        Json.number(node, "baseline", fit.baseline());
        Json.number(node, "step_time", fit.step().timeSeconds());
        Json.number(node, "input_change", fit.step().change());
        Json.number(node, "rmse", fit.rmse());
        Json.number(node, "r_squared", fit.rSquared());
        return node;
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
