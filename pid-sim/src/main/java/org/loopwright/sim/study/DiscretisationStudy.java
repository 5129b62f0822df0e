package org.loopwright.sim.study;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;

import org.hipparchus.complex.Complex;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.frequency.ContinuousController;
import org.loopwright.sim.frequency.GainCrossing;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.PhaseCrossing;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.frequency.StabilityMargins;
import org.loopwright.sim.metrics.ResponseMetrics;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

/**
 * How much sampling, and each way of discretising, costs a loop against its continuous design.
 *
 * <p>For a scenario with a linear plant and a PID controller, and a list of sample periods, the study
 * makes one row per period and integral × derivative method pair (a method that has no term to act on
 * is left out: a PI controller gets one row per integral method), plus the continuous design as the
 * first, reference row. Each row has the margins of the scenario's {@link SampledLoop} at that period
 * (from {@link LoopAnalysis}; the sensor's whole samples of delay included), the overshoot and IAE of a
 * set-point step and the IAE of a load step (simulated from rest with an ideal actuator and a sensor
 * that only keeps the scenario's delay, the controller's own limits kept), the discrete controller's magnitude and phase error against the
 * continuous one at the continuous gain crossover ω_c, and ω_c·h with its {@link SamplingVerdict}.
 *
 * <p>The set-point step has the size of the scenario's first set-point entry (1 if it has none or it is
 * 0); the load step that of its first load step (1 if none). The continuous design is simulated at a
 * fine period, ω_c·h = 0.002 (the hold then costs 0.06° of phase), with the Tustin integral and
 * derivative. A forward-Euler derivative at a period h &ge; 2·Tf cannot run: its row is marked not
 * applicable, with the reason.
 *
 * <p>Thread-safe: stateless.
 */
public final class DiscretisationStudy {

    /** ω_c·h of the default periods: below, inside, at the top of and well above the common-practice range. */
    private static final double[] DEFAULT_CROSSOVER_TIMES_PERIOD = {0.02, 0.1, 0.3, 1.0};
    /** ω_c·h at which the continuous design is simulated. */
    private static final double REFERENCE_CROSSOVER_TIMES_PERIOD = 0.002;
    /** The most sample periods one study takes. */
    public static final int MAX_PERIODS = 20;
    /** The most samples one simulated response of a study may take (the scenario's duration over h). */
    public static final int MAX_SAMPLES_PER_RUN = 1_000_000;
    /** The reference simulation's period is raised if it would need more samples than this. */
    private static final int MAX_REFERENCE_SAMPLES = 200_000;

    private DiscretisationStudy() {
    }

    /**
     * The periods studied when none are given: ω_c·h = 0.02, 0.1, 0.3 and 1, rounded to two significant
     * digits — finer than needed, inside the common-practice range 0.05–0.3 (see {@link SamplingVerdict}),
     * at its top, and well above it — and the scenario's own period, in increasing order.
     */
    public static List<Double> defaultPeriods(double crossoverRadPerSecond, double ownPeriodSeconds) {
        List<Double> periods = new ArrayList<>();
        for (double wh : DEFAULT_CROSSOVER_TIMES_PERIOD) {
            periods.add(twoDigits(wh / crossoverRadPerSecond));
        }
        if (!periods.contains(ownPeriodSeconds)) {
            periods.add(ownPeriodSeconds);
            Collections.sort(periods);
        }
        return periods;
    }

    private static double twoDigits(double value) {
        return new BigDecimal(value).round(new MathContext(2)).doubleValue();
    }

    /**
     * The continuous design's gain crossover ω_c: the one with the smallest phase margin.
     *
     * @throws IllegalArgumentException if the loop gain never crosses 1
     */
    public static double crossover(StabilityMargins continuous) {
        return continuous.gainCrossover().map(GainCrossing::frequencyRadPerSecond).orElseThrow(
                () -> new IllegalArgumentException("the continuous loop gain never crosses 1, so there is no"
                        + " crossover to compare the sample period with"));
    }

    /**
     * Runs the study.
     *
     * @param scenario       a scenario with a linear plant and a PID controller
     * @param periodsSeconds the sample periods to study (each finite and &gt; 0)
     * @throws IllegalArgumentException for a nonlinear plant, an on-off controller, a bad period, or a loop
     *                                  without a gain crossover
     */
    public static StudyResult run(Scenario scenario, List<Double> periodsSeconds) {
        TransferFunction plant = scenario.linearPlant().orElseThrow(() -> new IllegalArgumentException(
                "the discretisation study needs a linear plant (a transfer function): plant=" + scenario.plant()));
        ControllerSettings settings = scenario.controller().orElseThrow(() -> new IllegalArgumentException(
                "the discretisation study needs a PID controller: controller=on-off"));
        SampledLoop loop = scenario.sampledLoop().orElseThrow();
        for (double h : periodsSeconds) {
            if (!Double.isFinite(h) || h <= 0.0) {
                throw new IllegalArgumentException("sample periods must be finite and > 0: periods=" + periodsSeconds);
            }
        }
        StabilityMargins continuous = LoopAnalysis.continuous(plant, settings);
        double crossover = crossover(continuous);
        double setpointStep = scenario.setpoint().isEmpty() || scenario.setpoint().get(0).value() == 0.0 ? 1.0
                : scenario.setpoint().get(0).value();
        double loadStep = scenario.disturbances().isEmpty() ? 1.0 : scenario.disturbances().get(0).value();
        int sensorDelay = loop.sensorDelaySamples();
        Experiments experiments = new Experiments(plant, setpointStep, loadStep, scenario.durationSeconds());

        double finest = Collections.min(periodsSeconds);
        double reference = twoDigits(Math.max(Math.min(REFERENCE_CROSSOVER_TIMES_PERIOD / crossover, finest / 10.0),
                scenario.durationSeconds() / MAX_REFERENCE_SAMPLES));
        List<StudyRow> rows = new ArrayList<>();
        rows.add(continuousRow(continuous, experiments, settings, reference, sensorDelay));
        ContinuousController design = new ContinuousController(settings);
        ParallelGains gains = settings.parallelGains();
        List<IntegralMethod> integrals = gains.integralGain() > 0.0 ? Arrays.asList(IntegralMethod.values())
                : Collections.singletonList(null);
        List<DerivativeMethod> derivatives = gains.derivativeGain() > 0.0 ? Arrays.asList(DerivativeMethod.values())
                : Collections.singletonList(null);
        for (double h : periodsSeconds) {
            for (IntegralMethod integral : integrals) {
                for (DerivativeMethod derivative : derivatives) {
                    rows.add(sampledRow(loop, design, crossover, experiments, h, integral, derivative));
                }
            }
        }
        return new StudyResult(loop, continuous, crossover, periodsSeconds, reference, setpointStep,
                loadStep, rows);
    }

    private static StudyRow continuousRow(StabilityMargins margins, Experiments experiments,
            ControllerSettings settings, double referencePeriod, int sensorDelaySamples) {
        ControllerSettings fine = settings.toBuilder().samplePeriodSeconds(referencePeriod)
                .integralMethod(IntegralMethod.TUSTIN).derivativeMethod(DerivativeMethod.TUSTIN).build();
        Responses responses = experiments.run(fine, 0);
        return new StudyRow(StudyRow.Kind.CONTINUOUS, null, null, Double.NaN,
                "responses simulated at h=" + referencePeriod + " s with Tustin integral and derivative"
                        + (sensorDelaySamples > 0 ? "; the design, without the sensor's " + sensorDelaySamples
                                + " samples of delay (every sampled row has them)" : ""),
                phaseMargin(margins), gainMargin(margins), margins.sensitivityPeak().value(), null,
                responses.overshootPercent, responses.iae, responses.loadIae, Double.NaN, Double.NaN, Double.NaN,
                null, responses.setpoint);
    }

    private static StudyRow sampledRow(SampledLoop loop, ContinuousController design, double crossover,
            Experiments experiments, double h, IntegralMethod integral, DerivativeMethod derivative) {
        ControllerSettings settings = loop.controller();
        ControllerSettings variant;
        try {
            variant = settings.toBuilder().samplePeriodSeconds(h)
                    .integralMethod(integral == null ? settings.integralMethod() : integral)
                    .derivativeMethod(derivative == null ? settings.derivativeMethod() : derivative).build();
        } catch (InvalidSettingException e) {
            String note = notApplicable(derivative, h, settings.derivativeFilterTimeSeconds(), e.getMessage());
            return new StudyRow(StudyRow.Kind.NOT_APPLICABLE, integral, derivative, h, note, Double.NaN,
                    Double.NaN, Double.NaN, null, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                    crossover * h, null, null);
        }
        SampledMargins sampled = LoopAnalysis.sampled(loop.withController(variant).atPeriod(h));
        double magnitudeError = Double.NaN;
        double phaseError = Double.NaN;
        if (crossover < Math.PI / h) {
            Complex ratio = LoopAnalysis.discreteController(variant, h).at(crossover).divide(design.at(crossover));
            magnitudeError = 20.0 * Math.log10(ratio.norm());
            phaseError = Math.toDegrees(ratio.getArgument());
        }
        Responses responses = experiments.run(variant, loop.sensorDelaySamples());
        StabilityMargins m = sampled.margins();
        return new StudyRow(StudyRow.Kind.SAMPLED, integral, derivative, h, "", phaseMargin(m), gainMargin(m),
                m.sensitivityPeak().value(), sampled.stable(), responses.overshootPercent, responses.iae,
                responses.loadIae, magnitudeError, phaseError, crossover * h, SamplingVerdict.of(crossover * h),
                responses.setpoint);
    }

    private static double phaseMargin(StabilityMargins m) {
        return m.gainCrossover().map(GainCrossing::phaseMarginDegrees).orElse(Double.NaN);
    }

    private static double gainMargin(StabilityMargins m) {
        return m.phaseCrossover().map(PhaseCrossing::gainMargin).orElse(Double.NaN);
    }

    /** The two simulated experiments of every row. */
    private record Experiments(TransferFunction plant, double setpointStep, double loadStep, double durationSeconds) {

        Responses run(ControllerSettings settings, int sensorDelaySamples) {
            SensorModel sensor = new SensorModel(0.0, 0.0, sensorDelaySamples, 0.0, 0.0);
            Scenario setpoint = Scenario.setpointStep(plant, settings, setpointStep, durationSeconds).toBuilder()
                    .sensor(sensor).build();
            Trajectory setpointRun = Simulation.run(setpoint);
            ResponseMetrics metrics = ResponseMetrics.of(setpoint, setpointRun);
            Trajectory loadRun = Simulation.run(Scenario.loadStep(plant, settings, loadStep, durationSeconds)
                    .toBuilder().sensor(sensor).build());
            return new Responses(metrics.overshootPercent(), metrics.iae(), ResponseMetrics.loadIae(loadRun, 0.0),
                    setpointRun);
        }
    }

    private record Responses(double overshootPercent, double iae, double loadIae, Trajectory setpoint) {
    }

    /**
     * Why a method pair cannot run at a sample period, in the study's words rather than the settings'
     * message (which names builder fields): for the forward-Euler derivative, the stability rule.
     *
     * @param derivative          the derivative method, null when unchanged
     * @param h                   the sample period, s
     * @param filterTimeSeconds   the derivative filter time Tf, s
     * @param refused             the settings' message, used for any other method
     * @return the note
     */
    public static String notApplicable(DerivativeMethod derivative, double h, double filterTimeSeconds,
            String refused) {
        return derivative == DerivativeMethod.FORWARD_EULER ? "a forward-Euler derivative needs h < 2·Tf: h="
                + NumberText.of(h) + " s, Tf=" + NumberText.of(filterTimeSeconds) + " s" : refused;
    }
}
