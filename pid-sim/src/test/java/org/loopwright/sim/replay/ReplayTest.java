package org.loopwright.sim.replay;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.util.Locale;
import java.util.Random;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.Fault;
import org.loopwright.pid.FaultPolicy;
import org.loopwright.pid.PidController;
import org.loopwright.pid.WindupProtection;
import org.loopwright.pid.form.IdealGains;

class ReplayTest {

    private static final String[] MODE_CELLS = {"", "", "", "", "", "auto", "manual", "track"};

    /**
     * An independent check of the wiring: the replay must give, row for row, what a controller
     * driven directly by the documented rules gives on the same signals.
     */
    @ParameterizedTest
    @ValueSource(booleans = {false, true})
    void replayEqualsAControllerDrivenDirectly(boolean measuredPeriod) {
        ControllerSettings settings = ControllerSettings.builder()
                .gains(new IdealGains(1.8, 12.0, 2.0))
                .samplePeriodSeconds(0.1)
                .outputRange(-5.0, 40.0)
                .outputSlewPerSecond(60.0)
                .windupProtection(WindupProtection.ACTUATOR_TRACKING)
                .faultPolicy(FaultPolicy.SAFE_OUTPUT, 3.0)
                .build();
        Random random = new Random(42);
        int rows = 400;
        double[] time = new double[rows];
        double[] setpoint = new double[rows];
        double[] measurement = new double[rows];
        double[] feedforward = new double[rows];
        String[] mode = new String[rows];
        double[] manual = new double[rows];
        double[] track = new double[rows];
        StringBuilder csv = new StringBuilder("time,setpoint,measurement,feedforward,mode,manual_output,track_value,note\n");
        double t = 0.0;
        for (int k = 0; k < rows; k++) {
            t += k == 0 ? 0.0 : (random.nextInt(20) == 0 ? -0.05 : 0.05 + 0.1 * random.nextDouble());
            time[k] = t;
            setpoint[k] = k < 100 ? 10.0 : 25.0;
            measurement[k] = random.nextInt(25) == 0 ? Double.NaN : 10.0 + 15.0 * random.nextDouble();
            feedforward[k] = random.nextInt(40) == 0 ? Double.NaN : 2.0 * random.nextDouble();
            mode[k] = MODE_CELLS[random.nextInt(MODE_CELLS.length)];
            manual[k] = random.nextBoolean() ? Double.NaN : 30.0 * random.nextDouble();
            track[k] = random.nextBoolean() ? Double.NaN : 30.0 * random.nextDouble();
            csv.append(String.format(Locale.ROOT, "%s,%s,%s,%s,%s,%s,%s,row %d%n", exact(time[k]), exact(setpoint[k]),
                    cell(measurement[k]), cell(feedforward[k]), mode[k], cell(manual[k]), cell(track[k]), k));
        }
        ReplayResult result = Replay.run(settings, TraceFile.parse("log.csv", csv.toString()), measuredPeriod);

        PidController direct = new PidController(settings);
        direct.feedforwardOn(true);
        int faults = 0;
        for (int k = 0; k < rows; k++) {
            switch (mode[k]) {
                case "auto" -> direct.switchToAutomatic();
                case "manual" -> direct.switchToManual();
                case "track" -> direct.switchToTracking();
                default -> { }
            }
            if (!Double.isNaN(manual[k])) {
                direct.manualOutput(manual[k]);
            }
            direct.trackValue(track[k]);
            direct.actuatorPosition(track[k]);
            direct.feedforward(feedforward[k]);
            double expected = measuredPeriod
                    ? direct.update(setpoint[k], measurement[k], k == 0 ? 0.1 : time[k] - time[k - 1])
                    : direct.update(setpoint[k], measurement[k]);
            assertThat(result.output(k)).as("output at row %d", k).isEqualTo(expected);
            assertThat(result.proportional(k)).isEqualTo(direct.proportionalTerm());
            assertThat(result.integral(k)).isEqualTo(direct.integralTerm());
            assertThat(result.derivative(k)).isEqualTo(direct.derivativeTerm());
            assertThat(result.status(k)).isEqualTo(direct.fault());
            assertThat(result.mode(k)).isEqualTo(direct.mode());
            faults += direct.fault() == Fault.NONE ? 0 : 1;
        }
        // the data exercise what they are meant to: faults of each kind that can occur here
        assertThat(faults).isPositive();
        assertThat(ReplaySummary.of(result).faultRows()).isEqualTo(faults);
        assertThat(ReplaySummary.of(result).faultRows(Fault.PERIOD_NOT_VALID)).isEqualTo(measuredPeriod
                ? periodFaults(time, measurement) : 0);
    }

    /** Rows whose time does not advance and whose measurement is good (a bad measurement is reported first). */
    private static int periodFaults(double[] time, double[] measurement) {
        int count = 0;
        for (int k = 1; k < time.length; k++) {
            count += time[k] > time[k - 1] || Double.isNaN(measurement[k]) ? 0 : 1;
        }
        assertThat(count).isPositive();
        return count;
    }

    private static String exact(double value) {
        return Double.toString(value);
    }

    private static String cell(double value) {
        return Double.isNaN(value) ? "" : Double.toString(value);
    }

    @Test
    void summaryCountsFaultsOutputRangeAndTimeAtALimit() throws IOException {
        // P only, Kc = 1, output 0..10, h = 0.5 s: errors 20, 5, 20, (missing) give 10, 5, 10, 10 (held)
        ControllerSettings settings = ControllerSettings.builder().gains(IdealGains.pi(1.0, Double.POSITIVE_INFINITY))
                .samplePeriodSeconds(0.5).outputRange(0.0, 10.0).windupProtection(WindupProtection.NONE).build();
        Trace trace = TraceFile.parse("t.csv", "time,setpoint,measurement\n0,20,0\n0.5,20,15\n1,20,0\n1.5,20,nan\n");
        ReplayResult result = Replay.run(settings, trace, false);
        ReplaySummary summary = ReplaySummary.of(result);
        assertThat(summary.rows()).isEqualTo(4);
        assertThat(summary.faultRows()).isEqualTo(1);
        assertThat(summary.faultRows(Fault.MEASUREMENT_NOT_FINITE)).isEqualTo(1);
        assertThat(summary.outputMin()).isEqualTo(5.0);
        assertThat(summary.outputMax()).isEqualTo(10.0);
        assertThat(summary.outputMean()).isEqualTo(8.75);
        // the trace spans 0 to 1.5 s (issue 10: it used to count the first row's period too, 2 s); each
        // output holds until the next row's time, so the rows at 0 and 1 s are 1 s at the limit
        assertThat(summary.saturatedSeconds()).isEqualTo(1.0);
        assertThat(summary.totalSeconds()).isEqualTo(1.5);
        assertThat(summary.lines()).containsExactly(
                "Rows: 4, spanning 1.500 s (first to last time)",
                "Faults: 1 row (measurement-not-finite 1)",
                "Output: min 5.000, max 10.000, mean 8.750",
                "Time in saturation: 1.000 s of 1.500 s (66.7 %) at output-min 0.000 or output-max 10.000");
        StringBuilder csv = new StringBuilder();
        result.writeCsv(csv);
        assertThat(csv.toString()).isEqualTo("""
                time,setpoint,measurement,output,proportional,integral,derivative,status
                0,20,0,10.0,20.0,0.0,0.0,normal
                0.5,20,15,5.0,5.0,0.0,0.0,normal
                1,20,0,10.0,20.0,0.0,0.0,normal
                1.5,20,nan,10.0,20.0,0.0,0.0,measurement-not-finite
                """);
    }

    @Test
    void statusWordsAreNormalOrTheFaultInLowerCaseWithHyphens() {
        assertThat(ReplayResult.statusWord(Fault.NONE)).isEqualTo("normal");
        assertThat(ReplayResult.statusWord(Fault.MEASUREMENT_NOT_FINITE)).isEqualTo("measurement-not-finite");
        assertThat(ReplayResult.statusWord(Fault.PERIOD_NOT_VALID)).isEqualTo("period-not-valid");
    }
}
