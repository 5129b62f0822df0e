package org.loopwright.sim.assess;

import java.util.List;
import java.util.Optional;

/**
 * The result of {@link LoopAssessment}: one finding per condition, the oscillation's period and
 * amplitude when one was found, and where in the record the monitor saw it.
 *
 * @param loopName                 the record's name
 * @param samples                  samples in the record
 * @param samplePeriodSeconds      h used
 * @param findings                 one per condition, in report order
 * @param oscillationPeriodSeconds the period, NaN when the loop does not oscillate
 * @param oscillationAmplitude     the amplitude of the error, NaN when the loop does not oscillate
 * @param oscillationStretches     where the monitor's oscillation status was warn or alarm
 * @param assumptions              what was assumed for want of an option
 */
public record Assessment(String loopName, int samples, double samplePeriodSeconds, List<Finding> findings,
        double oscillationPeriodSeconds, double oscillationAmplitude, List<TimeSpan> oscillationStretches,
        List<String> assumptions) {

    /** Copies the lists. */
    public Assessment {
        findings = List.copyOf(findings);
        oscillationStretches = List.copyOf(oscillationStretches);
        assumptions = List.copyOf(assumptions);
    }

    /** The finding of a condition, by name. */
    public Optional<Finding> finding(String name) {
        return findings.stream().filter(f -> f.name().equals(name)).findFirst();
    }

    /** The status of a condition, by name (throws when there is none: a defect of the caller). */
    public FindingStatus status(String name) {
        return finding(name).orElseThrow(() -> new IllegalArgumentException("no finding named " + name)).status();
    }

    /** The names of the conditions flagged warn or alarm. */
    public List<String> flagged() {
        return findings.stream().filter(f -> f.status().flagged()).map(Finding::name).toList();
    }
}
