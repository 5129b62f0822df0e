package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.loopwright.sim.cli.JsonShape.keys;

import java.nio.file.Files;
import java.nio.file.Path;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The JSON of margins, compare, tune, identify and sweep as Jackson writes their result records: the keys
 * (snake_case, in order, every key present with null for a figure that does not exist or apply) and
 * the enum words (the files' and the options' words). The field names are those the commands had
 * before they were records, so scripts that read them keep working; the values are checked against
 * their sources in each command's own test.
 */
class JsonResultsTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final String[] MARGINS = {"gain_margin", "gain_margin_db", "phase_crossover", "phase_margin_deg",
        "gain_crossover", "ms", "ms_frequency", "mt", "mt_frequency", "delay_margin", "phase_crossings",
        "gain_crossings"};

    @Test
    void marginsHasTheContinuousAndTheSampledLoop() throws Exception {
        JsonNode root = JSON.readTree(CommandRun.of("margins", FrequencyCommandsTest.scenario("third-order-lag.yaml"),
                "--json").out());

        keys(root, "continuous", "sampled");
        keys(root.get("continuous"), MARGINS);
        keys(root.get("sampled").get("phase_crossings").get(0), "frequency", "gain_margin", "gain_margin_db");
        keys(root.get("sampled").get("gain_crossings").get(0), "frequency", "phase_margin_deg", "delay_margin");
        String[] sampled = concat(MARGINS, "stable", "sensor_delay_samples", "note", "stable_gain_range",
                "lower_gain_margin", "largest_pole_magnitude", "sample_period", "integral_method", "derivative_method");
        keys(root.get("sampled"), sampled);
        assertThat(root.get("sampled").get("note").isNull()).as("a stable loop needs no note").isTrue();
        keys(root.get("sampled").get("stable_gain_range"), "low", "high");
        assertThat(root.get("sampled").get("integral_method").asText()).isEqualTo("tustin");
    }

    @Test
    void sweepHasTheSharesTheDistributionsAndTwoRuns(@TempDir Path dir) throws Exception {
        JsonNode root = JSON.readTree(CommandRun.of("sweep", FrequencyCommandsTest.scenario("third-order-lag.yaml"),
                "--runs", "4", "--spread", "gain=20%", "--out", dir.toString(), "--json").out());

        keys(root, "runs", "seed", "threads", "distribution", "stability_basis", "spread", "unstable_share",
                "not_assessed_share", "not_settled_share", "overshoot_percent", "settling_time", "iae",
                "saturated_percent", "worst_run", "nominal_run");
        keys(root.get("spread"), "gain", "time_constant", "dead_time");
        keys(root.get("iae"), "count", "min", "median", "p90", "max");
        for (String run : new String[] {"worst_run", "nominal_run"}) {
            // a linear plant's keys: its factors, then the drawn plant, between the run and its figures
            keys(root.get(run), "run", "stability", "gain_factor", "time_constant_factor", "dead_time_factor",
                    "numerator", "denominator", "dead_time", "largest_pole_magnitude", "overshoot_percent",
                    "settling_time", "steady_state_error", "iae", "saturated_fraction");
        }
        assertThat(root.get("stability_basis").asText()).isEqualTo("poles");
        assertThat(root.get("nominal_run").get("stability").asText()).isEqualTo("stable");
    }

    @Test
    void compareHasOneObjectPerRow() throws Exception {
        JsonNode rows = JSON.readTree(CommandRun.of("compare", FrequencyCommandsTest.scenario("third-order-lag.yaml"),
                "--periods", "0.1", "--json").out());

        for (JsonNode row : rows) {
            keys(row, "kind", "integral_method", "derivative_method", "sample_period", "phase_margin_deg", "gain_margin",
                    "ms", "stable", "overshoot_percent", "iae", "load_iae", "magnitude_error_db", "phase_error_deg",
                    "crossover_times_period", "sampling_verdict", "note");
        }
        assertThat(rows.get(0).get("kind").asText()).isEqualTo("continuous");
        assertThat(rows.get(0).get("integral_method").isNull()).isTrue();
        assertThat(rows.get(1).get("kind").asText()).isEqualTo("sampled");
        assertThat(rows.get(1).get("sampling_verdict").asText()).isIn("fine", "typical", "coarse");
    }

    @Test
    void tuneHasOneObjectPerCandidate() throws Exception {
        JsonNode one = JSON.readTree(CommandRun.of("tune", "--process-gain", "2", "--time-constant", "10",
                "--second-time-constant", "3", "--dead-time", "1", "--rule", "simc", "--type", "pid", "--json").out());

        keys(one, "rule", "type", "citation", "note", "ideal", "parallel", "series", "margins_of", "phase_margin_deg",
                "gain_margin", "ms", "stable", "setpoint_step", "load_step");
        assertThat(one.get("type").asText()).isEqualTo("pid");
        keys(one.get("ideal"), "gain", "integral_time", "derivative_time");
        keys(one.get("series"), "gain", "integral_time", "derivative_time");
        keys(one.get("parallel"), "proportional_gain", "integral_gain", "derivative_gain");
        keys(one.get("setpoint_step"), "rise_time", "settling_time", "overshoot_percent", "response", "iae");
        keys(one.get("load_step"), "iae", "peak_deviation");

        // from an ultimate point alone there is no model: no margins, no simulation, each said as null
        JsonNode point = JSON.readTree(CommandRun.of("tune", "--ultimate-gain", "2", "--ultimate-period", "3",
                "--json").out());
        assertThat(point.size()).isEqualTo(2);
        for (JsonNode c : point) {
            for (String missing : new String[] {"margins_of", "phase_margin_deg", "ms", "setpoint_step", "load_step"}) {
                assertThat(c.get(missing).isNull()).as(missing).isTrue();
            }
        }
    }

    @Test
    void identifyHasTheModelAndTheFit(@TempDir Path dir) throws Exception {
        String test = FrequencyCommandsTest.scenario("pump-step-test.csv");
        JsonNode first = JSON.readTree(CommandRun.of("identify", test, "--out", dir.toString(), "--json").out());
        String[] fields = {"model", "gain", "time_constant", "time_constants", "dead_time", "baseline", "step_time",
            "input_change", "rmse", "r_squared", "rows_in_file", "kept_every"};

        keys(first, fields);
        assertThat(first.get("time_constants").isNull()).isTrue();
        JsonNode second = JSON.readTree(CommandRun.of("identify", test, "--model", "sopdt", "--out", dir.toString(),
                "--json").out());
        keys(second, fields);
        assertThat(second.get("time_constant").isNull()).isTrue();
        assertThat(second.get("time_constants")).hasSize(2);

        // tune reads identify's JSON back, with the null it does not need
        Path model = Files.writeString(dir.resolve("model.json"), first.toString());
        CommandRun tuned = CommandRun.of("tune", "--model-file", model.toString(), "--rule", "simc");
        assertThat(tuned.exitCode()).as(tuned.err()).isZero();
    }

    private static String[] concat(String[] first, String... more) {
        String[] all = java.util.Arrays.copyOf(first, first.length + more.length);
        System.arraycopy(more, 0, all, first.length, more.length);
        return all;
    }
}
