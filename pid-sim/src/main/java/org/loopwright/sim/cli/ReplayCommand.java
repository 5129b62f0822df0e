package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.replay.Replay;
import org.loopwright.sim.replay.ReplayDemo;
import org.loopwright.sim.replay.ReplaySummary;
import org.loopwright.sim.replay.TraceReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code replay}: runs a logged trace through a controller file, one update per row, writes the
 * trace's columns (a logged {@code output} renamed {@code logged_output}) plus {@code output,
 * proportional, integral, derivative, status} to a CSV file and prints a summary. The trace is
 * streamed in batches of rows ({@link Replay#stream}), so memory does not grow with it. With neither
 * {@code --controller} nor {@code --trace} it replays the built-in
 * water bath demo. Exit code 0 on success, 2 with a file:line:column (or file: row, column)
 * message for bad input.
 */
@Command(name = "replay", mixinStandardHelpOptions = true,
        description = {"Run a logged trace through a controller file, one update per row, and write the outputs.",
                "Without --controller and --trace, replays the built-in water bath demo (invented demo data)."})
public final class ReplayCommand implements Callable<Integer> {

    /** Where the output goes when --out is not given: a folder named after the command, as the others write into. */
    private static final String DEFAULT_OUT = "loopwright-replay/replay-output.csv";

    @Spec
    private CommandSpec spec;

    @Option(names = "--controller", paramLabel = "CONTROLLER.yaml", description = "The controller file (YAML).")
    private Path controllerFile;

    @Option(names = "--trace", paramLabel = "TRACE.csv",
            description = "The trace: CSV with columns time,setpoint,measurement and optionally feedforward,"
                    + " mode (auto|manual|track), manual_output, track_value, output (the logged controller output,"
                    + " written back as logged_output); other columns are passed through.")
    private Path traceFile;

    @Option(names = "--out", paramLabel = "OUT.csv", description = "Where to write the output CSV, its folder created if"
            + " need be (default: " + DEFAULT_OUT + ").")
    private Path outFile;

    @Option(names = "--measured-period",
            description = "Take each row's period from the time column (the first row uses the configured"
                    + " sample period); without it every update uses the configured sample period.")
    private boolean measuredPeriod;

    @Option(names = "--start-from-logged-output",
            description = {"Start the controller where the logged one was: the first row is replayed in tracking"
                    + " mode on its logged output column, then the controller goes to automatic bumplessly.",
                    "Needs an output column in the trace (kept in the result as logged_output)."})
    private boolean startFromLoggedOutput;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        if ((controllerFile == null) != (traceFile == null)) {
            throw new InputException("replay needs both --controller and --trace, or neither for the built-in demo",
                    null);
        }
        boolean demo = controllerFile == null;
        String controllerName = demo ? ReplayDemo.CONTROLLER_NAME : controllerFile.toString();
        String traceName = demo ? ReplayDemo.TRACE_NAME : traceFile.toString();
        if (demo) {
            out.println("No --controller or --trace given: replaying the built-in demo, a water bath heater"
                    + " (invented demo data).");
        }
        ControllerSettings settings = demo
                ? ControllerFile.read(YamlDocument.parse(controllerName, ReplayDemo.controllerText()), "")
                : ControllerFile.read(controllerFile);
        Path target = (outFile == null ? Path.of(DEFAULT_OUT) : outFile).toAbsolutePath();
        if (Files.isDirectory(target)) {
            throw InputException.option("--out", target, "must name a file, not a directory");
        }
        ReplaySummary summary;
        try (TraceReader trace = demo ? TraceReader.of(traceName, new StringReader(ReplayDemo.traceText()))
                : TraceReader.open(traceFile);
                OutputStage stage = OutputStage.in(target.getParent(), "--out")) {
            try (OutputStream file = Files.newOutputStream(stage.directory().resolve(target.getFileName().toString()))) {
                summary = Replay.stream(settings, trace, measuredPeriod, startFromLoggedOutput, file);
            }
            stage.commit();
        }
        out.println("Replayed " + traceName + " through " + controllerName + " ("
                + (measuredPeriod ? "measured periods from the time column"
                        : "fixed period " + settings.samplePeriodSeconds() + " s")
                + (startFromLoggedOutput ? ", started from the logged output" : "") + ")");
        summary.lines().forEach(out::println);
        out.println("Wrote " + summary.rows() + " rows to " + target);
        out.flush();
        return 0;
    }

}
