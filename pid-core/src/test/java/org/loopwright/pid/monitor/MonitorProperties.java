package org.loopwright.pid.monitor;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Combinators;

/**
 * Invariants of the monitor over arbitrary sample sequences (jqwik draws the values, bad ones
 * included): every figure stays in its range, and a bad sample changes no figure but the count of bad
 * samples.
 */
class MonitorProperties {

    /** One sample: setpoint, measurement, output, automatic. */
    record Sample(double r, double y, double u, boolean automatic) {
        boolean good() {
            return Double.isFinite(r) && Double.isFinite(y) && Double.isFinite(u);
        }
    }

    @Provide
    Arbitrary<List<Sample>> sequences() {
        Arbitrary<Double> value = Arbitraries.oneOf(Arbitraries.doubles().between(-1e6, 1e6),
                Arbitraries.doubles().between(-2.0, 2.0),
                Arbitraries.of(Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 0.0, 100.0, -100.0));
        Arbitrary<Double> setpoint = Arbitraries.oneOf(Arbitraries.of(0.0, 1.0), value);
        return Combinators.combine(setpoint, value, value, Arbitraries.of(true, true, true, false))
                .as(Sample::new).list().ofMinSize(1).ofMaxSize(200);
    }

    private static LoopMonitor monitor() {
        return new LoopMonitor(MonitorSettings.builder().samplePeriodSeconds(0.1).timeScaleSeconds(1.0)
                .acceptableAmplitude(0.05).outputRange(-100.0, 100.0).frozenSamples(5).build());
    }

    @Property
    void everyFigureStaysInItsRange(@ForAll("sequences") List<Sample> samples) {
        LoopMonitor monitor = monitor();
        MonitorSummary s = new MonitorSummary();
        long good = 0;
        for (Sample x : samples) {
            monitor.sample(x.r(), x.y(), x.u(), x.automatic());
            good += x.good() ? 1 : 0;
            monitor.readSummary(s);
            assertThat(inRange(s, good)).as("%s after %d good samples", s, good).isTrue();
        }
    }

    private static boolean inRange(MonitorSummary s, long good) {
        return s.samples() == good
                && s.oscillationEvents() >= 0.0 && s.oscillationEvents() <= good
                && (Double.isNaN(s.saturationShare()) || s.saturationShare() >= 0.0 && s.saturationShare() <= 1.0)
                && (Double.isNaN(s.idleIndex()) || s.idleIndex() >= -1.0 && s.idleIndex() <= 1.0)
                && (Double.isNaN(s.noiseStdDev()) || Double.isFinite(s.noiseStdDev()) && s.noiseStdDev() >= 0.0)
                && s.unchangedSamples() >= 0 && s.unchangedSamples() <= Math.max(0, good - 1)
                && (Double.isNaN(s.oscillationPeriodSeconds()) || s.oscillationPeriodSeconds() > 0.0);
    }

    @Property
    void aBadSampleChangesNoFigure(@ForAll("sequences") List<Sample> samples) {
        LoopMonitor withBad = monitor();
        LoopMonitor without = monitor();
        long bad = 0;
        for (Sample x : samples) {
            withBad.sample(x.r(), x.y(), x.u(), x.automatic());
            if (x.good()) {
                without.sample(x.r(), x.y(), x.u(), x.automatic());
            } else {
                bad++;
            }
        }
        MonitorSummary a = withBad.readSummary(new MonitorSummary());
        MonitorSummary b = without.readSummary(new MonitorSummary());
        assertThat(a.badSamples()).isEqualTo(bad);
        // Double.compare: NaN (no evidence yet) equals NaN
        assertThat(a).usingRecursiveComparison().withComparatorForType(Double::compare, Double.class)
                .ignoringFields("badSamples").isEqualTo(b);
    }
}
