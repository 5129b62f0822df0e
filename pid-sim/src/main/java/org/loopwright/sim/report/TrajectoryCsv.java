package org.loopwright.sim.report;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.loopwright.sim.simulate.Trajectory;

/**
 * Writes a trajectory as CSV, one row per sample: {@code time,setpoint,measurement,output,disturbance}
 * (seconds, process units, output units, plant-input units). A dropped-out measurement is an empty
 * cell. Numbers are written in full precision ({@link Double#toString}).
 */
public final class TrajectoryCsv {

    /** The header, in column order. */
    public static final String[] HEADER = {"time", "setpoint", "measurement", "output", "disturbance"};

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
        CSVPrinter csv = CSVFormat.DEFAULT.builder().setHeader(HEADER).setRecordSeparator('\n').get().print(out);
        for (int k = 0; k < trajectory.length(); k++) {
            double y = trajectory.measurement(k);
            csv.printRecord(Double.toString(trajectory.time(k)), Double.toString(trajectory.setpoint(k)),
                    Double.isNaN(y) ? "" : Double.toString(y), Double.toString(trajectory.output(k)),
                    Double.toString(trajectory.disturbance(k)));
        }
        csv.flush();
    }
}
