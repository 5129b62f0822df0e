package org.loopwright.sim.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.loopwright.sim.simulate.Trajectory;

/**
 * Writes a trajectory as CSV, one row per sample: {@code time,setpoint,measurement,output,disturbance}
 * (seconds, process units, output units, plant-input units). A dropped-out measurement is an empty
 * cell. A cascade adds {@code inner_setpoint,inner_measurement} (the inner loop's, in its process
 * units; the output is then the inner controller's), a split range {@code first_actuator,second_actuator}.
 * Numbers are written in full precision ({@link Double#toString}).
 */
public final class TrajectoryCsv {

    /** The header, in column order. */
    public static final String[] HEADER = {"time", "setpoint", "measurement", "output", "disturbance"};
    /** The columns a cascade adds. */
    public static final String[] INNER_HEADER = {"inner_setpoint", "inner_measurement"};
    /** The columns a split range adds. */
    public static final String[] SPLIT_HEADER = {"first_actuator", "second_actuator"};

    private TrajectoryCsv() {
    }

    /** Writes the file, replacing any file of that name. */
    public static void write(Trajectory trajectory, Path file) throws IOException {
        try (Writer out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            write(trajectory, out);
        }
    }

    /** Writes the CSV text to a writer (left open). */
    public static void write(Trajectory trajectory, Appendable out) throws IOException {
        List<String> header = new ArrayList<>(List.of(HEADER));
        if (trajectory.hasInnerLoop()) {
            header.addAll(List.of(INNER_HEADER));
        }
        if (trajectory.hasSplitRange()) {
            header.addAll(List.of(SPLIT_HEADER));
        }
        CSVPrinter csv = CSVFormat.DEFAULT.builder().setHeader(header.toArray(String[]::new)).setRecordSeparator('\n')
                .get().print(out);
        List<String> row = new ArrayList<>(header.size());
        for (int k = 0; k < trajectory.length(); k++) {
            double y = trajectory.measurement(k);
            row.clear();
            row.addAll(List.of(Double.toString(trajectory.time(k)), Double.toString(trajectory.setpoint(k)),
                    Double.isNaN(y) ? "" : Double.toString(y), Double.toString(trajectory.output(k)),
                    Double.toString(trajectory.disturbance(k))));
            if (trajectory.hasInnerLoop()) {
                row.add(Double.toString(trajectory.innerSetpoint(k)));
                row.add(Double.toString(trajectory.innerMeasurement(k)));
            }
            if (trajectory.hasSplitRange()) {
                row.add(Double.toString(trajectory.firstActuator(k)));
                row.add(Double.toString(trajectory.secondActuator(k)));
            }
            csv.printRecord(row);
        }
        csv.flush();
    }
}
