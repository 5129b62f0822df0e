package org.loopwright.sim.study;

import org.loopwright.pid.discrete.DerivativeMethod;
import org.loopwright.pid.discrete.IntegralMethod;
import org.loopwright.sim.config.ControllerFile;
import org.loopwright.sim.simulate.Trajectory;

/**
 * One row of the discretisation study. A figure that does not apply or does not exist is NaN (null in
 * JSON): the sample period and the controller errors of the continuous row, a gain margin when the
 * phase never reaches −180°, every figure of a not-applicable row.
 *
 * @param kind                 continuous reference, sampled variant, or a variant that cannot run at this period
 * @param integralMethod       the integral method; null for the continuous row or without integral action
 * @param derivativeMethod     the derivative method; null for the continuous row or without derivative action
 * @param samplePeriodSeconds  h; NaN for the continuous row
 * @param note                 why a row is not applicable, or how the continuous row was simulated; "" otherwise
 * @param phaseMarginDegrees   smallest phase margin
 * @param gainMargin           smallest gain margin (ratio)
 * @param ms                   maximum sensitivity
 * @param stable               every closed-loop pole inside the unit circle; null for the continuous row (not
 *                             decided there) and a not-applicable row
 * @param overshootPercent     overshoot of the set-point step response
 * @param iae                  IAE of the set-point step response
 * @param loadIae              IAE of the load step response
 * @param magnitudeErrorDb     20·log10(|C(e^{jω_c h})|/|C(jω_c)|) at the continuous gain crossover ω_c
 * @param phaseErrorDegrees    arg C(e^{jω_c h}) − arg C(jω_c) at ω_c, degrees
 * @param crossoverTimesPeriod ω_c·h
 * @param verdict              how h compares with ω_c; null for the continuous and not-applicable rows
 * @param setpointResponse     the set-point step run; null for a not-applicable row
 */
public record StudyRow(Kind kind, IntegralMethod integralMethod, DerivativeMethod derivativeMethod,
        double samplePeriodSeconds, String note, double phaseMarginDegrees, double gainMargin, double ms,
        Boolean stable, double overshootPercent, double iae, double loadIae, double magnitudeErrorDb,
        double phaseErrorDegrees, double crossoverTimesPeriod, SamplingVerdict verdict, Trajectory setpointResponse) {

    /** What a row stands for. */
    public enum Kind {
        /** The continuous design, the reference. */
        CONTINUOUS,
        /** A method pair at a sample period. */
        SAMPLED,
        /** A method pair that cannot run at this period (forward-Euler derivative with h &ge; 2·Tf). */
        NOT_APPLICABLE
    }

    /**
     * A short label in the controller file's words, such as "tustin/backward-euler", "continuous", or
     * "tustin/-" without derivative action.
     */
    public String label() {
        if (kind == Kind.CONTINUOUS) {
            return "continuous";
        }
        return label(integralMethod, derivativeMethod);
    }

    /**
     * The label of a pair of methods, "tustin/backward-euler"; "-" for a term the controller does not have.
     *
     * @param integral   the integral method, or null
     * @param derivative the derivative method, or null
     * @return the label
     */
    public static String label(IntegralMethod integral, DerivativeMethod derivative) {
        return (integral == null ? "-" : ControllerFile.INTEGRAL_METHODS.word(integral)) + "/"
                + (derivative == null ? "-" : ControllerFile.DERIVATIVE_METHODS.word(derivative));
    }
}
