package org.loopwright.sim.plant;

import java.util.Optional;

import org.loopwright.pid.InvalidSettingException;
import org.loopwright.pid.SettingChecks;

/**
 * A permanent-magnet DC motor driven by its armature voltage (a gimbal axis, a pump), with friction
 * that truly sticks and slips:
 * <pre>
 * L·di/dt = V − R·i − Ke·ω
 * J·dω/dt = Kt·i − b·ω − τ_load − τ_friction,   dθ/dt = ω
 * </pre>
 * While it turns, τ_friction = Tc·sign(ω) (Coulomb). At rest it stays at rest while the driving
 * torque |Kt·i − τ_load| does not exceed the static (breakaway) friction Ts ≥ Tc; above it, it
 * breaks away. The speed crossing zero within a sub-step is where it may stick again.
 *
 * <p>Example: a small gimbal motor, R = 2 Ω, L = 1 mH, Kt = Ke = 0.05, J = 1e-5 kg·m², b = 1e-5,
 * with Ts = 0.01 N·m and Tc = 0.008 N·m, position output:
 * {@code new DcMotorModel(2, 1e-3, 0.05, 0.05, 1e-5, 1e-5, 0, 0.008, 0.01, MotorOutput.POSITION, 1e-5)}.
 *
 * @param resistanceOhms             R &gt; 0
 * @param inductanceHenries          L &gt; 0
 * @param torqueConstant             Kt &gt; 0, N·m/A
 * @param backEmfConstant            Ke &ge; 0, V·s/rad
 * @param inertia                    J &gt; 0, kg·m²
 * @param viscousFriction            b &ge; 0, N·m·s/rad
 * @param loadTorque                 τ_load, N·m (constant; a load step comes from the scenario's disturbances)
 * @param coulombFriction            Tc &ge; 0, N·m
 * @param staticFriction             Ts &ge; Tc, N·m
 * @param output                     speed (rad/s) or position (rad)
 * @param integrationStepSeconds     the longest integrator sub-step, &gt; 0 (well below L/R)
 */
public record DcMotorModel(double resistanceOhms, double inductanceHenries, double torqueConstant,
        double backEmfConstant, double inertia, double viscousFriction, double loadTorque, double coulombFriction,
        double staticFriction, MotorOutput output, double integrationStepSeconds) implements PlantModel {

    /** Validates every value; errors name the fields. */
    public DcMotorModel {
        SettingChecks.positive("resistanceOhms", resistanceOhms);
        SettingChecks.positive("inductanceHenries", inductanceHenries);
        SettingChecks.positive("torqueConstant", torqueConstant);
        SettingChecks.nonNegative("backEmfConstant", backEmfConstant);
        SettingChecks.positive("inertia", inertia);
        SettingChecks.nonNegative("viscousFriction", viscousFriction);
        SettingChecks.finite("loadTorque", loadTorque);
        SettingChecks.nonNegative("coulombFriction", coulombFriction);
        SettingChecks.nonNegative("staticFriction", staticFriction);
        if (staticFriction < coulombFriction) {
            throw new InvalidSettingException("staticFriction", staticFriction,
                    "must be >= coulombFriction (coulombFriction=" + coulombFriction + ")");
        }
        if (output == null) {
            throw new InvalidSettingException("output", null, "must be speed or position");
        }
        SettingChecks.positive("integrationStepSeconds", integrationStepSeconds);
    }

    @Override
    public Plant newPlant() {
        return new DcMotor(this);
    }

    /** Without friction or load, the linear model: Kt/((Js+b)(Ls+R) + Kt·Ke), times 1/s for position. */
    @Override
    public PlantType type() {
        return PlantType.DC_MOTOR;
    }

    @Override
    public Optional<TransferFunction> linear() {
        if (coulombFriction > 0.0 || staticFriction > 0.0 || loadTorque != 0.0) {
            return Optional.empty();
        }
        double j = inertia;
        double b = viscousFriction;
        double l = inductanceHenries;
        double r = resistanceOhms;
        double[] speed = {j * l, j * r + b * l, b * r + torqueConstant * backEmfConstant};
        double[] den = output == MotorOutput.SPEED ? speed : new double[] {speed[0], speed[1], speed[2], 0.0};
        return Optional.of(new TransferFunction(new double[] {torqueConstant}, den, 0.0));
    }
}
