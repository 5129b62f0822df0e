package org.loopwright.pid.tuning;

import org.loopwright.pid.form.IdealGains;

/**
 * The published tuning rules that work from an ultimate gain Ku and period Pu (from a relay
 * experiment or a gain sweep): {@link #tune(UltimatePoint, ControllerType)}. The rules from a process
 * model are {@link ModelRule}.
 *
 * <p>The formulas are written as the maintainers recall them from the cited papers (and from
 * Åström &amp; Hägglund, <i>Advanced PID Control</i>, ISA 2006); each constant says so.
 *
 * <p>Example: {@code UltimatePointRule.ZIEGLER_NICHOLS.tune(new UltimatePoint(8.0, 3.63), ControllerType.PI)}
 * gives Kc = 0.45·8 = 3.6 and Ti = 3.63/1.2 s.
 *
 * <p>Thread-safe: stateless.
 */
public enum UltimatePointRule implements TuningRule {

    /**
     * Ziegler–Nichols ultimate-sensitivity rule (1942). Recalled from memory:
     * PI: Kc = 0.45·Ku, Ti = Pu/1.2; PID: Kc = 0.6·Ku, Ti = Pu/2, Td = Pu/8.
     */
    ZIEGLER_NICHOLS("ziegler-nichols", "J.G. Ziegler, N.B. Nichols, \"Optimum settings for automatic"
            + " controllers\", Transactions of the ASME 64 (1942) 759-768 (ultimate-sensitivity rule)") {
        @Override
        public TuningResult tune(UltimatePoint p, ControllerType type) {
            double ku = p.ultimateGain();
            double pu = p.ultimatePeriodSeconds();
            IdealGains gains = type == ControllerType.PI
                    ? IdealGains.pi(0.45 * ku, pu / 1.2)
                    : new IdealGains(0.6 * ku, pu / 2.0, pu / 8.0);
            return new TunedGains(this, type, gains, "");
        }
    },

    /**
     * Tyreus–Luyben (1992). Recalled from memory:
     * PI: Kc = Ku/3.2, Ti = 2.2·Pu; PID: Kc = Ku/2.2, Ti = 2.2·Pu, Td = Pu/6.3.
     */
    TYREUS_LUYBEN("tyreus-luyben", "B.D. Tyreus, W.L. Luyben, \"Tuning PI controllers for integrator/dead time"
            + " processes\", Ind. Eng. Chem. Res. 31 (1992) 2625-2628") {
        @Override
        public TuningResult tune(UltimatePoint p, ControllerType type) {
            double ku = p.ultimateGain();
            double pu = p.ultimatePeriodSeconds();
            IdealGains gains = type == ControllerType.PI
                    ? IdealGains.pi(ku / 3.2, 2.2 * pu)
                    : new IdealGains(ku / 2.2, 2.2 * pu, pu / 6.3);
            return new TunedGains(this, type, gains, "");
        }
    };

    private final String label;
    private final String citation;

    UltimatePointRule(String label, String citation) {
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
     * Tunes from an ultimate gain and period.
     *
     * @param point the ultimate gain and period
     * @param type  PI or PID
     * @return the gains
     */
    public abstract TuningResult tune(UltimatePoint point, ControllerType type);
}
