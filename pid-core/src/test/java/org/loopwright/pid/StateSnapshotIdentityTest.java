package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.IdealGains;

/**
 * A snapshot's identity and one-line form (issue 11: the mutation run found that no test told two
 * different snapshots apart, and none read {@code toString}).
 */
class StateSnapshotIdentityTest {

    private static PidController controller() {
        return new PidController(ControllerSettings.builder().gains(IdealGains.pi(2.0, 10.0)).samplePeriodSeconds(0.1)
                .outputRange(0.0, 100.0).build());
    }

    @Test
    void snapshotsOfDifferentStatesDifferAndOfEqualStatesAreEqual() {
        PidController a = controller();
        PidController b = controller();
        a.update(50.0, 40.0);
        b.update(50.0, 40.0);
        // the Object contract: equal values, equal snapshots and hash codes
        assertThat(a.snapshot()).isEqualTo(b.snapshot()).hasSameHashCodeAs(b.snapshot());
        b.update(50.0, 45.0);
        assertThat(a.snapshot()).isNotEqualTo(b.snapshot());
        assertThat(a.snapshot()).isNotEqualTo("not a snapshot");
    }

    @Test
    void toStringIsTheTextFormOnOneLine() {
        PidController c = controller();
        c.update(50.0, 40.0);
        StateSnapshot s = c.snapshot();
        assertThat(s.toString()).doesNotContain("\n").isEqualTo(s.toText().replace('\n', ' ').strip());
        assertThat(s.toString()).contains("integral=");
    }
}
