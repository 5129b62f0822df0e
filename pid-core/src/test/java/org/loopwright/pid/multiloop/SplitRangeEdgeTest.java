package org.loopwright.pid.multiloop;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.ControllerSettings;
import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.form.IdealGains;

/**
 * The lower edge of a split's room and what a split range reports about itself (issue 11: the
 * mutation run found only the upper edge pinned, by {@link SplitRangeTest}).
 */
class SplitRangeEdgeTest {

    private static final ControllerSettings PERCENT = ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0))
            .samplePeriodSeconds(1.0).outputRange(0.0, 100.0).build();
    private static final ActuatorRange COOLING = new ActuatorRange(0.0, 100.0);
    private static final ActuatorRange HEATING = new ActuatorRange(0.0, 2000.0);

    @Test
    void aGapThatReachesTheBottomOfTheRangeLeavesTheFirstActuatorNoRoom() {
        // split 5, gap 10: the first actuator would work from 0 to 5 − 5 = 0, a band of zero width
        assertThatThrownBy(() -> new SplitRange(PERCENT, 5.0, 10.0, COOLING, HEATING))
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage("splitAt must leave each actuator part of the output range: outputMin < splitAt - gap/2 and"
                        + " splitAt + gap/2 < outputMax (outputMin=0.0, outputMax=100.0, gap=10.0): splitAt=5.0");
        // the smallest band above it is accepted, and the first actuator is full at its bottom
        SplitRange narrow = new SplitRange(PERCENT, Math.nextUp(5.0), 10.0, COOLING, HEATING);
        assertThat(narrow.first(0.0)).isEqualTo(100.0);
    }

    @Test
    void itReportsTheSplitItWasBuiltWith() {
        SplitRange s = new SplitRange(ControllerSettings.builder().gains(IdealGains.pi(1.0, 10.0))
                .samplePeriodSeconds(1.0).outputRange(-50.0, 150.0).build(), 40.0, 6.0, COOLING, HEATING);
        assertThat(s.splitAt()).isEqualTo(40.0);
        assertThat(s.gap()).isEqualTo(6.0);
        assertThat(s.firstRange()).isEqualTo(COOLING);
        assertThat(s.secondRange()).isEqualTo(HEATING);
        assertThat(s.outputMin()).isEqualTo(-50.0);
        assertThat(s.outputMax()).isEqualTo(150.0);
    }
}
