package org.liepath.integrators;

/**
 * How an evolution ended: a {@link Kind}, a message naming the cause (for a drive failure: the drive, its term and
 * the time), and the time reached. Numerical trouble is reported here, never thrown; misuse throws
 * {@link org.liepath.core.InvalidInputException} before any step.
 *
 * <p>Immutable and thread-safe.
 */
public final class Status {
    /** The kind of ending. */
    public enum Kind {
        /** The run reached its end time. */
        SUCCESS,
        /** The step limit ({@link Evolve#maxSteps}) was reached first. */
        STEP_LIMIT,
        /** The adaptive step size fell below the resolution of the time axis. */
        STEP_UNDERFLOW,
        /** The state became NaN or infinite (e.g. overflow). */
        NON_FINITE,
        /** A drive threw or returned a non-finite value. */
        DRIVE_FAILED,
        /** The progress listener asked to stop. */
        CANCELLED,
        /** Any other failure of the integrator (e.g. a Wei–Norman chart that could not be re-anchored). */
        FAILED
    }

    private final Kind kind;
    private final String message;
    private final double time;

    Status(Kind kind, String message, double time) {
        this.kind = kind;
        this.message = message;
        this.time = time;
    }

    /** @return true for {@link Kind#SUCCESS} */
    public boolean isSuccess() {
        return kind == Kind.SUCCESS;
    }

    /** @return the kind of ending */
    public Kind kind() {
        return kind;
    }

    /** @return a description of the cause (empty for a plain success; notes a failed listener or observer) */
    public String message() {
        return message;
    }

    /** @return the time the run reached (t1 on success) */
    public double time() {
        return time;
    }

    @Override
    public String toString() {
        return message.isEmpty() ? kind.toString() : kind + ": " + message;
    }
}
