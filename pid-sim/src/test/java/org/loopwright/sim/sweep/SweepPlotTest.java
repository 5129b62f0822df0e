package org.loopwright.sim.sweep;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Path;
import java.util.Map;

import org.junit.jupiter.api.Test;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.ScenarioFile;

/** The sweep plot is an envelope: the same series for 20 runs as for 200, the median inside the outer band. */
class SweepPlotTest {

    @Test
    void theSameSeriesWhateverTheNumberOfRuns() throws Exception {
        Scenario pump = ScenarioFile.read(Path.of(SweepPlotTest.class.getResource("/scenarios/booster-pump.yaml").toURI()));
        Sweep sweep = new Sweep(pump, Spread.parse("gain=30%,time-constant=20%,dead-time=40%"), 42L);
        for (int runs : new int[] {20, 200}) {
            XYChart chart = SweepFiles.plot(sweep.run(runs, 2, index -> { }), "pump");
            Map<String, XYSeries> series = chart.getSeriesMap();
            assertThat(series.keySet()).containsExactlyInAnyOrder(runs + " stable runs: min to max",
                    "10th to 90th percentile", "median", "nominal plant");
            double[] outerY = series.get(runs + " stable runs: min to max").getYData();
            double[] medianY = series.get("median").getYData();
            int instants = medianY.length;
            // the polygon runs along the maximum forward and back along the minimum
            assertThat(outerY).hasSize(2 * instants);
            for (int i = 0; i < instants; i++) {
                assertThat(medianY[i]).isBetween(outerY[2 * instants - 1 - i], outerY[i]);
            }
        }
    }
}
