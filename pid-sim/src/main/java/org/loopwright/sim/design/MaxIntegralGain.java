package org.loopwright.sim.design;

import java.util.Optional;

import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.exception.MathRuntimeException;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;
import org.hipparchus.optim.univariate.UnivariatePointValuePair;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.frequency.LoopAnalysis;
import org.loopwright.sim.frequency.SampledLoop;
import org.loopwright.sim.frequency.SampledMargins;
import org.loopwright.sim.plant.TransferFunction;

/**
 * The optimised design: the largest integral gain Ki whose sampled loop is stable (every closed-loop
 * pole inside the unit circle; the Ms bound alone admits loops that encircle −1) and whose maximum
 * sensitivity is at most Mmax, at the settings' period and discretisation with the sensor delay —
 * the constrained integral-gain optimisation of Åström &amp; Hägglund, <i>Advanced PID Control</i>
 * (ISA, 2006), ch. 7, on the sampled loop instead of the continuous one. Maximising Ki minimises
 * the integrated error after a load step for a well-damped loop (ibid., from memory).
 *
 * <p>Method, all with Hipparchus: for a proportional gain Kp, the feasible Ki form an interval
 * from 0; its end, the largest feasible Ki, is bracketed by doubling and found by the bracketing Brent
 * solver on Ms(Kp, Ki) − Mmax (an unstable loop counts as far above the limit), taking the root's
 * feasible side. The largest Kp with any feasible Ki (P control alone at the limit) is found the same
 * way. The outer maximisation of Ki over 0 &lt; Kp &lt; that bound scans {@value #SCAN_POINTS} points,
 * then refines around the best with Brent's optimiser.
 *
 * <p>PID: the derivative time is held at {@code derivativeTimeSeconds} (in ideal form, Kd = Kp·Td) and
 * Kp, Ki are optimised. That derivative constraint is ours, in place of the book's: design passes the
 * derivative time of a published rule for the model (see {@link Design}).
 *
 * <p>Thread-safe: immutable.
 */
public final class MaxIntegralGain {

    /** Points of the scan over Kp before the local refinement. */
    static final int SCAN_POINTS = 8;
    /** Relative accuracy of the largest feasible gain for a given Kp (and of the bound on Kp). */
    static final double GAIN_ACCURACY = 1e-4;
    /** Relative accuracy of the optimal Kp (Ki is flat around its maximum). */
    static final double KP_ACCURACY = 1e-3;
    /** How far above the limit an unstable loop counts. */
    private static final double UNSTABLE = 1e3;
    private static final int MAX_DOUBLINGS = 60;
    private static final int MAX_EVALUATIONS = 200;

    private final TransferFunction plant;
    private final ControllerSettings base;
    private final int sensorDelaySamples;
    private final double maxSensitivity;
    private final double derivativeTimeSeconds;

    /**
     * The problem.
     *
     * @param plant                 the plant model
     * @param base                  the settings whose period, methods, filter and action the loop uses (gains replaced)
     * @param sensorDelaySamples    whole samples of measurement delay
     * @param maxSensitivity        Mmax &gt; 1
     * @param derivativeTimeSeconds Td for PID, 0 for PI
     */
    public MaxIntegralGain(TransferFunction plant, ControllerSettings base, int sensorDelaySamples,
            double maxSensitivity, double derivativeTimeSeconds) {
        if (!(maxSensitivity > 1.0) || !Double.isFinite(maxSensitivity)) {
            throw new IllegalArgumentException("--max-sensitivity must be finite and > 1: --max-sensitivity="
                    + maxSensitivity);
        }
        this.plant = plant;
        this.base = base;
        this.sensorDelaySamples = sensorDelaySamples;
        this.maxSensitivity = maxSensitivity;
        this.derivativeTimeSeconds = derivativeTimeSeconds;
    }

    /**
     * How far the loop with these gains is from the constraints: Ms − Mmax for a stable loop (feasible
     * when &le; 0), {@value #UNSTABLE} for an unstable one or one the analysis rejects.
     */
    public double excess(double kp, double ki) {
        try {
            SampledMargins m = margins(kp, ki);
            return m.stable() ? m.margins().sensitivityPeak().value() - maxSensitivity : UNSTABLE;
        } catch (IllegalArgumentException notAnalysable) {
            return UNSTABLE;
        }
    }

    /** The sampled loop's margins and poles for these gains. */
    public SampledMargins margins(double kp, double ki) {
        ControllerSettings settings = settings(kp, ki);
        return LoopAnalysis.sampled(new SampledLoop(plant, settings, settings.samplePeriodSeconds(),
                sensorDelaySamples));
    }

    /** The settings with these gains (parallel form, Kd = Kp·Td). */
    public ControllerSettings settings(double kp, double ki) {
        return base.toBuilder().gains(new ParallelGains(kp, ki, kp * derivativeTimeSeconds)).build();
    }

    /**
     * Solves the problem.
     *
     * @param kpGuess a proportional gain of the right order (a published rule's), &gt; 0
     * @return the optimum, or empty when no gains meet the constraints (not even small ones)
     */
    public Optional<ParallelGains> solve(double kpGuess) {
        double kpMax = largestFeasible(k -> excess(k, 0.0), kpGuess);
        if (!(kpMax > 0.0)) {
            return Optional.empty();
        }
        double[] kp = new double[SCAN_POINTS + 2];
        double[] ki = new double[SCAN_POINTS + 2];
        int best = 0;
        double kiGuess = kpGuess / Math.max(plantTimeScale(), base.samplePeriodSeconds());
        for (int i = 1; i <= SCAN_POINTS; i++) {
            kp[i] = kpMax * i / (SCAN_POINTS + 1.0);
            ki[i] = largestIntegralGain(kp[i], kiGuess);
            if (ki[i] > 0.0) {
                kiGuess = ki[i];
            }
            if (ki[i] > ki[best]) {
                best = i;
            }
        }
        if (best == 0) {
            return Optional.empty();
        }
        kp[SCAN_POINTS + 1] = kpMax;
        double low = kp[best - 1] > 0.0 ? kp[best - 1] : kp[best] * 1e-3;
        double high = kp[best + 1];
        double start = kiGuess = ki[best];
        UnivariateFunction objective = k -> largestIntegralGain(k, start);
        BrentOptimizer optimizer = new BrentOptimizer(KP_ACCURACY, KP_ACCURACY * low);
        UnivariatePointValuePair refined = optimizer.optimize(new MaxEval(MAX_EVALUATIONS),
                new UnivariateObjectiveFunction(objective), GoalType.MAXIMIZE,
                new SearchInterval(low, high, kp[best]));
        double bestKp = refined.getValue() > ki[best] ? refined.getPoint() : kp[best];
        double bestKi = Math.max(refined.getValue(), ki[best]);
        return Optional.of(new ParallelGains(bestKp, bestKi, bestKp * derivativeTimeSeconds));
    }

    /** The largest Ki with a feasible loop at this Kp; 0 when even a vanishing Ki is infeasible. */
    double largestIntegralGain(double kp, double kiGuess) {
        if (excess(kp, 0.0) > 0.0) {
            return 0.0;
        }
        return largestFeasible(k -> excess(kp, k), kiGuess);
    }

    /**
     * The end of the feasible interval [0, x*] of a constraint g (g &le; 0 feasible), from a guess:
     * doubling (or halving) brackets the change of sign, then the bracketing Brent solver finds it,
     * keeping the feasible side. 0 when no positive x is feasible.
     */
    private static double largestFeasible(UnivariateFunction g, double guess) {
        double x = guess > 0.0 && Double.isFinite(guess) ? guess : 1.0;
        double feasible;
        double infeasible;
        if (g.value(x) <= 0.0) {
            feasible = x;
            infeasible = 2.0 * x;
            int n = 0;
            while (g.value(infeasible) <= 0.0) {
                feasible = infeasible;
                infeasible *= 2.0;
                if (++n > MAX_DOUBLINGS) {
                    return feasible; // no limit in sight: the constraint never binds
                }
            }
        } else {
            infeasible = x;
            feasible = 0.5 * x;
            int n = 0;
            while (g.value(feasible) > 0.0) {
                infeasible = feasible;
                feasible *= 0.5;
                if (++n > MAX_DOUBLINGS) {
                    return 0.0;
                }
            }
        }
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(GAIN_ACCURACY,
                GAIN_ACCURACY * feasible, 1e-12, 5);
        try {
            double root = solver.solve(MAX_EVALUATIONS, g, feasible, infeasible, AllowedSolution.LEFT_SIDE);
            return g.value(root) <= 0.0 ? root : feasible;
        } catch (MathRuntimeException noConvergence) {
            return feasible;
        }
    }

    /** A time scale of the plant: its dead time plus the sum of its time constants (for the first guess of Ki). */
    private double plantTimeScale() {
        double[] den = plant.denominator();
        double lowest = den[den.length - 1] != 0.0 ? den[den.length - 1] : den[den.length - 2];
        double next = den[den.length - 1] != 0.0 ? (den.length > 1 ? den[den.length - 2] : 0.0)
                : (den.length > 2 ? den[den.length - 3] : 0.0);
        return plant.deadTimeSeconds() + Math.abs(next / lowest);
    }
}
