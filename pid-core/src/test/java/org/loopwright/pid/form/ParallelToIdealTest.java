package org.loopwright.pid.form;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.InvalidSettingException;

/**
 * Parallel to ideal, Kc = Kp, Ti = Kp/Ki, Td = Kd/Kp (Åström &amp; Hägglund 2006, §3.4), where Kp = 0:
 * only the controller that does nothing has an ideal form.
 */
class ParallelToIdealTest {

    @Test
    void withoutProportionalGainOnlyTheNullControllerHasAnIdealForm() {
        assertThat(new ParallelGains(0.0, 0.0, 0.0).toIdeal()).isEqualTo(new IdealGains(0.0, Double.POSITIVE_INFINITY, 0.0));
        assertThat(new ParallelGains(0.0, 0.0, 0.0).form()).isEqualTo(ControllerForm.PARALLEL);
        assertThatThrownBy(() -> new ParallelGains(0.0, Double.MIN_VALUE, 0.0).toIdeal())
                .isInstanceOf(InvalidSettingException.class)
                .hasMessage("proportionalGain must be > 0 to express integral or derivative action in ideal form:"
                        + " proportionalGain=0.0");
        assertThatThrownBy(() -> new ParallelGains(0.0, 0.0, Double.MIN_VALUE).toIdeal())
                .isInstanceOf(InvalidSettingException.class);
        // Kd alone: Td = Kd/Kp, no integral (Ti = ∞)
        assertThat(new ParallelGains(2.0, 0.0, 1.0).toIdeal()).isEqualTo(new IdealGains(2.0, Double.POSITIVE_INFINITY, 0.5));
    }
}
