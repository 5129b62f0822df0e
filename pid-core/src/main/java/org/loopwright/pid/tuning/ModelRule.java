package org.loopwright.pid.tuning;

import java.util.Locale;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.pid.form.SeriesGains;

/**
 * The published tuning rules that work from a process model
 * ({@link #tune(ProcessModel, ControllerType, double)}): all of them from first order plus dead time,
 * SIMC also from second order plus dead time and from an integrating process. A model its paper does
 * not cover, a model outside the rule's stated range or a variant the paper does not give returns a
 * {@link RuleNotApplicable} with the reason. The rules from an ultimate point are {@link UltimatePointRule}.
 *
 * <p>The formulas below are written as the maintainers recall them from the cited papers (and from
 * Åström &amp; Hägglund, <i>Advanced PID Control</i>, ISA 2006, which reprints most of them); each
 * constant says so. The tests check every rule against values worked by hand from these formulas.
 *
 * <p>Example: {@code ModelRule.SIMC.tune(new FopdtModel(2, 10, 1), ControllerType.PI, Double.NaN)}
 * gives Kc = 10/(2·(1 + 1)) = 2.5 and Ti = min(10, 4·2) = 8 s.
 *
 * <p>Thread-safe: stateless.
 */
public enum ModelRule implements TuningRule {


    /**
     * SIMC, Skogestad (2003). Recalled from memory, with τc the closed-loop time constant
     * (recommended τc = L, the default):
     * <ul>
     * <li>first order plus dead time, PI: Kc = T/(K·(τc + L)), Ti = min(T, 4·(τc + L)); PID does not
     *     apply (the rule's derivative cancels a second time constant, which this model lacks);</li>
     * <li>second order plus dead time, PID in series form: Kc' = T1/(K·(τc + L)),
     *     Ti' = min(T1, 4·(τc + L)), Td' = T2, given here as its ideal equivalent; PI: the first-order
     *     rule on the half-rule model (T1 + T2/2, L + T2/2);</li>
     * <li>integrating K·e^(−sL)/s, PI: Kc = 1/(K·(τc + L)), Ti = 4·(τc + L); with a lag
     *     K·e^(−sL)/(s(Ts + 1)), PID in series form with Td' = T and the same Kc', Ti', and PI on the
     *     dead time L + T/2 (the half rule, as the limit T1 → ∞ of the second-order case).</li>
     * </ul>
     */
    SIMC("simc", "S. Skogestad, \"Simple analytic rules for model reduction and PID controller tuning\","
            + " Journal of Process Control 13 (2003) 291-309") {
        @Override
        TuningResult fromModel(FopdtModel m, ControllerType type, double closedLoopTimeSeconds) {
            if (type == ControllerType.PID) {
                return new RuleNotApplicable(this, type, "SIMC gives derivative action only for a second-order"
                        + " model (Td = tau2); a first-order model has no second time constant: use PI");
            }
            double l = m.deadTimeSeconds();
            double tauC = Double.isNaN(closedLoopTimeSeconds) ? l : closedLoopTimeSeconds;
            if (tauC == 0.0) {
                return noDefaultTauC(this, type);
            }
            double t = m.timeConstantSeconds();
            double gain = t / (m.gainMagnitude() * (tauC + l));
            double integralTime = Math.min(t, 4.0 * (tauC + l));
            return new TunedGains(this, type, IdealGains.pi(gain, integralTime), tauCNote(tauC, closedLoopTimeSeconds));
        }

        @Override
        TuningResult fromSecondOrder(SopdtModel m, ControllerType type, double closedLoopTimeSeconds) {
            if (type == ControllerType.PI) {
                FopdtModel reduced = m.halfRule();
                TuningResult pi = fromModel(reduced, type, closedLoopTimeSeconds);
                return pi instanceof TunedGains t ? new TunedGains(this, type, t.gains(), t.note()
                        + "; half rule: T = " + format(reduced.timeConstantSeconds()) + " s, L = "
                        + format(reduced.deadTimeSeconds()) + " s") : pi;
            }
            double l = m.deadTimeSeconds();
            double tauC = Double.isNaN(closedLoopTimeSeconds) ? l : closedLoopTimeSeconds;
            if (tauC == 0.0) {
                return noDefaultTauC(this, type);
            }
            double t1 = m.timeConstantSeconds();
            SeriesGains series = new SeriesGains(t1 / (m.gainMagnitude() * (tauC + l)),
                    Math.min(t1, 4.0 * (tauC + l)), m.secondTimeConstantSeconds());
            return new TunedGains(this, type, series.toIdeal(), tauCNote(tauC, closedLoopTimeSeconds)
                    + "; series form Kc' = " + format(series.gain()) + ", Ti' = " + format(series.integralTime())
                    + " s, Td' = T2 = " + format(series.derivativeTime()) + " s");
        }

        @Override
        TuningResult fromIntegrating(IntegratingModel m, ControllerType type, double closedLoopTimeSeconds) {
            if (type == ControllerType.PID && m.lagSeconds() == 0.0) {
                return new RuleNotApplicable(this, type, "SIMC gives derivative action for an integrating process"
                        + " only with a lag (Td = T); a pure integrator has none: use PI");
            }
            double l = type == ControllerType.PI ? m.deadTimeSeconds() + m.lagSeconds() / 2.0 : m.deadTimeSeconds();
            double tauC = Double.isNaN(closedLoopTimeSeconds) ? l : closedLoopTimeSeconds;
            if (tauC == 0.0) {
                return noDefaultTauC(this, type);
            }
            double gain = 1.0 / (m.gainMagnitude() * (tauC + l));
            double integralTime = 4.0 * (tauC + l);
            String note = tauCNote(tauC, closedLoopTimeSeconds);
            if (type == ControllerType.PI) {
                return new TunedGains(this, type, IdealGains.pi(gain, integralTime), m.lagSeconds() > 0.0
                        ? note + "; half rule: L = " + format(l) + " s" : note);
            }
            SeriesGains series = new SeriesGains(gain, integralTime, m.lagSeconds());
            return new TunedGains(this, type, series.toIdeal(), note + "; series form Kc' = "
                    + format(series.gain()) + ", Ti' = " + format(integralTime) + " s, Td' = T = "
                    + format(m.lagSeconds()) + " s");
        }
    },

    /**
     * AMIGO, Åström &amp; Hägglund (2004). Recalled from memory:
     * PI: Kc = 0.15/K + (0.35 − L·T/(L + T)²)·T/(K·L), Ti = 0.35·L + 13·L·T²/(T² + 12·L·T + 7·L²);
     * PID: Kc = (0.2 + 0.45·T/L)/K, Ti = (0.4·L + 0.8·T)/(L + 0.1·T)·L, Td = 0.5·L·T/(0.3·L + T).
     * Needs L &gt; 0.
     */
    AMIGO("amigo", "K.J. Astrom, T. Hagglund, \"Revisiting the Ziegler-Nichols step response method for PID"
            + " control\", Journal of Process Control 14 (2004) 635-650") {
        @Override
        TuningResult fromModel(FopdtModel m, ControllerType type, double closedLoopTimeSeconds) {
            double l = m.deadTimeSeconds();
            double t = m.timeConstantSeconds();
            double k = m.gainMagnitude();
            if (l == 0.0) {
                return new RuleNotApplicable(this, type, "AMIGO needs a dead time L > 0: L=0.0");
            }
            if (type == ControllerType.PI) {
                double gain = 0.15 / k + (0.35 - l * t / ((l + t) * (l + t))) * t / (k * l);
                double integralTime = 0.35 * l + 13.0 * l * t * t / (t * t + 12.0 * l * t + 7.0 * l * l);
                return new TunedGains(this, type, IdealGains.pi(gain, integralTime), "");
            }
            double gain = (0.2 + 0.45 * t / l) / k;
            double integralTime = (0.4 * l + 0.8 * t) / (l + 0.1 * t) * l;
            double derivativeTime = 0.5 * l * t / (0.3 * l + t);
            return new TunedGains(this, type, new IdealGains(gain, integralTime, derivativeTime), "");
        }
    },

    /**
     * Lambda (IMC) tuning, Rivera, Morari &amp; Skogestad (1986), table for a first-order process with
     * dead time. Recalled from memory:
     * PI: Kc = (2T + L)/(2·K·λ), Ti = T + L/2, for λ/L &gt; 1.7;
     * PID: Kc = (2T + L)/(2·K·(λ + L)), Ti = T + L/2, Td = T·L/(2T + L), for λ/L &gt; 0.8.
     * Default λ (ours): the open-loop time constant T (common practice in lambda tuning), raised to
     * the paper's lower bound when the dead time is long: max(T, 1.7·L) for PI, max(T, 0.8·L) for PID.
     */
    LAMBDA("lambda", "D.E. Rivera, M. Morari, S. Skogestad, \"Internal model control. 4. PID controller"
            + " design\", Ind. Eng. Chem. Process Des. Dev. 25 (1986) 252-265") {
        @Override
        TuningResult fromModel(FopdtModel m, ControllerType type, double closedLoopTimeSeconds) {
            double l = m.deadTimeSeconds();
            double t = m.timeConstantSeconds();
            double k = m.gainMagnitude();
            double minRatio = type == ControllerType.PI ? LAMBDA_PI_MIN_RATIO : LAMBDA_PID_MIN_RATIO;
            boolean byDefault = Double.isNaN(closedLoopTimeSeconds);
            double lambda = byDefault ? defaultLambdaSeconds(m, type) : closedLoopTimeSeconds;
            if (lambda < minRatio * l) {
                return new RuleNotApplicable(this, type, "lambda must be >= " + format(minRatio)
                        + " * L for the " + type + " rule: lambda=" + format(lambda) + ", L=" + format(l));
            }
            double integralTime = t + l / 2.0;
            String note = "lambda = " + format(lambda) + " s" + (byDefault ? " (default)" : "");
            if (type == ControllerType.PI) {
                return new TunedGains(this, type, IdealGains.pi((2.0 * t + l) / (2.0 * k * lambda), integralTime),
                        note);
            }
            double gain = (2.0 * t + l) / (2.0 * k * (lambda + l));
            double derivativeTime = t * l / (2.0 * t + l);
            return new TunedGains(this, type, new IdealGains(gain, integralTime, derivativeTime), note);
        }
    },

    /**
     * Ziegler–Nichols step-response rule (1942), with a = K·L/T. Recalled from memory:
     * PI: Kc = 0.9/a, Ti = 3·L; PID: Kc = 1.2/a, Ti = 2·L, Td = L/2. The PI integral time used is 3·L,
     * the value the later textbook tables print (e.g. Åström &amp; Hägglund, <i>Advanced PID Control</i>,
     * 2006, table of the step-response method); the 1942 paper states a reset rate from which
     * Ti ≈ 3.33·L follows (from memory), so the two differ by 10 %. Applies for
     * 0 &lt; L/T &le; 1: the rule was made for lag-dominant processes and is known to give poorly damped
     * loops when the dead time dominates (common practice).
     */
    ZIEGLER_NICHOLS_STEP("ziegler-nichols", "J.G. Ziegler, N.B. Nichols, \"Optimum settings for automatic"
            + " controllers\", Transactions of the ASME 64 (1942) 759-768 (step-response rule)") {
        @Override
        TuningResult fromModel(FopdtModel m, ControllerType type, double closedLoopTimeSeconds) {
            RuleNotApplicable outside = lagDominantOnly(this, m, type);
            if (outside != null) {
                return outside;
            }
            double l = m.deadTimeSeconds();
            double a = m.gainMagnitude() * l / m.timeConstantSeconds();
            IdealGains gains = type == ControllerType.PI
                    ? IdealGains.pi(0.9 / a, 3.0 * l)
                    : new IdealGains(1.2 / a, 2.0 * l, 0.5 * l);
            return new TunedGains(this, type, gains, type == ControllerType.PI ? PI_INTEGRAL_TIME_NOTE : "");
        }
    },

    /**
     * Cohen–Coon (1953), with r = L/T. Recalled from memory:
     * PI: Kc = (1/K)·(T/L)·(0.9 + r/12), Ti = L·(30 + 3r)/(9 + 20r);
     * PID: Kc = (1/K)·(T/L)·(4/3 + r/4), Ti = L·(32 + 6r)/(13 + 8r), Td = 4·L/(11 + 2r).
     * Applies for 0 &lt; L/T &le; 1, the range usually given for it (common practice).
     */
    COHEN_COON("cohen-coon", "G.H. Cohen, G.A. Coon, \"Theoretical consideration of retarded control\","
            + " Transactions of the ASME 75 (1953) 827-834") {
        @Override
        TuningResult fromModel(FopdtModel m, ControllerType type, double closedLoopTimeSeconds) {
            RuleNotApplicable outside = lagDominantOnly(this, m, type);
            if (outside != null) {
                return outside;
            }
            double l = m.deadTimeSeconds();
            double t = m.timeConstantSeconds();
            double r = l / t;
            double scale = t / (m.gainMagnitude() * l);
            IdealGains gains = type == ControllerType.PI
                    ? IdealGains.pi(scale * (0.9 + r / 12.0), l * (30.0 + 3.0 * r) / (9.0 + 20.0 * r))
                    : new IdealGains(scale * (4.0 / 3.0 + r / 4.0), l * (32.0 + 6.0 * r) / (13.0 + 8.0 * r),
                            4.0 * l / (11.0 + 2.0 * r));
            return new TunedGains(this, type, gains, "");
        }
    };

    /** Rivera et al. (1986): the PI rule is recommended for λ/L &gt; 1.7 (we accept λ/L &ge; 1.7). */
    public static final double LAMBDA_PI_MIN_RATIO = 1.7;
    /** Rivera et al. (1986): the PID rule is recommended for λ/L &gt; 0.8 (we accept λ/L &ge; 0.8). */
    public static final double LAMBDA_PID_MIN_RATIO = 0.8;
    /** Largest L/T for the Ziegler–Nichols step-response and Cohen–Coon rules. */
    public static final double MAX_DEAD_TIME_RATIO = 1.0;

    /** Which Ziegler–Nichols step-response PI integral time is used, and why (shown with every such setting). */
    private static final String PI_INTEGRAL_TIME_NOTE = "Ti = 3L as the later tables print it; the 1942 paper's"
            + " reset rate gives about 3.33L";

    private final String label;
    private final String citation;

    ModelRule(String label, String citation) {
        this.label = label;
        this.citation = citation;
    }

    @Override
    public String label() {
        return label;
    }

    @Override
    public String citation() {
        return citation;
    }

    /**
     * Tunes from a model with the rule's default design parameter.
     *
     * @param model the process model
     * @param type PI or PID
     * @return the gains, or why the rule does not apply
     * @see #tune(ProcessModel, ControllerType, double)
     */
    public TuningResult tune(ProcessModel model, ControllerType type) {
        return tune(model, type, Double.NaN);
    }

    /**
     * Tunes from a process model: first order plus dead time for every model rule; second order
     * and integrating for the rules whose paper covers them (SIMC), the others saying they do not
     * apply.
     *
     * @param closedLoopTimeSeconds τc for SIMC or λ for lambda tuning, in seconds; NaN for the rule's
     *                              default; ignored by the other rules
     * @param model the process model
     * @param type PI or PID
     * @return the gains, or why the rule does not apply
     * @throws InvalidSettingException when closedLoopTimeSeconds is neither NaN nor finite and &gt; 0
     */
    public TuningResult tune(ProcessModel model, ControllerType type, double closedLoopTimeSeconds) {
        if (!Double.isNaN(closedLoopTimeSeconds)
                && (!Double.isFinite(closedLoopTimeSeconds) || closedLoopTimeSeconds <= 0.0)) {
            throw new InvalidSettingException("closedLoopTimeSeconds", closedLoopTimeSeconds,
                    "must be finite and > 0 (NaN for the rule's default)");
        }
        if (model instanceof FopdtModel first) {
            return fromModel(first, type, closedLoopTimeSeconds);
        }
        if (model instanceof SopdtModel second) {
            return fromSecondOrder(second, type, closedLoopTimeSeconds);
        }
        return fromIntegrating((IntegratingModel) model, type, closedLoopTimeSeconds);
    }

    /**
     * The λ that {@link #LAMBDA} uses when none is given: max(T, 1.7·L) for PI, max(T, 0.8·L) for
     * PID (see {@link #LAMBDA}).
     *
     * @param model the first-order model
     * @param type PI or PID
     * @return λ in seconds
     */
    public static double defaultLambdaSeconds(FopdtModel model, ControllerType type) {
        double ratio = type == ControllerType.PI ? LAMBDA_PI_MIN_RATIO : LAMBDA_PID_MIN_RATIO;
        return Math.max(model.timeConstantSeconds(), ratio * model.deadTimeSeconds());
    }

    abstract TuningResult fromModel(FopdtModel model, ControllerType type, double closedLoopTimeSeconds);

    TuningResult fromSecondOrder(SopdtModel model, ControllerType type, double closedLoopTimeSeconds) {
        return new RuleNotApplicable(this, type, name() + "'s paper gives a rule for a first-order model with dead"
                + " time, not a second-order one: reduce the model (Skogestad's half rule) or use simc");
    }

    TuningResult fromIntegrating(IntegratingModel model, ControllerType type, double closedLoopTimeSeconds) {
        return new RuleNotApplicable(this, type, name() + "'s rule here is for a self-regulating first-order model"
                + " with dead time, not an integrating process: use simc");
    }

    private static RuleNotApplicable noDefaultTauC(ModelRule rule, ControllerType type) {
        return new RuleNotApplicable(rule, type, "the default closed-loop time constant tau_c = L is 0"
                + " because the dead time is 0: give a closed-loop time constant");
    }

    private static String tauCNote(double tauC, double closedLoopTimeSeconds) {
        return "tau_c = " + format(tauC) + " s" + (Double.isNaN(closedLoopTimeSeconds) ? " (= L)" : "");
    }

    private static RuleNotApplicable lagDominantOnly(ModelRule rule, FopdtModel m, ControllerType type) {
        double l = m.deadTimeSeconds();
        double t = m.timeConstantSeconds();
        if (l == 0.0) {
            return new RuleNotApplicable(rule, type, rule.label() + " needs a dead time L > 0: L=0.0");
        }
        if (l / t > MAX_DEAD_TIME_RATIO) {
            return new RuleNotApplicable(rule, type, "the process is delay-dominant, outside " + rule.label()
                    + "'s range L/T <= " + format(MAX_DEAD_TIME_RATIO) + ": L/T=" + format(l / t));
        }
        return null;
    }

    private static String format(double value) {
        return String.format(Locale.ROOT, "%.4g", value);
    }
}
