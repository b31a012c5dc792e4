package org.liepath.core;

/**
 * Thrown when a user-supplied {@link Drive} throws or returns a non-finite value while a Hamiltonian is evaluated.
 * The message names the drive, its term index and the time; the original exception, if any, is the cause.
 *
 * <p>Integrators turn this into a non-success status rather than letting it escape a run. Immutable.
 */
public class DriveException extends IllegalStateException {
    private static final long serialVersionUID = 1L;
    /** The index of the Hamiltonian term whose drive failed. */
    private final int term;
    /** The time at which the drive was evaluated. */
    private final double time;
    /** The drive's name. */
    private final String driveName;

    /**
     * @param driveName the failing drive's {@link Drive#name()}
     * @param term      the index of its term in the Hamiltonian
     * @param time      the time at which it was evaluated
     * @param what      what went wrong, e.g. "returned NaN" or "threw …"
     * @param cause     the drive's exception, or null for a non-finite value
     */
    public DriveException(String driveName, int term, double time, String what, Throwable cause) {
        super("drive '" + driveName + "' of term " + term + " " + what + " at t = " + time, cause);
        this.term = term;
        this.time = time;
        this.driveName = driveName;
    }

    /** @return the index of the Hamiltonian term whose drive failed */
    public int term() {
        return term;
    }

    /** @return the time at which it failed */
    public double time() {
        return time;
    }

    /** @return the drive's name */
    public String driveName() {
        return driveName;
    }
}
