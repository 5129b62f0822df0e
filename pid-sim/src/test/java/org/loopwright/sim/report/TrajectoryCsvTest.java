package org.loopwright.sim.report;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.io.StringReader;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.form.IdealGains;
import org.loopwright.sim.nonideal.SensorModel;
import org.loopwright.sim.plant.TransferFunction;
import org.loopwright.sim.scenario.LoadStep;
import org.loopwright.sim.scenario.Scenario;
import org.loopwright.sim.scenario.SetpointChange;
import org.loopwright.sim.simulate.Simulation;
import org.loopwright.sim.simulate.Trajectory;

class TrajectoryCsvTest {

    @Test
    void oneRowPerSampleWithEveryValueReadableBackExactly() throws IOException {
        Scenario s = Scenario.builder().plant(TransferFunction.fopdt(2.0, 10.0, 1.5))
                .controller(ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0)).samplePeriodSeconds(0.5).build())
                .setpoint(SetpointChange.step(0.0, 1.0)).disturbance(new LoadStep(20.2, -0.5))
                .sensor(new SensorModel(0.01, 0.0, 0, 0.0, 0.2)).durationSeconds(40.0).build();
        Trajectory t = Simulation.run(s);
        StringBuilder text = new StringBuilder();
        TrajectoryCsv.write(t, text);
        List<CSVRecord> rows = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(text.toString())).getRecords();
        assertThat(text.toString()).startsWith("time,setpoint,measurement,output,disturbance\n");
        assertThat(rows).hasSize(t.length()).hasSize(81);
        int blanks = 0;
        for (int k = 0; k < t.length(); k++) {
            CSVRecord row = rows.get(k);
            assertThat(Double.parseDouble(row.get("time"))).isEqualTo(t.time(k));
            assertThat(Double.parseDouble(row.get("setpoint"))).isEqualTo(t.setpoint(k));
            assertThat(Double.parseDouble(row.get("output"))).isEqualTo(t.output(k));
            assertThat(Double.parseDouble(row.get("disturbance"))).isEqualTo(t.disturbance(k));
            if (row.get("measurement").isEmpty()) {
                blanks++;
                assertThat(t.measurement(k)).isNaN();
            } else {
                assertThat(Double.parseDouble(row.get("measurement"))).isEqualTo(t.measurement(k));
            }
        }
        assertThat(blanks).as("dropouts are blank cells").isPositive();
    }
}
