package org.loopwright.sim.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;

import org.loopwright.pid.ControllerSettings;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.frequency.CascadeAnalysis;
import org.loopwright.sim.frequency.GainCrossing;
import org.loopwright.sim.frequency.GainRange;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.PhaseCrossing;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.JsonOutput;
import org.loopwright.sim.scenario.InnerLoop;


import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code margins SCENARIO.yaml [--json]}: the stability margins of the scenario's loop, for the
 * continuous design and for the loop sampled at the controller's own period with its own methods
 * (see {@link LoopAnalysis}). Frequencies in rad/s, delay margins in seconds; a margin that does not
 * exist (no crossover) is null in JSON and "none" in the table. Exit code 2 for a bad file, a
 * nonlinear plant or an on-off controller.
 *
 * <p>For a cascade it reports the inner loop alone and the outer loop with the inner loop closed
 * ({@link CascadeAnalysis}), as {@code {"inner": {"continuous", "sampled"}, "outer": {...}}}.
 */
@Command(name = "margins", mixinStandardHelpOptions = true,
        description = {"Gain, phase and delay margins, Ms and Mt of a scenario's loop, continuous and sampled.",
                "The sampled loop has the controller at z = e^(jωh) and the plant by its zero-order-hold equivalent;"
                        + " closed-loop stability is decided from the poles. Needs a linear plant and a PID controller.",
                "A cascade (inner key) gives the inner loop alone and the outer loop with the inner loop closed.",
                "JSON keys: continuous and sampled (for a cascade: inner and outer, each with both)."})
public final class MarginsCommand implements Callable<Integer> {

    /** What the robustness figures of an unstable loop are. */
    private static final String NOT_MEANINGFUL = "not meaningful: the closed loop is unstable";

    /** The table lists this many phase crossovers at most (JSON lists them all). */
    private static final int LISTED_CROSSINGS = 6;

    @Spec
    private CommandSpec spec;

    @Parameters(index = "0", paramLabel = "SCENARIO.yaml", description = "The scenario file.")
    private Path scenarioFile;

    @Mixin
    private JsonOption output;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        LinearLoopFile loop = LinearLoopFile.read(scenarioFile, "margins", true);
        ControllerSettings settings = loop.settings();
        if (loop.scenario().inner().isPresent()) {
            InnerLoop inner = loop.scenario().inner().get();
            TransferFunction innerPlant = inner.plant().linear().orElseThrow();
            ControllerSettings innerSettings = inner.controller();
            StabilityMargins innerContinuous = LoopAnalysis.continuous(innerPlant, innerSettings);
            SampledMargins innerSampled = LoopAnalysis.sampled(SampledLoop.of(innerPlant, innerSettings));
            StabilityMargins outerContinuous = CascadeAnalysis.outerContinuous(loop.plant(), settings, innerPlant,
                    innerSettings);
            int sensorDelay = loop.scenario().sensor().delaySamples();
            SampledMargins outerSampled = CascadeAnalysis.outerSampled(loop.plant(), settings, innerPlant,
                    innerSettings, sensorDelay);
            if (output.json()) {
                out.println(JsonOutput.text(new MarginsJson.Cascade(
                        MarginsJson.Loop.of(innerSettings, 0, innerContinuous, innerSampled, Optional.empty(), NOT_MEANINGFUL),
                        MarginsJson.Loop.of(settings, sensorDelay, outerContinuous, outerSampled, Optional.empty(),
                                NOT_MEANINGFUL))));
            } else {
                out.println("Inner loop (inner.controller on inner.plant):");
                table(out, innerSettings, 0, innerContinuous, innerSampled, Optional.empty());
                out.println();
                out.println("Outer loop (controller on plant, with the inner loop closed"
                        + (sensorDelay > 0 ? "; the sensor's delay on the outer measurement counts samples of the"
                                + " inner period, " + innerSettings.samplePeriodSeconds() + " s):" : "):"));
                table(out, settings, sensorDelay, outerContinuous, outerSampled, Optional.empty());
            }
            out.flush();
            return 0;
        }
        StabilityMargins continuous = LoopAnalysis.continuous(loop.plant(), settings);
        SampledLoop sampledLoop = loop.scenario().sampledLoop().orElseThrow();
        SampledMargins sampled = LoopAnalysis.sampled(sampledLoop);
        Optional<GainRange> range = LoopAnalysis.stableGainRange(sampledLoop);
        if (output.json()) {
            out.println(JsonOutput.text(MarginsJson.Loop.of(settings, sampledLoop.sensorDelaySamples(), continuous,
                    sampled, range, NOT_MEANINGFUL)));
        } else {
            table(out, settings, sampledLoop.sensorDelaySamples(), continuous, sampled, range);
        }
        out.flush();
        return 0;
    }

    private void table(PrintWriter out, ControllerSettings settings, int sensorDelaySamples,
            StabilityMargins continuous, SampledMargins sampled, Optional<GainRange> range) {
        StabilityMargins s = sampled.margins();
        out.println("Margins of " + scenarioFile + " (frequencies in rad/s)");
        out.printf(Locale.ROOT, "sampled: h = %s s, integral %s, derivative %s, sensor delay %d samples%n",
                settings.samplePeriodSeconds(), ControllerFile.INTEGRAL_METHODS.word(settings.integralMethod()),
                ControllerFile.DERIVATIVE_METHODS.word(settings.derivativeMethod()), sensorDelaySamples);
        if (sensorDelaySamples > 0) {
            out.println("continuous: the design, without the sensor's delay (it exists only in the sampled loop)");
        }
        row(out, "", "continuous", "sampled");
        row(out, "gain margin", gainMargin(continuous), gainMargin(s));
        row(out, "phase crossover", frequency(continuous.phaseCrossover().map(PhaseCrossing::frequencyRadPerSecond)
                .orElse(Double.NaN)), frequency(s.phaseCrossover().map(PhaseCrossing::frequencyRadPerSecond)
                .orElse(Double.NaN)));
        row(out, "phase margin", phaseMargin(continuous), phaseMargin(s));
        row(out, "gain crossover", frequency(continuous.gainCrossover().map(GainCrossing::frequencyRadPerSecond)
                .orElse(Double.NaN)), frequency(s.gainCrossover().map(GainCrossing::frequencyRadPerSecond)
                .orElse(Double.NaN)));
        boolean stable = sampled.stable();
        row(out, "Ms", peak(continuous.sensitivityPeak().value(), continuous.sensitivityPeak().frequencyRadPerSecond()),
                stable ? peak(s.sensitivityPeak().value(), s.sensitivityPeak().frequencyRadPerSecond())
                        : NOT_MEANINGFUL);
        row(out, "Mt", peak(continuous.complementaryPeak().value(),
                continuous.complementaryPeak().frequencyRadPerSecond()),
                stable ? peak(s.complementaryPeak().value(), s.complementaryPeak().frequencyRadPerSecond())
                        : NOT_MEANINGFUL);
        row(out, "delay margin", seconds(continuous.delayMarginSeconds().orElse(Double.NaN)),
                stable ? seconds(s.delayMarginSeconds().orElse(Double.NaN)) : NOT_MEANINGFUL);
        row(out, "closed-loop poles", "-", String.format(Locale.ROOT, "%s (largest |z| = %.6f)",
                stable ? "stable" : "UNSTABLE", sampled.largestPoleMagnitude()));
        row(out, "stable gain range", "-", range.map(r -> String.format(Locale.ROOT, "%s < k < %s times the loop gain%s",
                r.low() == 0.0 ? "0" : String.format(Locale.ROOT, "%.4g", r.low()),
                Double.isInfinite(r.high()) ? "inf" : String.format(Locale.ROOT, "%.4g", r.high()),
                stable && r.low() > 0.0 ? " (lower gain margin " + String.format(Locale.ROOT, "%.4g", r.low()) + ")"
                        : "")).orElse("none found for 1e-4 < k < 1e4 (or the loop's order is above "
                                + LoopAnalysis.MAX_GAIN_RANGE_ORDER + ")"));
        if (!stable) {
            out.println("UNSTABLE: the sampled closed loop has a pole outside the unit circle; its margins, Ms, Mt"
                    + " and delay margin say nothing about robustness.");
        }
        crossings(out, "continuous", continuous);
        crossings(out, "sampled", s);
    }

    private static void crossings(PrintWriter out, String name, StabilityMargins m) {
        if (m.phaseCrossings().size() > 1 || m.gainCrossings().size() > 1) {
            out.println("crossovers, " + name + ":");
            List<PhaseCrossing> phases = m.phaseCrossings();
            for (PhaseCrossing c : phases.subList(0, Math.min(phases.size(), LISTED_CROSSINGS))) {
                out.printf(Locale.ROOT, "  phase crossover at %.6g rad/s, gain margin %.4g%n",
                        c.frequencyRadPerSecond(), c.gainMargin());
            }
            if (phases.size() > LISTED_CROSSINGS) {
                out.printf(Locale.ROOT, "  ... %d more phase crossovers up to %.6g rad/s (all in --json)%n",
                        phases.size() - LISTED_CROSSINGS, phases.get(phases.size() - 1).frequencyRadPerSecond());
            }
            for (GainCrossing c : m.gainCrossings()) {
                out.printf(Locale.ROOT, "  gain crossover at %.6g rad/s, phase margin %.2f deg%n",
                        c.frequencyRadPerSecond(), c.phaseMarginDegrees());
            }
        }
    }

    private static void row(PrintWriter out, String name, String continuous, String sampled) {
        out.printf(Locale.ROOT, "%-18s %-26s %s%n", name, continuous, sampled);
    }

    private static String gainMargin(StabilityMargins m) {
        return m.phaseCrossover().map(c -> String.format(Locale.ROOT, "%.4g (%.2f dB)", c.gainMargin(),
                c.gainMarginDb())).orElse("none");
    }

    private static String phaseMargin(StabilityMargins m) {
        return m.gainCrossover().map(c -> String.format(Locale.ROOT, "%.2f deg", c.phaseMarginDegrees()))
                .orElse("none");
    }

    private static String frequency(double value) {
        return Double.isFinite(value) ? String.format(Locale.ROOT, "%.6g", value) : "none";
    }

    private static String seconds(double value) {
        return Double.isFinite(value) ? String.format(Locale.ROOT, "%.4g s", value) : "none";
    }

    private static String peak(double value, double frequency) {
        return String.format(Locale.ROOT, "%.4f at %.4g", value, frequency);
    }
}
