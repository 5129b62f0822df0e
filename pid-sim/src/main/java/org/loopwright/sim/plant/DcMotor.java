package org.loopwright.sim.plant;

/**
 * The plant of a {@link DcMotorModel}: input armature voltage in volts, output speed (rad/s) or
 * angle (rad). State: current, speed, angle, and whether the shaft is stuck.
 *
 * <p>Friction is switched between sub-steps (a Karnopp-style stick–slip model): within a sliding
 * sub-step the Coulomb torque keeps the sign it had at the sub-step's start; when the speed reaches
 * or crosses zero, the shaft stops and sticks unless the driving torque exceeds the static friction.
 * Not thread-safe.
 */
public final class DcMotor extends SubSteppedPlant {

    private static final int CURRENT = 0;
    private static final int SPEED = 1;
    private static final int ANGLE = 2;

    private final DcMotorModel m;
    private final boolean hasFriction;
    private boolean stuck;
    private double slidingDirection;

    /** A motor at rest: no current, no speed, angle 0, stuck if it has friction. */
    public DcMotor(DcMotorModel model) {
        super(new double[3], model.integrationStepSeconds());
        m = model;
        hasFriction = model.staticFriction() > 0.0 || model.coulombFriction() > 0.0;
        reset();
    }

    @Override
    public void reset() {
        super.reset();
        stuck = hasFriction;
        slidingDirection = 0.0;
    }

    /** Whether the shaft is held by static friction now. */
    public boolean stuck() {
        return stuck;
    }

    private double drivingTorque(double current) {
        return m.torqueConstant() * current - m.loadTorque();
    }

    @Override
    void beforeSubStep(double input) {
        if (!hasFriction) {
            return;
        }
        if (stuck) {
            double driving = drivingTorque(state[CURRENT]);
            if (Math.abs(driving) > m.staticFriction()) {
                stuck = false;
                slidingDirection = Math.signum(driving);
            }
        } else if (state[SPEED] != 0.0) {
            slidingDirection = Math.signum(state[SPEED]);
        }
    }

    @Override
    void derivatives(double[] x, double input, double[] dxdt) {
        double speed = stuck ? 0.0 : x[SPEED];
        dxdt[CURRENT] = (input - m.resistanceOhms() * x[CURRENT] - m.backEmfConstant() * speed)
                / m.inductanceHenries();
        if (stuck) {
            dxdt[SPEED] = 0.0;
            dxdt[ANGLE] = 0.0;
            return;
        }
        double friction = hasFriction ? m.coulombFriction() * slidingDirection : 0.0;
        dxdt[SPEED] = (drivingTorque(x[CURRENT]) - m.viscousFriction() * x[SPEED] - friction) / m.inertia();
        dxdt[ANGLE] = x[SPEED];
    }

    @Override
    void afterSubStep(double input) {
        if (!hasFriction || stuck) {
            return;
        }
        if (state[SPEED] * slidingDirection <= 0.0) {
            // the speed reached zero within this sub-step: stop here, stick unless the drive breaks away
            state[SPEED] = 0.0;
            double driving = drivingTorque(state[CURRENT]);
            if (Math.abs(driving) <= m.staticFriction()) {
                stuck = true;
            } else {
                slidingDirection = Math.signum(driving);
            }
        }
    }

    @Override
    public double output() {
        return m.output() == MotorOutput.SPEED ? state[SPEED] : state[ANGLE];
    }
}
