package org.loopwright.sim.study;

import org.loopwright.sim.report.NumberText;
import org.loopwright.sim.report.ResultTable;
import org.loopwright.sim.report.ResultTable.Column;
import org.loopwright.sim.scenario.Units;

/**
 * A discretisation study as one typed table: the text {@code compare} prints and the table of its
 * report are both this one, in the scenario's units.
 */
public final class StudyTable {

    private StudyTable() {
    }

    /**
     * The study's table.
     *
     * @param result the study
     * @param units  the scenario's units
     * @return one row per study row
     */
    public static ResultTable of(StudyResult result, Units units) {
        ResultTable table = ResultTable.of("Each discretisation at each sample period against the continuous design",
                Column.text("methods", "integral/derivative"), Column.number("sample_period", "h", "s", 4),
                Column.number("crossover_times_period", "ωc·h", "", 3), Column.text("rule_of_thumb", "rule of thumb"),
                Column.number("phase_margin", "PM", "°", 3), Column.number("gain_margin", "GM", "", 3),
                Column.number("ms", "Ms", "", 3), Column.text("stable", "stable"),
                Column.number("overshoot", "overshoot", "%", 3), Column.number("iae", "IAE", units.processSeconds(), 4),
                Column.number("load_iae", "load IAE", units.processSeconds(), 4),
                Column.number("magnitude_error", "|C| error", "dB", 3),
                Column.number("phase_error", "arg C error", "°", 3));
        for (StudyRow row : result.rows()) {
            double h = row.kind() == StudyRow.Kind.CONTINUOUS ? Double.NaN : row.samplePeriodSeconds();
            if (row.kind() == StudyRow.Kind.NOT_APPLICABLE) {
                table.row(row.label(), h, row.crossoverTimesPeriod(), "not applicable: " + row.note(), null, null,
                        null, null, null, null, null, null, null);
                continue;
            }
            table.row(row.label(), h, row.crossoverTimesPeriod(),
                    row.verdict() == null ? NumberText.MISSING : row.verdict().description(), row.phaseMarginDegrees(),
                    row.gainMargin(), row.ms(), row.stable() == null ? NumberText.MISSING : row.stable() ? "yes" : "NO",
                    row.overshootPercent(), row.iae(), row.loadIae(), row.magnitudeErrorDb(), row.phaseErrorDegrees());
        }
        return table;
    }
}
