package org.loopwright.sim.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.ScenarioFile;

/** The identify command on an INVENTED step test (analytic FOPDT response plus seeded noise). */
class IdentifyCommandTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    /**
     * Invented water-bath bump test: heater 30 → 40 % at t = 60 s, K = 0.5 °C/%, T = 300 s, L = 40 s,
     * noise σ = 0.03 °C, sampled every 2 s for 2400 s.
     */
    private static Path bumpTest(Path dir) throws IOException {
        Random random = new Random(11L);
        StringBuilder csv = new StringBuilder("time,input,output\n");
        for (int i = 0; i <= 1200; i++) {
            double t = 2.0 * i;
            double u = t >= 60.0 ? 40.0 : 30.0;
            double tau = t - 60.0 - 40.0;
            double y = 35.0 + (tau > 0.0 ? 0.5 * 10.0 * (1.0 - Math.exp(-tau / 300.0)) : 0.0)
                    + 0.03 * random.nextGaussian();
            csv.append(String.format(Locale.ROOT, "%.1f,%.1f,%.4f%n", t, u, y));
        }
        Path file = dir.resolve("bath-bump.csv");
        Files.writeString(file, csv);
        return file;
    }

    @Test
    void fitsAFirstOrderModelAndWritesThePlot(@TempDir Path dir) throws Exception {
        Path file = bumpTest(dir);

        CommandRun run = CommandRun.of("identify", file.toString(), "--out", dir.toString(), "--json");

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode node = JSON.readTree(run.out());
        assertThat(node.get("model").asText()).isEqualTo("fopdt");
        assertThat(node.get("gain").asDouble()).isCloseTo(0.5, within(0.01));
        assertThat(node.get("time_constant").asDouble()).isCloseTo(300.0, within(15.0));
        assertThat(node.get("dead_time").asDouble()).isCloseTo(40.0, within(6.0));
        assertThat(node.get("rmse").asDouble()).isCloseTo(0.03, within(0.005));
        assertThat(node.get("r_squared").asDouble()).isGreaterThan(0.99);
        Path png = dir.resolve("identify-fopdt.png");
        assertThat(png).exists();
        assertThat(Files.readAllBytes(png)).startsWith(0x89, 'P', 'N', 'G');
    }

    @Test
    void writesTheFittedModelAsAPlantBlockThatReadsBackToTheSameTransferFunction(@TempDir Path dir) throws Exception {
        Path file = bumpTest(dir);
        Path plant = dir.resolve("plant.yaml");

        CommandRun run = CommandRun.of("identify", file.toString(), "--out", dir.toString(), "--json",
                "--write-plant", plant.toString());

        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode node = JSON.readTree(run.out());
        TransferFunction read = (TransferFunction) ScenarioFile.readPlant(plant);
        // the written numbers round-trip exactly (Java's shortest decimal form)
        assertThat(read.numerator()).containsExactly(node.get("gain").asDouble());
        assertThat(read.denominator()).containsExactly(node.get("time_constant").asDouble(), 1.0);
        assertThat(read.deadTimeSeconds()).isEqualTo(node.get("dead_time").asDouble());
    }

    @Test
    void secondOrderFitReportsTwoTimeConstantsAndTheTextSuggestsATuneCommand(@TempDir Path dir) throws Exception {
        Path file = bumpTest(dir);

        JsonNode node = JSON.readTree(CommandRun.of("identify", file.toString(), "--model", "sopdt", "--out",
                dir.toString(), "--json").out());
        CommandRun text = CommandRun.of("identify", file.toString(), "--out", dir.toString());

        assertThat(node.get("model").asText()).isEqualTo("sopdt");
        assertThat(node.get("time_constants")).hasSize(2);
        // the data is first order: the second lag comes out small next to the first
        assertThat(node.get("time_constants").get(1).asDouble()).isLessThan(0.2 * node.get("time_constants").get(0).asDouble());
        assertThat(text.out()).contains("Model: fopdt, gain 0.5").contains("Tune it with: tune --process-gain 0.5");
    }

    @Test
    void dataWithoutAStepIsBadInput(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("flat.csv");
        StringBuilder csv = new StringBuilder("time,input,output\n");
        for (int i = 0; i < 20; i++) {
            csv.append(i).append(",30,35\n");
        }
        Files.writeString(file, csv);

        CommandRun run = CommandRun.of("identify", file.toString(), "--out", dir.toString());

        assertThat(run.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(run.err().strip()).isEqualTo(file + ": holds no step: column 'input' starts and ends at 30.0000"
                + " (a step test needs one step in the input)");
        CommandRun wrongModel = CommandRun.of("identify", file.toString(), "--model", "arx");
        assertThat(wrongModel.exitCode()).isEqualTo(LoopwrightCommand.BAD_INPUT);
        assertThat(wrongModel.err()).startsWith("--model must be one of fopdt, sopdt: --model=arx");
    }
}
