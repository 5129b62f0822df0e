package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputFileException;
import org.loopwright.sim.config.YamlDocument;
import org.loopwright.sim.replay.Replay;
import org.loopwright.sim.replay.ReplayDemo;
import org.loopwright.sim.replay.ReplayResult;
import org.loopwright.sim.replay.ReplaySummary;
import org.loopwright.sim.replay.Trace;
import org.loopwright.sim.replay.TraceFile;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code replay}: runs a logged trace through a controller file, one update per row, writes the
 * trace's columns plus {@code output, proportional, integral, derivative, status} to a CSV file and
 * prints a summary. With neither {@code --controller} nor {@code --trace} it replays the built-in
 * water bath demo. Exit code 0 on success, 2 with a file:line:column (or file: row, column)
 * message for bad input.
 */
@Command(name = "replay", mixinStandardHelpOptions = true,
        description = {"Run a logged trace through a controller file, one update per row, and write the outputs.",
                "Without --controller and --trace, replays the built-in water bath demo (invented demo data)."})
public final class ReplayCommand implements Callable<Integer> {

    /** Where the output goes when --out is not given: this file in the current directory. */
    public static final String DEFAULT_OUT = "loopwright-replay/replay-output.csv";

    @Spec
    private CommandSpec spec;

    @Option(names = "--controller", paramLabel = "CONTROLLER.yaml", description = "The controller file (YAML).")
    private Path controllerFile;

    @Option(names = "--trace", paramLabel = "TRACE.csv",
            description = "The trace: CSV with columns time,setpoint,measurement and optionally feedforward,"
                    + " mode (auto|manual|track), manual_output, track_value; other columns are passed through.")
    private Path traceFile;

    @Option(names = "--out", paramLabel = "OUT.csv", description = "Where to write the output CSV (default: "
            + DEFAULT_OUT + ").")
    private Path outFile;

    @Option(names = "--measured-period",
            description = "Take each row's period from the time column (the first row uses the configured"
                    + " sample period); without it every update uses the configured sample period.")
    private boolean measuredPeriod;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if ((controllerFile == null) != (traceFile == null)) {
            err.println("replay needs both --controller and --trace, or neither for the built-in demo");
            return LoopwrightCommand.BAD_INPUT;
        }
        try {
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
            Trace trace = demo ? TraceFile.parse(traceName, ReplayDemo.traceText()) : TraceFile.read(traceFile);
            ReplayResult result = Replay.run(settings, trace, measuredPeriod);
            Path target = (outFile == null ? Path.of(DEFAULT_OUT) : outFile).toAbsolutePath();
            write(result, target);
            out.println("Replayed " + traceName + " through " + controllerName + " ("
                    + (measuredPeriod ? "measured periods from the time column"
                            : "fixed period " + settings.samplePeriodSeconds() + " s") + ")");
            ReplaySummary.of(result).lines().forEach(out::println);
            out.println("Wrote " + result.rowCount() + " rows to " + target);
            out.flush();
            return 0;
        } catch (InputFileException e) {
            err.println(e.getMessage());
            err.flush();
            return LoopwrightCommand.BAD_INPUT;
        }
    }

    private static void write(ReplayResult result, Path target) {
        try {
            Files.createDirectories(target.getParent());
        } catch (IOException e) {
            throw InputFileException.whole(target.getParent().toString(), "cannot be created (" + e + ")", e);
        }
        try (Writer writer = Files.newBufferedWriter(target, StandardCharsets.UTF_8)) {
            result.writeCsv(writer);
        } catch (IOException e) {
            throw InputFileException.whole(target.toString(), "cannot be written (" + e + ")", e);
        }
    }
}
