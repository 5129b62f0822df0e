package org.loopwright.sim.plant;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.hipparchus.ode.ODEState;
import org.hipparchus.ode.OrdinaryDifferentialEquation;
import org.hipparchus.ode.nonstiff.DormandPrince853Integrator;
import org.junit.jupiter.api.Test;

class NonlinearPlantTest {

    /**
     * Analytic: C·dT/dt = P − G(T − Ta) from Ta gives T = Ta + (P/G)(1 − e^(−G·t/C)). A negative
     * command delivers no power (a heater cannot cool) and a command above the rating delivers the rating.
     */
    @Test
    void thermalZoneFollowsTheLumpedHeatBalance() {
        ThermalZoneModel bath = new ThermalZoneModel(21_000.0, 5.0, 20.0, 2_000.0, 2.0);
        Plant zone = bath.newPlant();
        assertThat(zone.output()).isEqualTo(20.0);
        for (int k = 1; k <= 100; k++) {
            zone.advance(5_000.0, 30.0); // clipped to 2 kW
            double expected = 20.0 + 2_000.0 / 5.0 * (1.0 - Math.exp(-5.0 * 30.0 * k / 21_000.0));
            assertThat(zone.output()).isCloseTo(expected, within(1e-9 * expected));
        }
        double hot = zone.output();
        zone.advance(-1_000.0, 30.0); // no cooling: it only loses heat to ambient
        assertThat(zone.output()).isCloseTo(20.0 + (hot - 20.0) * Math.exp(-5.0 * 30.0 / 21_000.0), within(1e-9));
    }

    /** Reference: Hipparchus Dormand–Prince 8(5,3) on A·dh/dt = q − k·√h; steady state h = (q/k)² (Torricelli). */
    @Test
    void tankMatchesTheReferenceIntegratorAndItsSteadyLevel() {
        TankModel model = new TankModel(0.5, 0.01, 0.2, 0.05);
        Plant tank = model.newPlant();
        double inflow = 0.006;
        OrdinaryDifferentialEquation ode = new OrdinaryDifferentialEquation() {
            @Override
            public int getDimension() {
                return 1;
            }

            @Override
            public double[] computeDerivatives(double t, double[] h) {
                return new double[] {(inflow - 0.01 * Math.sqrt(h[0])) / 0.5};
            }
        };
        DormandPrince853Integrator reference = new DormandPrince853Integrator(1e-9, 10.0, 1e-13, 1e-13);
        ODEState state = new ODEState(0.0, new double[] {0.2});
        for (int k = 1; k <= 50; k++) {
            tank.advance(inflow, 20.0);
            state = reference.integrate(ode, state, 20.0 * k);
            assertThat(tank.output()).isCloseTo(state.getPrimaryState()[0], within(1e-9));
        }
        for (int k = 0; k < 2_000; k++) {
            tank.advance(inflow, 20.0);
        }
        assertThat(tank.output()).isCloseTo(Math.pow(inflow / 0.01, 2), within(1e-9));
    }

    @Test
    void tankLevelNeverGoesBelowEmpty() {
        Plant tank = new TankModel(0.1, 0.05, 0.01, 0.05).newPlant();
        tank.advance(-1.0, 60.0);
        assertThat(tank.output()).isZero();
    }

    /**
     * Cross-check: without friction or load the motor is linear, Kt/((Js+b)(Ls+R) + Kt·Ke) (times
     * 1/s for the angle; standard DC motor model, Åström &amp; Murray 2021, §3.1 exercise form), so the
     * sub-stepped Runge–Kutta plant must agree with the exact matrix-exponential plant.
     */
    @Test
    void frictionlessMotorAgreesWithItsExactLinearModel() {
        for (MotorOutput output : MotorOutput.values()) {
            DcMotorModel motor = new DcMotorModel(2.0, 0.01, 0.1, 0.1, 0.01, 0.01, 0.0, 0.0, 0.0, output, 1e-4);
            Plant integrated = motor.newPlant();
            Plant exact = new LinearPlant(motor.linear().orElseThrow());
            for (int k = 0; k < 300; k++) {
                double volts = 6.0 * Math.sin(0.05 * k);
                integrated.advance(volts, 0.01);
                exact.advance(volts, 0.01);
                assertThat(integrated.output()).as("%s at %d", output, k)
                        .isCloseTo(exact.output(), within(1e-9 * Math.max(1.0, Math.abs(exact.output()))));
            }
        }
    }

    /** Stick–slip: below the breakaway torque the shaft does not move at all; above it, it turns. */
    @Test
    void staticFrictionHoldsTheShaftUntilTheDriveExceedsIt() {
        // Kt·V/R at standstill: 0.1·0.9/2 = 0.045 N·m < Ts = 0.05; 0.1·1.1/2 = 0.055 > Ts
        DcMotorModel model = new DcMotorModel(2.0, 0.01, 0.1, 0.1, 0.01, 0.01, 0.0, 0.04, 0.05,
                MotorOutput.POSITION, 1e-3);
        DcMotor held = new DcMotor(model);
        for (int k = 0; k < 200; k++) {
            held.advance(0.9, 0.01);
        }
        assertThat(held.output()).isZero();
        assertThat(held.stuck()).isTrue();
        DcMotor turning = new DcMotor(model);
        for (int k = 0; k < 200; k++) {
            turning.advance(1.1, 0.01);
        }
        assertThat(turning.output()).isPositive();
        assertThat(turning.stuck()).isFalse();
    }

    /** Stick–slip: once the drive is removed, Coulomb friction brings the shaft to a dead stop (no creep). */
    @Test
    void coulombFrictionStopsTheShaftAndItStaysStuck() {
        DcMotor motor = new DcMotor(new DcMotorModel(2.0, 0.01, 0.1, 0.1, 0.01, 0.001, 0.0, 0.04, 0.05,
                MotorOutput.POSITION, 1e-3));
        for (int k = 0; k < 100; k++) {
            motor.advance(12.0, 0.01);
        }
        for (int k = 0; k < 1_000; k++) {
            motor.advance(0.0, 0.01);
        }
        double stopped = motor.output();
        assertThat(motor.stuck()).isTrue();
        for (int k = 0; k < 100; k++) {
            motor.advance(0.0, 0.01);
        }
        assertThat(motor.output()).isEqualTo(stopped);
    }
}
