package org.loopwright.pid;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.form.IdealGains;

/** The allocation-free capture holder gives the same snapshot as {@link PidController#snapshot()}. */
class StateCaptureTest {

    @Test
    void aCaptureIsTheSnapshotOfThatMomentAndCountsItself() {
        PidController c = new PidController(ControllerSettings.builder().gains(IdealGains.pi(2.0, 30.0))
                .samplePeriodSeconds(0.1).outputRange(0.0, 100.0).build());
        StateCapture capture = new StateCapture();
        assertThat(capture.captureCount()).isZero();
        assertThatThrownBy(capture::toSnapshot).isInstanceOf(IllegalStateException.class)
                .hasMessage("nothing captured yet: captureCount=0");
        c.update(50.0, 40.0);
        c.update(50.0, 41.0);
        c.captureState(capture);
        assertThat(capture.captureCount()).isEqualTo(1);
        assertThat(capture.toSnapshot()).isEqualTo(c.snapshot());
        c.switchToManual();
        c.update(50.0, Double.NaN);
        c.captureState(capture);
        assertThat(capture.captureCount()).isEqualTo(2);
        assertThat(capture.toSnapshot()).isEqualTo(c.snapshot());
    }

    @Test
    void aSettingErrorCarriesItsFieldValueAndRule() {
        InvalidSettingException e = new InvalidSettingException("integralTime", -3.0, "must be > 0");
        assertThat(e.field()).isEqualTo("integralTime");
        assertThat(e.value()).isEqualTo(-3.0);
        assertThat(e.rule()).isEqualTo("must be > 0");
        assertThat(e).hasMessage("integralTime must be > 0: integralTime=-3.0");
    }
}
