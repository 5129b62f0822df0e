package org.loopwright.examples;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Mode;
import org.loopwright.pid.runner.LoopClock;
import org.loopwright.pid.runner.StopReason;
import org.loopwright.pid.testing.VirtualClock;

class GimbalAxisTest {

    private static final PrintStream NOWHERE = new PrintStream(PrintStream.nullOutputStream());

    /** The signed shortest angle from {@code to} to {@code from}, in (−180, 180]. */
    private static double angleBetween(double from, double to) {
        double d = (from - to) % 360.0;
        return d > 180.0 ? d - 360.0 : (d <= -180.0 ? d + 360.0 : d);
    }

    @Test
    void takesTheShortWayRoundAndSettlesOnEachSetpoint() throws InterruptedException {
        // a clock that moves only when the runner waits: the schedule, and so the run, is exact
        GimbalAxis.Outcome o = GimbalAxis.run(1.0, new VirtualClock(1_000L), NOWHERE);

        assertThat(o.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(o.ticks()).isEqualTo(1001);
        assertThat(o.overruns()).isZero();
        assertThat(o.skippedTicks()).isZero();
        assertThat(o.failedTicks()).isZero();
        assertThat(o.periodErrorNanos().getTotalCount()).isEqualTo(1000);

        double[] time = o.timeSeconds();
        double[] encoder = o.encoderDegrees();
        double[] shaft = o.shaftDegrees();
        double[] volts = o.volts();
        assertThat(time).hasSize(1001);
        for (int k = 0; k < time.length; k++) {
            double t = time[k];
            assertThat(encoder[k]).isGreaterThanOrEqualTo(0.0).isLessThan(360.0);
            assertThat(volts[k]).isBetween(-GimbalAxis.SUPPLY_VOLTS, GimbalAxis.SUPPLY_VOLTS);
            if (t < 0.1) {
                assertThat(shaft[k]).as("holding at %s s", t).isEqualTo(350.0);
            } else if (t < 0.6) {
                // 350° → 10° is +20° through 0°; the long way would be −340°
                assertThat(shaft[k]).as("shaft at %s s", t).isBetween(349.9, 371.0);
            } else {
                // 10° → 300° is −70° back through 0°; the long way would be +290°
                assertThat(shaft[k]).as("shaft at %s s", t).isBetween(299.0, 371.0);
            }
            // within 1° soon after each move; static friction may hold it there for a while, then within 0.5°
            if (t >= 0.2 && t < 0.6 || t >= 0.75) {
                double target = t < 0.6 ? 10.0 : 300.0;
                double band = t >= 0.5 && t < 0.6 || t >= 0.9 ? 0.5 : 1.0;
                assertThat(angleBetween(encoder[k], target)).as("near %s° at %s s", target, t).isBetween(-band, band);
            }
        }
        assertThat(shaft[shaft.length - 1]).isBetween(299.5, 300.5);
    }

    @Test
    void theOperatorSwitchesToManualRetunesAndHandsBackWithoutABump() throws InterruptedException {
        // the virtual schedule stays exact; the clock also waits in real time so the operator can act
        GimbalAxis.Outcome o = GimbalAxis.run(1.5, new PacedStepClock(1_000L), NOWHERE);

        assertThat(o.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(o.ticks()).isEqualTo(1501);
        assertThat(o.operatorLog()).hasSize(2);
        assertThat(o.operatorLog().get(0)).startsWith("manual: ").contains("manual, ");
        assertThat(o.appliedCommands()).as(String.join("\n", o.operatorLog())).isEqualTo(3);
        assertThat(o.finalMode()).isEqualTo(Mode.AUTOMATIC);
        assertThat(o.finalSettings().gains()).isEqualTo(GimbalAxis.softerSettings().gains());
        // manual, retune and automatic while holding 300°: each transfer bumpless, the axis stays put
        double[] time = o.timeSeconds();
        double[] encoder = o.encoderDegrees();
        for (int k = 0; k < time.length; k++) {
            if (time[k] >= 0.9) {
                assertThat(angleBetween(encoder[k], 300.0)).as("near 300° at %s s", time[k]).isBetween(-0.5, 0.5);
            }
        }
    }

    @Test
    void realTimeRunCountsEveryTick() throws InterruptedException {
        ByteArrayOutputStream text = new ByteArrayOutputStream();
        GimbalAxis.Outcome o;
        try (PrintStream out = new PrintStream(text, true, StandardCharsets.UTF_8)) {
            o = GimbalAxis.run(0.3, LoopClock.SYSTEM, out);
        }
        String printed = text.toString(StandardCharsets.UTF_8);
        assertThat(printed).startsWith(SafetyNotice.TEXT).contains("Period error", "p50", "p99", "max");

        // a loaded machine may skip deadlines, so only the bookkeeping is exact
        assertThat(o.stopReason()).isEqualTo(StopReason.STOP_REQUESTED);
        assertThat(o.failedTicks()).isZero();
        assertThat(o.ticks()).isBetween(1L, 302L);
        assertThat(o.timeSeconds()).hasSize((int) o.ticks());
        assertThat(o.periodErrorNanos().getTotalCount()).isEqualTo(o.ticks() - 1);
        double[] time = o.timeSeconds();
        double[] setpoint = o.setpointDegrees();
        for (int k = 0; k < time.length; k++) {
            assertThat(setpoint[k]).isEqualTo(time[k] < 0.1 ? 350.0 : 10.0);
            assertThat(o.encoderDegrees()[k]).isGreaterThanOrEqualTo(0.0).isLessThan(360.0);
            assertThat(o.volts()[k]).isBetween(-GimbalAxis.SUPPLY_VOLTS, GimbalAxis.SUPPLY_VOLTS);
        }
    }

    @Test
    void rejectsABadDuration() {
        assertThatThrownBy(() -> GimbalAxis.run(0.0, LoopClock.SYSTEM, NOWHERE))
                .isInstanceOf(IllegalArgumentException.class).hasMessage("duration must be finite and > 0: duration=0.0");
        assertThatThrownBy(() -> GimbalAxis.run(Double.NaN, LoopClock.SYSTEM, NOWHERE))
                .isInstanceOf(IllegalArgumentException.class).hasMessage("duration must be finite and > 0: duration=NaN");
    }
}
