package org.loopwright.sim.study;

/**
 * How a sample period h compares with the continuous design's gain crossover ω_c.
 *
 * <p>Common practice (from memory, not from a cited table): ω_c·h between about 0.05 and 0.3. The
 * reason is the zero-order hold, which acts roughly as a delay of h/2 and so costs ω_c·h/2 radians of
 * phase margin (Åström &amp; Wittenmark, <i>Computer-Controlled Systems</i>, 3rd ed., ch. 7–8; checked
 * in {@code LoopAnalysisTest}): 1.4° at 0.05 and 8.6° at 0.3. Åström &amp; Wittenmark give a rule of the
 * same kind for discretised continuous designs, ω_c·h ≈ 0.15–0.5 (also from memory).
 */
public enum SamplingVerdict {
    /** ω_c·h &lt; 0.05: faster sampling than the loop needs (costs only processor time). */
    FINE("finer than needed"),
    /** 0.05 &le; ω_c·h &le; 0.3: the usual range. */
    TYPICAL("typical"),
    /** ω_c·h &gt; 0.3: the hold alone costs more than about 9° of phase margin. */
    COARSE("coarse");

    /** Lower end of the common-practice range of ω_c·h. */
    public static final double TYPICAL_LOW = 0.05;
    /** Upper end of the common-practice range of ω_c·h. */
    public static final double TYPICAL_HIGH = 0.3;

    private final String description;

    SamplingVerdict(String description) {
        this.description = description;
    }

    /** The verdict for ω_c·h. */
    public static SamplingVerdict of(double crossoverTimesPeriod) {
        if (crossoverTimesPeriod < TYPICAL_LOW) {
            return FINE;
        }
        return crossoverTimesPeriod <= TYPICAL_HIGH ? TYPICAL : COARSE;
    }

    /** A short phrase for tables. */
    public String description() {
        return description;
    }
}
