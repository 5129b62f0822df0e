package org.loopwright.sim.plant;

/** What a {@link DcMotor} reports as its output. */
public enum MotorOutput {
    /** Shaft speed in rad/s. */
    SPEED,
    /** Shaft angle in rad. */
    POSITION
}
