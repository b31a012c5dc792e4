package org.liepath.validation;

import org.liepath.core.Hamiltonian;
import org.liepath.core.InvalidInputException;
import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;
import org.liepath.core.ProgressListener;
import org.liepath.core.Superoperator;
import org.liepath.core.internal.Require;
import org.liepath.integrators.Evolution;
import org.liepath.integrators.Evolve;
import org.liepath.integrators.Scheme;
import org.liepath.validation.internal.TextTable;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Runs one problem through several schemes and the reference integrator and tabulates, per scheme: the Frobenius
 * error against the reference, the structure error (‖U†U − I‖_F for a Hamiltonian, the channel's trace error for a
 * Lindbladian), accepted steps, generator evaluations and wall time.
 *
 * <p>The reference is {@link Scheme#reference()} (Commons Math Dormand–Prince 8(5,3)) at
 * {@link #DEFAULT_REFERENCE_TOLERANCE} unless the caller supplies an exact result with {@link Builder#reference}.
 * Note that the reference is not structure preserving, so its own unitarity or trace drift is shown in its row.
 *
 * <p>Build with {@link #of(Hamiltonian)} or {@link #of(Lindbladian)}; {@link Builder#run()} does the work
 * sequentially and returns an immutable, thread-safe table that prints aligned (JShell), as Markdown, or as CSV.
 */
public final class CrossCheck {
    /** Tolerance of the reference run: two orders of magnitude above rounding, far below the schemes' errors. */
    public static final double DEFAULT_REFERENCE_TOLERANCE = 1e-13;

    /** One row of the table. Immutable and thread-safe. */
    public record Row(String scheme, String mode, long steps, long evaluations, double error, double structureError,
                      double seconds, String status) {
    }

    private final List<Row> rows;
    private final String structure;

    private CrossCheck(List<Row> rows, String structure) {
        this.rows = rows;
        this.structure = structure;
    }

    /**
     * Starts a cross-check of the propagator of a Hamiltonian.
     *
     * @param h the Hamiltonian
     * @return a builder for the cross-check
     */
    public static Builder of(Hamiltonian h) {
        return new Builder(Require.nonNull(h, "h"), null);
    }

    /**
     * Starts a cross-check of the dynamical map (channel) of a GKLS generator.
     *
     * @param l the GKLS generator
     * @return a builder for the cross-check
     */
    public static Builder of(Lindbladian l) {
        return new Builder(null, Require.nonNull(l, "l"));
    }

    /** Mutable builder; not thread-safe. */
    public static final class Builder {
        private final Hamiltonian h;
        private final Lindbladian l;
        private double t0 = Double.NaN, t1;
        private double tolerance = Evolve.DEFAULT_TOLERANCE, refTol = DEFAULT_REFERENCE_TOLERANCE;
        private Operator reference;
        private ProgressListener monitor = ProgressListener.NONE;
        private final List<Scheme> schemes = new ArrayList<>();
        private final List<Integer> steps = new ArrayList<>();

        private Builder(Hamiltonian h, Lindbladian l) {
            this.h = h;
            this.l = l;
        }

        /**
         * The interval (t1 &lt; t0 allowed; t0 == t1 refused at {@link #run()} by the evolution builder).
         *
         * @param t0 the start time
         * @param t1 the end time
         * @return this builder
         */
        public Builder over(double t0, double t1) {
            this.t0 = Require.finite(t0, "t0");
            this.t1 = Require.finite(t1, "t1");
            return this;
        }

        /**
         * Adds a scheme run adaptively at the builder's {@link #tolerance}.
         *
         * @param s the scheme
         * @return this builder
         */
        public Builder scheme(Scheme s) {
            schemes.add(Require.nonNull(s, "s"));
            steps.add(0);
            return this;
        }

        /**
         * Adds a scheme run with n fixed steps.
         *
         * @param s the scheme
         * @param n the dimension
         * @return this builder
         */
        public Builder scheme(Scheme s, int n) {
            schemes.add(Require.nonNull(s, "s"));
            steps.add(Require.positive(n, "n"));
            return this;
        }

        /**
         * @param tol the tolerance of adaptive scheme runs (default {@link Evolve#DEFAULT_TOLERANCE})
         * @return this builder
         */
        public Builder tolerance(double tol) {
            this.tolerance = Require.positive(tol, "tol");
            return this;
        }

        /**
         * @param tol the reference run's tolerance (default {@link #DEFAULT_REFERENCE_TOLERANCE})
         * @return this builder
         */
        public Builder referenceTolerance(double tol) {
            this.refTol = Require.positive(tol, "tol");
            return this;
        }

        /**
         * Uses an exact result instead of the reference integrator: the propagator (Hamiltonian) or the channel's
         * n²×n² matrix in column stacking (Lindbladian).
         *
         * @param exact the exact (or reference) result
         * @return this builder
         */
        public Builder reference(Operator exact) {
            this.reference = Require.nonNull(exact, "exact");
            return this;
        }

        /**
         * Receives (fraction of schemes done, schemes done) after each run; false cancels the remaining runs.
         *
         * @param listener the progress listener (return false to cancel)
         * @return this builder
         */
        public Builder monitor(ProgressListener listener) {
            this.monitor = Require.nonNull(listener, "listener");
            return this;
        }

        /**
         * Runs the reference (unless given) and every scheme.
         *
         * @return a copy with this setting
         * @throws InvalidInputException if no interval or no scheme was given, or a supplied reference has the wrong
         *                               dimension; scheme-specific refusals come from {@link Evolve#run()}
         */
        public CrossCheck run() {
            if (Double.isNaN(t0)) {
                throw InvalidInputException.of(Reason.NULL, "interval", "an interval set with over(t0, t1)", "none");
            }
            if (schemes.isEmpty()) {
                throw InvalidInputException.of(Reason.EMPTY, "schemes", "at least one scheme", "none");
            }
            int dim = h != null ? h.dim() : l.dim() * l.dim();
            List<Row> rows = new ArrayList<>();
            Operator ref = reference;
            if (ref != null) {
                Require.sameDim(dim, ref.dim(), "exact");
                rows.add(new Row("exact (supplied)", "—", 0, 0, 0, structure(ref), 0, "given"));
            } else {
                Evolution e = base().scheme(Scheme.reference()).tolerance(refTol).run();
                ref = result(e);
                rows.add(row(e, "adaptive, tol " + TextTable.sci(refTol), 0, ref));
            }
            for (int k = 0; k < schemes.size(); k++) {
                Evolve ev = base().scheme(schemes.get(k));
                int n = steps.get(k);
                ev = n > 0 ? ev.steps(n) : ev.tolerance(tolerance);
                Evolution e = ev.run();
                rows.add(row(e, n > 0 ? n + " fixed steps" : "adaptive, tol " + TextTable.sci(tolerance), 1, ref));
                if (!monitor.onProgress((k + 1.0) / schemes.size(), k + 1)) {
                    break;
                }
            }
            return new CrossCheck(List.copyOf(rows), h != null ? "‖U†U − I‖_F" : "trace error");
        }

        private Evolve base() {
            return (h != null ? Evolve.of(h) : Evolve.of(l)).over(t0, t1);
        }

        private Operator result(Evolution e) {
            return h != null ? e.propagator() : e.channel().matrix();
        }

        private double structure(Operator r) {
            return h != null ? Checks.unitarityError(r) : Checks.traceError(Superoperator.ofMatrix(r));
        }

        private Row row(Evolution e, String mode, int kind, Operator ref) {
            Operator r = result(e);
            double err = kind == 0 ? 0 : r.distance(ref);
            return new Row(e.scheme().name(), mode, e.stats().acceptedSteps(), e.stats().evaluations(), err,
                    structure(r), e.stats().wallSeconds(), e.status().isSuccess() ? "ok" : e.status().kind().toString());
        }
    }

    /** @return the rows, reference first */
    public List<Row> rows() {
        return rows;
    }

    private TextTable table() {
        TextTable t = new TextTable("scheme", "mode", "steps", "evaluations", "error vs reference", structure,
                "wall ms", "status");
        for (Row r : rows) {
            t.add(r.scheme(), r.mode(), r.steps(), r.evaluations(), TextTable.sci(r.error()),
                    TextTable.sci(r.structureError()), TextTable.fixed(r.seconds() * 1e3, 2), r.status());
        }
        return t;
    }

    /** @return the table as CSV (header line, then one line per row) */
    public String toCsv() {
        return table().csv();
    }

    /** @return the table in Markdown */
    public String toMarkdown() {
        return table().markdown();
    }

    /**
     * Writes {@link #toCsv()} to a file (UTF-8), creating parent directories.
     *
     * @param file the CSV file to write
     */
    public void writeCsv(Path file) {
        Require.nonNull(file, "file");
        try {
            if (file.getParent() != null) {
                Files.createDirectories(file.getParent());
            }
            Files.writeString(file, toCsv(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + file, e);
        }
    }

    @Override
    public String toString() {
        return table().text();
    }
}
