package org.loopwright.sim.frequency;

import java.util.ArrayList;
import java.util.List;

import org.hipparchus.analysis.UnivariateFunction;
import org.hipparchus.analysis.solvers.AllowedSolution;
import org.hipparchus.analysis.solvers.BracketingNthOrderBrentSolver;
import org.hipparchus.complex.Complex;
import org.hipparchus.optim.MaxEval;
import org.hipparchus.optim.nonlinear.scalar.GoalType;
import org.hipparchus.optim.univariate.BrentOptimizer;
import org.hipparchus.optim.univariate.SearchInterval;
import org.hipparchus.optim.univariate.UnivariateObjectiveFunction;

/**
 * Finds the margins of a loop L on a frequency band: a logarithmic grid brackets every crossing
 * (a sign change of ln|L| for a gain crossover, of sin(arg L) with L on the negative real axis for a
 * phase crossover), then Hipparchus' bracketing Brent solver refines each to machine accuracy; the
 * grid maximum of |S| and |T| is refined by Brent's optimiser between its neighbours. A loop with a
 * dead time crosses the negative real axis without end; the crossings whose gain margin lies more
 * than 20 dB above the smallest one cannot matter first and are left out.
 *
 * <p>A sampled loop ends at the Nyquist frequency, where L(e^{jπ}) is real: if it is negative
 * there, that end point is a phase crossover too (the Nyquist curve meets its mirror image there).
 */
final class MarginSearch {

    private static final int MAX_EVALUATIONS = 500;
    private static final int SOLVER_ORDER = 5;
    private static final double RELATIVE_ACCURACY = 1e-14;
    private static final double FUNCTION_ACCURACY = 1e-15;
    /** Phase crossovers whose gain margin exceeds the smallest by more than this factor (20 dB) are left out. */
    static final double REPORTED_GAIN_MARGIN_SPAN = 10.0;
    /** The last grid point of a sampled loop stops this far short of Nyquist (its end is treated apart). */
    private static final double NYQUIST_GAP = 1e-7;

    private MarginSearch() {
    }

    /** The margins of {@code loop} on {@code band}. */
    static StabilityMargins search(FrequencyResponse loop, FrequencyBand band) {
        double[] omega = band.grid();
        int count = omega.length;
        if (band.endsAtNyquist()) {
            omega[count - 1] = band.highestRadPerSecond() * (1.0 - NYQUIST_GAP);
        }
        Complex[] values = new Complex[count];
        for (int i = 0; i < count; i++) {
            values[i] = loop.at(omega[i]);
        }
        List<GainCrossing> gainCrossings = new ArrayList<>();
        List<Integer> phaseBrackets = new ArrayList<>();
        UnivariateFunction logGain = w -> Math.log(loop.at(w).norm());
        UnivariateFunction phaseSine = w -> {
            Complex l = loop.at(w);
            return l.getImaginary() / l.norm();
        };
        double smallestEstimate = Double.POSITIVE_INFINITY;
        for (int i = 0; i + 1 < count; i++) {
            Complex a = values[i];
            Complex b = values[i + 1];
            if (!a.isFinite() || !b.isFinite()) {
                continue;
            }
            if ((a.norm() >= 1.0) != (b.norm() >= 1.0)) {
                double w = refine(logGain, omega[i], omega[i + 1]);
                gainCrossings.add(new GainCrossing(w, phaseMarginDegrees(loop.at(w))));
            }
            if ((a.getImaginary() >= 0.0) != (b.getImaginary() >= 0.0) && (a.getReal() < 0.0 || b.getReal() < 0.0)) {
                phaseBrackets.add(i);
                smallestEstimate = Math.min(smallestEstimate, 1.0 / Math.max(a.norm(), b.norm()));
            }
        }
        List<PhaseCrossing> phaseCrossings = new ArrayList<>();
        for (int i : phaseBrackets) {
            if (1.0 / Math.max(values[i].norm(), values[i + 1].norm()) > REPORTED_GAIN_MARGIN_SPAN * smallestEstimate) {
                continue; // far beyond the smallest margin: cannot matter, not worth refining
            }
            double w = refine(phaseSine, omega[i], omega[i + 1]);
            Complex l = loop.at(w);
            if (l.getReal() < 0.0) {
                phaseCrossings.add(new PhaseCrossing(w, 1.0 / l.norm()));
            }
        }
        Complex atEnd = loop.at(band.highestRadPerSecond());
        if (band.endsAtNyquist() && atEnd.getReal() < 0.0) {
            phaseCrossings.add(new PhaseCrossing(band.highestRadPerSecond(), 1.0 / atEnd.norm()));
        }
        double smallest = phaseCrossings.stream().mapToDouble(PhaseCrossing::gainMargin).min()
                .orElse(Double.POSITIVE_INFINITY);
        phaseCrossings.removeIf(c -> c.gainMargin() > REPORTED_GAIN_MARGIN_SPAN * smallest);
        Peak ms = peak(loop, omega, band, true);
        Peak mt = peak(loop, omega, band, false);
        return new StabilityMargins(phaseCrossings, gainCrossings, ms, mt);
    }

    private static double refine(UnivariateFunction f, double low, double high) {
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(RELATIVE_ACCURACY,
                low * RELATIVE_ACCURACY, FUNCTION_ACCURACY, SOLVER_ORDER);
        return solver.solve(MAX_EVALUATIONS, f, low, high, AllowedSolution.ANY_SIDE);
    }

    /** 180° + arg L, wrapped to (−180°, 180°]. */
    static double phaseMarginDegrees(Complex loopValue) {
        double margin = loopValue.getArgument() + Math.PI;
        if (margin > Math.PI) {
            margin -= 2.0 * Math.PI;
        }
        return Math.toDegrees(margin);
    }

    private static Peak peak(FrequencyResponse loop, double[] omega, FrequencyBand band, boolean sensitivity) {
        UnivariateFunction magnitude = w -> closedLoopMagnitude(loop.at(w), sensitivity);
        int last = omega.length - 1;
        int best = 0;
        double bestValue = Double.NEGATIVE_INFINITY;
        for (int i = 0; i <= last; i++) {
            double v = magnitude.value(omega[i]);
            if (v > bestValue) {
                bestValue = v;
                best = i;
            }
        }
        double endValue = magnitude.value(band.highestRadPerSecond());
        if (band.endsAtNyquist() && endValue > bestValue) {
            return new Peak(endValue, band.highestRadPerSecond());
        }
        if (best == 0) {
            return new Peak(bestValue, 0.0);
        }
        double low = omega[best - 1];
        double high = best == last ? band.highestRadPerSecond() : omega[best + 1];
        BrentOptimizer optimizer = new BrentOptimizer(1e-12, low * 1e-14);
        var optimum = optimizer.optimize(new MaxEval(MAX_EVALUATIONS), new UnivariateObjectiveFunction(magnitude),
                GoalType.MAXIMIZE, new SearchInterval(low, high, omega[best]));
        return optimum.getValue() >= bestValue ? new Peak(optimum.getValue(), optimum.getPoint())
                : new Peak(bestValue, omega[best]);
    }

    private static double closedLoopMagnitude(Complex loopValue, boolean sensitivity) {
        Complex returnDifference = loopValue.add(1.0);
        return sensitivity ? 1.0 / returnDifference.norm() : loopValue.norm() / returnDifference.norm();
    }
}
