package org.loopwright.pid.form;

/**
 * PID gains in one of the three standard forms. Every form converts exactly to
 * {@link ParallelGains}, which is how the controller runs it.
 */
public sealed interface PidGains permits ParallelGains, IdealGains, SeriesGains {

    /** {@return the form these gains are written in} */
    ControllerForm form();

    /** {@return the exact parallel equivalent} */
    ParallelGains toParallel();

    /** {@return whether the gains contain integral action} */
    default boolean hasIntegralAction() {
        return toParallel().integralGain() > 0.0;
    }
}
