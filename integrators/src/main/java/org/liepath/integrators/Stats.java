package org.liepath.integrators;

import java.util.Locale;

/**
 * Work done by an evolution: accepted and rejected steps, generator (Hamiltonian) evaluations, exponentials,
 * commutators, Wei–Norman charts, wall time, and any failure of the progress listener or step observer.
 * {@link #toString()} prints a table.
 *
 * <p>Immutable and thread-safe.
 */
public final class Stats {
    private final long accepted, rejected, evaluations, exponentials, commutators, nanos;
    private final int charts;
    private final String monitorFailure, observerFailure;

    Stats(long accepted, long rejected, long evaluations, long exponentials, long commutators, int charts, long nanos,
          String monitorFailure, String observerFailure) {
        this.accepted = accepted;
        this.rejected = rejected;
        this.evaluations = evaluations;
        this.exponentials = exponentials;
        this.commutators = commutators;
        this.charts = charts;
        this.nanos = nanos;
        this.monitorFailure = monitorFailure;
        this.observerFailure = observerFailure;
    }

    /** @return accepted steps (for fixed steps: steps taken, including splits at breakpoints and sample times) */
    public long acceptedSteps() {
        return accepted;
    }

    /** @return rejected steps; −1 where the integrator does not report them (the reference integrator) */
    public long rejectedSteps() {
        return rejected;
    }

    /** @return evaluations of the generator (all drives at one time count once) */
    public long evaluations() {
        return evaluations;
    }

    /** @return matrix exponentials computed */
    public long exponentials() {
        return exponentials;
    }

    /** @return commutators computed */
    public long commutators() {
        return commutators;
    }

    /** @return Wei–Norman charts used (1 + re-anchorings); 0 for other schemes */
    public int charts() {
        return charts;
    }

    /** @return the wall time of the run in seconds */
    public double wallSeconds() {
        return nanos * 1e-9;
    }

    /** @return what went wrong with the progress listener, or null if nothing did */
    public String monitorFailure() {
        return monitorFailure;
    }

    /** @return what went wrong with the step observer, or null if nothing did */
    public String observerFailure() {
        return observerFailure;
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        row(sb, "accepted steps", Long.toString(accepted));
        row(sb, "rejected steps", rejected < 0 ? "n/a" : Long.toString(rejected));
        row(sb, "evaluations", Long.toString(evaluations));
        row(sb, "exponentials", Long.toString(exponentials));
        row(sb, "commutators", Long.toString(commutators));
        if (charts > 0) {
            row(sb, "charts", Integer.toString(charts));
        }
        row(sb, "wall time", String.format(Locale.ROOT, "%.3f ms", nanos * 1e-6));
        if (monitorFailure != null) {
            row(sb, "listener", monitorFailure);
        }
        if (observerFailure != null) {
            row(sb, "observer", observerFailure);
        }
        return sb.toString();
    }

    private static void row(StringBuilder sb, String k, String v) {
        sb.append(String.format(Locale.ROOT, "%-16s %s%n", k, v));
    }
}
