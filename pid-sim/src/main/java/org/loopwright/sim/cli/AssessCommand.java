package org.loopwright.sim.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.loopwright.pid.Action;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.monitor.MonitorSettings;
import org.loopwright.sim.assess.Assessment;
import org.loopwright.sim.assess.AssessmentOptions;
import org.loopwright.sim.assess.LoopAssessment;
import org.loopwright.sim.assess.ProcessKind;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.replay.LoggedLoop;
import org.loopwright.sim.replay.LoggedLoopFile;
import org.loopwright.sim.report.AssessmentReport;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.report.ReportRecord;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code assess TRACE.csv [--sample-period H] [--dead-time L] [--controller C.yaml] [--time-scale T]
 * [--span S] [--process-kind K] [--out DIR] [--json]}: is this logged loop healthy? Runs the loop
 * monitor over the record and the whole-record methods (stiction, minimum-variance index, oscillation
 * period and regularity), prints a table of conditions (or one JSON object), and with --out writes the
 * plots and report.html.
 */
@Command(name = "assess", mixinStandardHelpOptions = true,
        description = {"Assess a logged loop: oscillation, stiction, saturation, sluggishness, frozen measurement,"
                + " noise and the minimum-variance index, each with its method and source.",
            "TRACE.csv: columns time,setpoint,measurement,output and optionally mode (auto|manual|track).",
            "With --out DIR, also writes assess-trend.png/.svg, assess-output-vs-measurement.png/.svg and report.html."})
public final class AssessCommand implements Callable<Integer> {

    /** Share of the measurement span that is an acceptable oscillation amplitude (Hägglund 1995, from memory). */
    static final double AMPLITUDE_SHARE_OF_SPAN = 0.01;

    /** The option each monitor setting comes from, for messages. */
    private static final Map<String, String> OPTION_OF_FIELD = Map.of("samplePeriodSeconds", "--sample-period",
            "timeScaleSeconds", "--time-scale", "acceptableAmplitude", "--span");

    @Parameters(index = "0", paramLabel = "TRACE.csv", description = "The logged loop (CSV with a header row).")
    private Path traceFile;

    @Option(names = "--sample-period", paramLabel = "H",
            description = "Sample period in seconds (default: the median interval of the time column).")
    private Double samplePeriod;

    @Option(names = "--dead-time", paramLabel = "L",
            description = "The loop's dead time in seconds; needed for the minimum-variance index.")
    private Double deadTime;

    @Option(names = "--controller", paramLabel = "C.yaml",
            description = "The controller file: its integral time is the time scale, its output limits and action"
                    + " are used.")
    private Path controllerFile;

    @Option(names = "--time-scale", paramLabel = "T",
            description = "The loop's time scale in seconds: the ultimate period if known, else the integral time"
                    + " (default: the controller's integral time).")
    private Double timeScale;

    @Option(names = "--span", paramLabel = "S",
            description = "The measurement's range; 1 %% of it is the acceptable oscillation amplitude (default:"
                    + " 1 %% of the largest |setpoint| or |measurement| in the record).")
    private Double span;

    @Option(names = "--process-kind", paramLabel = "K", defaultValue = "self-regulating",
            converter = OptionWords.ProcessKinds.class, completionCandidates = OptionWords.ProcessKinds.class,
            description = "${COMPLETION-CANDIDATES} (position-drive: a position loop on a drive); decides"
                    + " whether the stiction test applies (default: ${DEFAULT-VALUE}).")
    private ProcessKind kind;

    /** Without --out, assess prints its table and writes no files. */
    @Mixin
    private OutputOptions output;

    @Spec
    private CommandSpec spec;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        List<String> assumptions = new ArrayList<>();
        OptionChecks.positive("--sample-period", samplePeriod);
        OptionChecks.positive("--time-scale", timeScale);
        OptionChecks.positive("--span", span);
        OptionChecks.nonNegative("--dead-time", deadTime);
        ControllerSettings controller = controllerFile == null ? null : ControllerFile.read(controllerFile);
        LoggedLoop loop = LoggedLoopFile.read(traceFile);
        AssessmentOptions options = options(loop, controller, kind, assumptions);
        Assessment assessment = LoopAssessment.of(loop, options);
        List<Path> written = List.of();
        if (output.givenDirectory().isPresent()) {
            List<Path> inputFiles = controllerFile == null ? List.of(traceFile) : List.of(traceFile, controllerFile);
            ReportRecord record = ReportRecord.of(BuildVersion.line(),
                    spec.root().commandLine().getParseResult().originalArgs(), inputFiles,
                    controller == null ? Map.of() : ControllerFile.resolved(controller));
            // staged, then moved: a run that fails half way leaves no half-written file behind
            try (OutputStage stage = output.stage()) {
                written = AssessmentReport.write(stage.directory(), record, loop, assessment,
                        inputs(options, assumptions));
                stage.commit();
            }
        }
        if (output.json()) {
            assumptions.forEach(a -> err.println("assumed: " + a));
            out.println(JsonOutput.text(AssessmentReport.json(assessment)));
        } else {
            out.printf(Locale.ROOT, "%s: %d samples every %s s%n", loop.name(), assessment.samples(),
                    AssessmentReport.number(assessment.samplePeriodSeconds()));
            out.print(AssessmentReport.table(assessment));
            out.println("Verdict: " + AssessmentReport.verdict(assessment));
            assumptions.forEach(a -> out.println("Assumed: " + a));
            if (!written.isEmpty()) {
                out.println("Wrote " + String.join(", ", written.stream().map(p -> String.valueOf(p.getFileName()))
                        .toList()) + " in " + output.directory());
            }
        }
        out.flush();
        err.flush();
        return 0;
    }

    /** The monitor's settings from the options, the controller file and the record; records what was assumed. */
    private AssessmentOptions options(LoggedLoop loop, ControllerSettings controller, ProcessKind kind,
            List<String> assumptions) {
        double h = samplePeriod != null ? samplePeriod : loop.medianIntervalSeconds();
        if (samplePeriod == null) {
            assumptions.add("sample period " + AssessmentReport.number(h) + " s, the median interval of the time"
                    + " column (--sample-period)");
        }
        double integralTime = controller == null || !controller.gains().hasIntegralAction() ? Double.NaN
                : controller.gains().toParallel().toIdeal().integralTime();
        double scale = timeScale != null ? timeScale : integralTime;
        if (Double.isNaN(scale)) {
            throw new InputException("assess needs the loop's time scale: give --time-scale SECONDS"
                    + " (the ultimate period, or the integral time) or --controller with an integral time");
        }
        double amplitude;
        if (span != null) {
            amplitude = AMPLITUDE_SHARE_OF_SPAN * span;
        } else {
            double largest = 0.0;
            for (int k = 0; k < loop.length(); k++) {
                largest = Math.max(largest, Math.max(finiteAbs(loop.setpoint(k)), finiteAbs(loop.measurement(k))));
            }
            if (largest == 0.0) {
                throw new InputException("the record's setpoint and measurement are all zero or missing:"
                        + " give --span, the measurement's range");
            }
            amplitude = AMPLITUDE_SHARE_OF_SPAN * largest;
            assumptions.add("acceptable oscillation amplitude " + AssessmentReport.number(amplitude)
                    + ", 1 % of the largest value in the record (--span)");
        }
        if (kind == ProcessKind.SELF_REGULATING && !spec.commandLine().getParseResult().hasMatchedOption(
                "--process-kind")) {
            assumptions.add("a self-regulating process for the stiction test (--process-kind)");
        }
        MonitorSettings.Builder monitor = MonitorSettings.builder().samplePeriodSeconds(h).timeScaleSeconds(scale)
                .acceptableAmplitude(amplitude);
        if (controller != null) {
            monitor.outputRange(controller.outputMin(), controller.outputMax()).action(controller.action());
        } else {
            assumptions.add("reverse action, output limits unknown (--controller)");
            monitor.action(Action.REVERSE);
        }
        if (!Double.isFinite(controller == null ? Double.NaN : controller.outputMax() - controller.outputMin())) {
            double low = Double.POSITIVE_INFINITY;
            double high = Double.NEGATIVE_INFINITY;
            for (int k = 0; k < loop.length(); k++) {
                if (Double.isFinite(loop.output(k))) {
                    low = Math.min(low, loop.output(k));
                    high = Math.max(high, loop.output(k));
                }
            }
            double move = high > low ? 0.01 * (high - low) : 1e-9;
            monitor.frozenOutputMove(move);
            assumptions.add("a frozen measurement needs the output to move more than " + AssessmentReport.number(move)
                    + ", 1 % of the output's range in the record (no finite output limits)");
        }
        return OptionChecks.inOptionTerms(OPTION_OF_FIELD, () -> new AssessmentOptions(monitor.build(),
                deadTime == null ? Double.NaN : deadTime, kind, controller != null
                        && !controller.gains().hasIntegralAction(), assumptions));
    }

    private static double finiteAbs(double v) {
        return Double.isFinite(v) ? Math.abs(v) : 0.0;
    }


    private String inputs(AssessmentOptions options, List<String> assumptions) {
        MonitorSettings m = options.monitor();
        StringBuilder text = new StringBuilder();
        text.append("trace: ").append(traceFile).append('\n');
        if (controllerFile != null) {
            text.append("controller: ").append(controllerFile).append('\n');
        }
        text.append(String.format(Locale.ROOT, "sample period %s s, time scale %s s, acceptable amplitude %s,"
                + " dead time %s, process kind %s%n", AssessmentReport.number(m.samplePeriodSeconds()),
                AssessmentReport.number(m.timeScaleSeconds()), AssessmentReport.number(m.acceptableAmplitude()),
                deadTime == null ? "not given" : AssessmentReport.number(deadTime) + " s", options.processKind().label()));
        for (String assumption : assumptions) {
            text.append("assumed: ").append(assumption).append('\n');
        }
        return text.toString();
    }
}
