package org.loopwright.sim.study;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import javax.imageio.ImageIO;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.ParallelGains;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;

class StudyPlotsTest {

    @Test
    void writesEveryPlotAsPngAndSvg(@TempDir Path directory) throws IOException {
        // Demo: a camera gimbal axis, 1/(s(0.05s+1)) with 10 ms of delay (invented, demo only).
        TransferFunction axis = new TransferFunction(new double[] {1}, new double[] {0.05, 1, 0}, 0.01);
        ControllerSettings pid = ControllerSettings.builder().gains(new ParallelGains(6.0, 4.0, 0.0))
                .samplePeriodSeconds(0.005).build();
        Scenario scenario = Scenario.builder().plant(axis).controller(pid).setpoint(SetpointChange.step(0, 1))
                .durationSeconds(3.0).build();
        StudyResult result = DiscretisationStudy.run(scenario, List.of(0.005, 0.02));
        List<Path> files = StudyPlots.write(result, directory.resolve("plots"));

        assertThat(files).extracting(p -> p.getFileName().toString()).containsExactlyInAnyOrder(
                "controller-magnitude-h0.005.png", "controller-magnitude-h0.005.svg",
                "controller-phase-h0.005.png", "controller-phase-h0.005.svg", "step-h0.005.png", "step-h0.005.svg",
                "controller-magnitude-h0.02.png", "controller-magnitude-h0.02.svg",
                "controller-phase-h0.02.png", "controller-phase-h0.02.svg", "step-h0.02.png", "step-h0.02.svg",
                "loop-magnitude.png", "loop-magnitude.svg", "loop-phase.png", "loop-phase.svg",
                "nyquist.png", "nyquist.svg");
        for (Path file : files) {
            assertThat(Files.size(file)).as(file.toString()).isGreaterThan(1000);
            if (file.toString().endsWith(".png")) {
                BufferedImage image = ImageIO.read(file.toFile());
                // the Nyquist plot is drawn square (equal aspect), with its legend below
                boolean nyquist = file.getFileName().toString().startsWith("nyquist");
                assertThat(image.getWidth()).isEqualTo(nyquist ? 640 : 900);
                assertThat(image.getHeight()).isEqualTo(nyquist ? 640 + 16 + 20 * (2 + 3) : 560);
            } else {
                assertThat(Files.readString(file)).contains("<svg");
            }
        }
    }
}
