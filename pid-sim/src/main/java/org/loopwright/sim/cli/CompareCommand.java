package org.loopwright.sim.cli;

import static java.util.Map.entry;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;

import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.config.InputException;
import org.loopwright.sim.config.Keywords;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.report.HtmlReport;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.scenario.Units;
import org.loopwright.sim.study.DiscretisationStudy;
import org.loopwright.sim.study.SamplingVerdict;
import org.loopwright.sim.study.StudyPlots;
import org.loopwright.sim.study.StudyResult;
import org.loopwright.sim.study.StudyRow;
import org.loopwright.sim.study.StudyTable;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code compare SCENARIO.yaml [--periods 0.1,0.5,1.0] [--out DIR] [--json]}: the discretisation
 * study of {@link DiscretisationStudy} as a table (or a JSON array of rows), with its plots and
 * {@code report.html} in DIR.
 * Without {@code --periods} the periods are chosen from the continuous crossover ω_c so that ω_c·h is
 * 0.02, 0.1, 0.3 and 1 (see {@link DiscretisationStudy#defaultPeriods(double, double)}; the scenario's own period is added). Exit code 2 for a bad
 * file, a nonlinear plant, an on-off controller, a bad period or an unwritable DIR.
 */
@Command(name = "compare", mixinStandardHelpOptions = true,
        description = {"Compare every integral x derivative discretisation at each sample period with the continuous design.",
                "Columns: margins, Ms, set-point overshoot and IAE, load IAE, the controller's error at the"
                        + " crossover, and how the period compares with the crossover. Needs a linear plant and a PID"
                        + " controller.",
                "The sampled loop includes the sensor's delay-samples. Overshoot: " + ResponseMetrics.OVERSHOOT_DEFINITION
                        + "; " + NumberText.MISSING + " where the response did not settle or diverged.",
                "Settled: " + ResponseMetrics.SETTLED_RULE + "."})
public final class CompareCommand implements Callable<Integer> {

    /** The periods studied when none are given (see {@link DiscretisationStudy#defaultPeriods}). */
    private static final String DEFAULT_PERIODS = "ωc·h = 0.02, 0.1, 0.3, 1 and the scenario's own";

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO.yaml", description = "The scenario file.")
    private Path scenarioFile;

    @Option(names = "--periods", split = ",", paramLabel = "H",
            description = "Sample periods in seconds, comma-separated (default: "
                    + DEFAULT_PERIODS + ").")
    private List<Double> periods;

    /** Without --out, compare prints its table and writes no plots. */
    @Mixin
    private OutputOptions output;

    @Override
    public Integer call() throws IOException {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        LinearLoopFile loop = LinearLoopFile.read(scenarioFile, "compare");
        if (periods != null) {
            checkPeriods(loop);
        }
        List<Double> chosen = periods != null ? periods : DiscretisationStudy.defaultPeriods(
                DiscretisationStudy.crossover(LoopAnalysis.continuous(loop.plant(), loop.settings())),
                loop.settings().samplePeriodSeconds());
        StudyResult result = DiscretisationStudy.run(loop.scenario(), chosen);
        List<Path> written = List.of();
        if (output.givenDirectory().isPresent()) {
            // staged, then moved: a run that fails half way leaves no half-written file behind
            try (OutputStage stage = output.stage()) {
                written = new ArrayList<>(StudyPlots.write(result, stage.directory()));
                written.add(HtmlReports.compare(stage.directory(), HtmlReports.record(spec, loop.scenario(),
                        scenarioFile), String.valueOf(scenarioFile.getFileName()), result,
                        StudyTable.of(result, loop.scenario().units()), written, Files.readString(scenarioFile)));
                stage.commit();
            }
        }
        boolean json = output.json();
        if (json) {
            out.println(JsonOutput.text(result.rows().stream().map(RowJson::of).toList()));
        } else {
            table(out, result, periods == null, loop.scenario().units());
        }
        if (!written.isEmpty()) {
            (json ? err : out).println("Wrote " + (written.size() - 1) + " plot files to " + output.directory());
            (json ? err : out).println("Wrote " + HtmlReport.FILE_NAME + " to " + output.directory());
        }
        out.flush();
        err.flush();
        return 0;
    }

    /** The row kinds as JSON writes them. */
    private static final Keywords<StudyRow.Kind> KINDS = Keywords.of(entry("continuous", StudyRow.Kind.CONTINUOUS),
            entry("sampled", StudyRow.Kind.SAMPLED), entry("not-applicable", StudyRow.Kind.NOT_APPLICABLE));

    /** The sampling verdicts as JSON writes them. */
    private static final Keywords<SamplingVerdict> VERDICTS = Keywords.of(entry("fine", SamplingVerdict.FINE),
            entry("typical", SamplingVerdict.TYPICAL), entry("coarse", SamplingVerdict.COARSE));

    /**
     * One row of the study as JSON (snake_case keys, null for a figure that does not apply).
     *
     * @param kind                 continuous, sampled or not-applicable
     * @param integralMethod       the controller file's word, null for the continuous row
     * @param derivativeMethod     the controller file's word, null for the continuous row
     * @param samplePeriod         h, s
     * @param phaseMarginDeg       phase margin, degrees
     * @param gainMargin           gain margin
     * @param ms                   sensitivity peak
     * @param stable               whether the sampled loop is stable, null where not decided
     * @param overshootPercent     set-point step overshoot, %
     * @param iae                  set-point step IAE
     * @param loadIae              load step IAE
     * @param magnitudeErrorDb     the controller's magnitude error at crossover against the continuous one, dB
     * @param phaseErrorDeg        its phase error there, degrees
     * @param crossoverTimesPeriod omega_c times h
     * @param samplingVerdict      fine, typical or coarse; null for the continuous row
     * @param note                 why a row does not apply, or null
     */
    record RowJson(String kind, String integralMethod, String derivativeMethod, double samplePeriod,
            double phaseMarginDeg, double gainMargin, double ms, Boolean stable, double overshootPercent, double iae,
            double loadIae, double magnitudeErrorDb, double phaseErrorDeg, double crossoverTimesPeriod,
            String samplingVerdict, String note) {

        static RowJson of(StudyRow row) {
            return new RowJson(KINDS.word(row.kind()), row.integralMethod() == null ? null
                    : ControllerFile.INTEGRAL_METHODS.word(row.integralMethod()), row.derivativeMethod() == null ? null
                    : ControllerFile.DERIVATIVE_METHODS.word(row.derivativeMethod()), row.samplePeriodSeconds(),
                    row.phaseMarginDegrees(), row.gainMargin(), row.ms(), row.stable(), row.overshootPercent(),
                    row.iae(), row.loadIae(), row.magnitudeErrorDb(), row.phaseErrorDegrees(),
                    row.crossoverTimesPeriod(), row.verdict() == null ? null : VERDICTS.word(row.verdict()), row.note());
        }
    }

    /** Each period finite and positive, and the study's work at it within its stated limits. */
    private void checkPeriods(LinearLoopFile loop) {
        String given = periods.stream().map(String::valueOf).collect(Collectors.joining(","));
        if (periods.size() > DiscretisationStudy.MAX_PERIODS) {
            throw InputException.option("--periods", given, "must list at most " + DiscretisationStudy.MAX_PERIODS
                    + " periods");
        }
        for (double h : periods) {
            if (!Double.isFinite(h) || h <= 0.0) {
                throw InputException.option("--periods", given, "must each be finite and > 0");
            }
            double samples = loop.scenario().durationSeconds() / h;
            if (samples > DiscretisationStudy.MAX_SAMPLES_PER_RUN) {
                throw InputException.option("--periods", given, String.format(Locale.ROOT, "must each give at most %d"
                        + " samples over the scenario's duration of %s s (h = %s s gives %.3g)",
                        DiscretisationStudy.MAX_SAMPLES_PER_RUN, loop.scenario().durationSeconds(), h, samples));
            }
            double delaySamples = loop.plant().deadTimeSeconds() / h + loop.scenario().sensor().delaySamples();
            if (delaySamples > SampledLoop.MAX_DELAY_SAMPLES) {
                throw InputException.option("--periods", given, String.format(Locale.ROOT, "must each keep the loop's"
                        + " delay (dead time %s s plus %d sensor samples) within %d samples (h = %s s gives %.3g)",
                        loop.plant().deadTimeSeconds(), loop.scenario().sensor().delaySamples(),
                        SampledLoop.MAX_DELAY_SAMPLES, h, delaySamples));
            }
        }
    }

    private void table(PrintWriter out, StudyResult result, boolean defaultPeriods, Units units) {
        out.printf(Locale.ROOT, "Discretisation study of %s%n", scenarioFile);
        out.printf(Locale.ROOT, "continuous gain crossover ωc = %.4g rad/s; periods %s s%s%n",
                result.crossoverRadPerSecond(), result.periodsSeconds(),
                defaultPeriods ? " (default: " + DEFAULT_PERIODS + ")" : "");
        out.printf(Locale.ROOT, "set-point step %s, load step %s; common practice ωc·h %s-%s%n",
                result.setpointStepSize(), result.loadStepSize(), SamplingVerdict.TYPICAL_LOW,
                SamplingVerdict.TYPICAL_HIGH);
        out.print(StudyTable.of(result, units).text());
        out.println("continuous row: " + result.rows().get(0).note());
    }
}
