package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * The plot's envelope selects its percentiles instead of sorting: at every instant it equals min, the 10th,
 * 50th and 90th percentile by {@link Distribution}'s sorted definition (itself checked against NumPy in
 * {@link DistributionTest}) and max, over the runs' non-NaN values; NaN where every run dropped out.
 */
class EnvelopeProperties {

    @Property(tries = 1000)
    void selectedPercentilesEqualSortedOnes(@ForAll("runs") List<double[]> runs) {
        int instants = runs.get(0).length;
        double[] times = new double[instants];
        double[][] envelope = SweepFiles.envelope(runs.stream().map(run -> new PlotTrace(times, run)).toList(),
                instants);
        for (int i = 0; i < instants; i++) {
            int instant = i;
            double[] sorted = runs.stream().mapToDouble(run -> run[instant]).filter(v -> !Double.isNaN(v)).sorted()
                    .toArray();
            double[] expected = sorted.length == 0
                    ? new double[] {Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN}
                    : new double[] {sorted[0], Distribution.percentile(sorted, 10.0),
                        Distribution.percentile(sorted, 50.0), Distribution.percentile(sorted, 90.0),
                        sorted[sorted.length - 1]};
            double[] actual = {envelope[0][i], envelope[1][i], envelope[2][i], envelope[3][i], envelope[4][i]};
            assertThat(actual).as("instant %d of %s", i, runs.stream().map(Arrays::toString).toList())
                    .containsExactly(expected);
        }
    }

    /** 1 to 400 runs of 1 to 6 instants: few distinct values (ties), some NaN dropouts, some infinite values. */
    @Provide
    Arbitrary<List<double[]>> runs() {
        Arbitrary<Double> value = Arbitraries.frequencyOf(
                net.jqwik.api.Tuple.of(6, Arbitraries.doubles().between(-1e3, 1e3)),
                net.jqwik.api.Tuple.of(3, Arbitraries.integers().between(-3, 3).map(Integer::doubleValue)),
                net.jqwik.api.Tuple.of(1, Arbitraries.of(Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY)));
        return Arbitraries.integers().between(1, 6).flatMap(instants -> value.array(double[].class).ofSize(instants)
                .list().ofMinSize(1).ofMaxSize(400).map(ArrayList::new));
    }
}
