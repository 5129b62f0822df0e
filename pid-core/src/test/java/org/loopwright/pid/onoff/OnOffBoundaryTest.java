package org.loopwright.pid.onoff;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.loopwright.pid.Action;

/**
 * The on-off controller's edges a mutation run found unpinned (issue 11): a bad sample with an off
 * output that is not zero, and the minimum on and off times at exactly their boundary. Hysteresis
 * band ±0.5 around the setpoint (common practice for a thermostat).
 */
class OnOffBoundaryTest {

    /** Heater between 200 W (off: a standing load) and 2000 W, hysteresis 1, 10 s minimum on, 20 s minimum off. */
    private static final OnOffSettings HEATER = new OnOffSettings(200.0, 2000.0, 1.0, 10.0, 20.0, Action.REVERSE);

    @Test
    void aBadSampleGivesTheOffOutputAndCountsAFault() {
        OnOffController c = new OnOffController(HEATER);
        assertThat(c.update(60.0, 50.0, 0.0)).isEqualTo(2000.0);
        assertThat(c.update(60.0, Double.NaN, 1.0)).isEqualTo(200.0);
        assertThat(c.on()).isFalse();
        assertThat(c.output()).isEqualTo(200.0);
        assertThat(c.faultCount()).isEqualTo(1);
        // the switch off at t = 1 starts the minimum off time: still off at t = 20.9, on at t = 21
        assertThat(c.update(60.0, 50.0, 20.9)).isEqualTo(200.0);
        assertThat(c.update(60.0, 50.0, 21.0)).isEqualTo(2000.0);
    }

    @Test
    void aBadTimeKeepsTheLastSwitchTime() {
        OnOffController c = new OnOffController(HEATER);
        c.update(60.0, 50.0, 0.0);
        assertThat(c.update(60.0, 50.0, Double.NaN)).isEqualTo(200.0);
        assertThat(c.faultCount()).isEqualTo(1);
        // switched off at an unknown time: the last known switch (t = 0) starts the minimum off time
        assertThat(c.update(60.0, 50.0, 19.9)).isEqualTo(200.0);
        assertThat(c.update(60.0, 50.0, 20.0)).isEqualTo(2000.0);
    }

    @Test
    void minimumOnTimeHoldsUntilItsBoundaryExactly() {
        OnOffController c = new OnOffController(HEATER);
        c.update(60.0, 50.0, 100.0);
        assertThat(c.update(60.0, 70.0, 109.9)).isEqualTo(2000.0);
        assertThat(c.update(60.0, 70.0, 110.0)).isEqualTo(200.0);
    }

    @Test
    void minimumOffTimeHoldsUntilItsBoundaryExactly() {
        OnOffController c = new OnOffController(HEATER);
        c.update(60.0, 50.0, 0.0);
        c.update(60.0, 70.0, 10.0);
        assertThat(c.update(60.0, 50.0, 29.9)).isEqualTo(200.0);
        assertThat(c.update(60.0, 50.0, 30.0)).isEqualTo(2000.0);
    }

    @Test
    void hysteresisEdgesDoNotSwitch() {
        // the band is exclusive: exactly half the hysteresis from the setpoint does not switch
        OnOffController c = new OnOffController(new OnOffSettings(0.0, 1.0, 1.0, 0.0, 0.0, Action.REVERSE));
        assertThat(c.update(60.0, 59.5, 0.0)).isZero();
        assertThat(c.update(60.0, 59.4, 1.0)).isEqualTo(1.0);
        assertThat(c.update(60.0, 60.5, 2.0)).isEqualTo(1.0);
        assertThat(c.update(60.0, 60.6, 3.0)).isZero();
    }
}
