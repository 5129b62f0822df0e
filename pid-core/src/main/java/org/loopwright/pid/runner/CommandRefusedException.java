package org.loopwright.pid.runner;

/**
 * An operator command that the runner did not take. Nothing was queued: the caller may try again
 * (after a full queue, once the loop has applied what is waiting) or give up. The message names the
 * command and the reason.
 */
public final class CommandRefusedException extends IllegalStateException {

    private static final long serialVersionUID = 1L;

    /** Why a command was refused. */
    public enum Reason {
        /** The runner is not running (new or stopped): nothing would apply the command. */
        NOT_RUNNING,
        /** {@link OperatorChannel#capacity()} commands are already waiting for the next tick. */
        QUEUE_FULL,
        /** The command does not fit this runner (a setpoint for a runner that reads its setpoint). */
        NOT_APPLICABLE
    }

    /** Why the command was refused. */
    private final Reason reason;

    CommandRefusedException(Reason reason, String message) {
        super(message);
        this.reason = reason;
    }

    /** {@return why the command was refused} */
    public Reason reason() {
        return reason;
    }
}
