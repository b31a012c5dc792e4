package org.liepath.core;

import org.liepath.core.InvalidInputException.Reason;
import org.liepath.core.internal.Require;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.TreeSet;

/**
 * A Hamiltonian in control-affine form H(t) = Σ_k c_k(t) A_k with Hermitian operators A_k and real drives c_k.
 *
 * <p>Build with {@code Hamiltonian.builder(dim).term(0.5, Pauli.string("Z")).term(Pauli.string("X"), drive).build()}.
 * Constant coefficients become constant drives. Units: energy = angular frequency (ħ = 1).
 *
 * <p>Immutable and thread-safe provided the drives are (all factory drives are). {@link #at(double)} allocates;
 * integrators use {@link #coefficients(double, double[])} in hot loops.
 */
public final class Hamiltonian {
    private final int dim;
    private final List<Operator> ops;
    private final List<Drive> drives;

    private Hamiltonian(int dim, List<Operator> ops, List<Drive> drives) {
        this.dim = dim;
        this.ops = ops;
        this.drives = drives;
    }

    /**
     * @param dim the dimension of the operators, 1 … {@link Operator#MAX_DIM}
     * @return a builder for operators of dimension dim
     * @throws InvalidInputException for a dimension outside that range (LIMIT_EXCEEDED above it)
     */
    public static Builder builder(int dim) {
        Require.positive(dim, "dim");
        if (dim > Operator.MAX_DIM) {
            throw InvalidInputException.of(InvalidInputException.Reason.LIMIT_EXCEEDED, "dim",
                    "a dimension ≤ " + Operator.MAX_DIM, dim);
        }
        return new Builder(dim);
    }

    /**
     * @param h the Hermitian operator
     * @return the time-independent Hamiltonian H (one term with constant coefficient 1)
     */
    public static Hamiltonian constant(Operator h) {
        Require.nonNull(h, "h");
        return builder(h.dim()).term(1.0, h).build();
    }

    /** @return the Hilbert-space dimension */
    public int dim() {
        return dim;
    }

    /** @return the number of terms */
    public int size() {
        return ops.size();
    }

    /** @return the operators A_k (unmodifiable) */
    public List<Operator> operators() {
        return ops;
    }

    /** @return the drives c_k (unmodifiable) */
    public List<Drive> drives() {
        return drives;
    }

    /**
     * Fills {@code out[k] = c_k(t)}.
     *
     * @param t the time
     * @param out output array
     * @throws InvalidInputException if t is not finite or out is null or shorter than {@link #size()}
     * @throws DriveException if a drive throws or returns a non-finite value (names the drive, term and time)
     */
    public void coefficients(double t, double[] out) {
        // a NaN time would otherwise be blamed on the first drive that returns NaN for it
        Require.finite(t, "t");
        if (out == null || out.length < drives.size()) {
            Require.nonNull(out, "out");
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "out", "length >= " + drives.size(),
                    "length " + out.length);
        }
        for (int k = 0; k < drives.size(); k++) {
            out[k] = drive(k, t);
        }
    }

    /**
     * Fills {@code out[j] = c_{terms[j]}(t)}: the coefficients of selected terms, with the checks of
     * {@link #coefficients(double, double[])} (an integrator that has folded the constant terms evaluates only the
     * driven ones this way).
     *
     * @param t     the time
     * @param terms term indices, each in [0, {@link #size()})
     * @param out   output array, at least as long as terms
     * @throws InvalidInputException if t is not finite, an array is null or too short, or an index is out of range
     * @throws DriveException        if a drive throws or returns a non-finite value (names the drive, term and time)
     */
    public void coefficients(double t, int[] terms, double[] out) {
        Require.finite(t, "t");
        Require.nonNull(terms, "terms");
        Require.nonNull(out, "out");
        if (out.length < terms.length) {
            throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, "out", "length >= " + terms.length,
                    "length " + out.length);
        }
        for (int j = 0; j < terms.length; j++) {
            int k = terms[j];
            if (k < 0 || k >= drives.size()) {
                throw InvalidInputException.of(Reason.OUT_OF_RANGE, "terms", "indices in [0, " + drives.size() + ")",
                        k);
            }
            out[j] = drive(k, t);
        }
    }

    /** c_k(t), with a failure or a non-finite value reported as a {@link DriveException} naming term k. */
    private double drive(int k, double t) {
        Drive d = drives.get(k);
        double v;
        try {
            v = d.at(t);
        } catch (RuntimeException e) {
            throw new DriveException(d.name(), k, t, "threw " + e, e);
        }
        if (!Double.isFinite(v)) {
            throw new DriveException(d.name(), k, t, "returned " + v, null);
        }
        return v;
    }

    /**
     * @param t the time
     * @return H(t) = Σ c_k(t) A_k
     */
    public Operator at(double t) {
        Require.finite(t, "t");
        double[] c = new double[ops.size()];
        coefficients(t, c);
        int len = dim * dim;
        double[] re = new double[len], im = new double[len];
        for (int k = 0; k < ops.size(); k++) {
            Operator a = ops.get(k);
            double ck = c[k];
            for (int q = 0; q < len; q++) {
                re[q] += ck * a.re[q];
                im[q] += ck * a.im[q];
            }
        }
        return new Operator(dim, re, im);
    }

    /** @return the union of all drives' breakpoints, ascending */
    public double[] breakpoints() {
        TreeSet<Double> s = new TreeSet<>();
        for (Drive d : drives) {
            for (double b : d.breakpoints()) {
                s.add(b + 0.0); // −0.0 and 0.0 are one time, but distinct TreeSet keys
            }
        }
        double[] out = new double[s.size()];
        int k = 0;
        for (double b : s) {
            out[k++] = b;
        }
        return out;
    }

    /** @return whether every drive is piecewise constant (so exact piecewise stepping applies) */
    public boolean isPiecewiseConstant() {
        for (Drive d : drives) {
            if (!d.isPiecewiseConstant()) {
                return false;
            }
        }
        return true;
    }

    /** @return whether every drive is a constant (no breakpoints, piecewise constant) */
    public boolean isTimeIndependent() {
        for (Drive d : drives) {
            if (!d.isPiecewiseConstant() || d.breakpoints().length > 0) {
                return false;
            }
        }
        return true;
    }

    /**
     * @param t the time
     * @return an upper bound for ‖H(t)‖₂: Σ |c_k(t)| ‖A_k‖_F
     */
    public double normBound(double t) {
        double[] c = new double[ops.size()];
        coefficients(t, c);
        double s = 0;
        for (int k = 0; k < ops.size(); k++) {
            s += Math.abs(c[k]) * ops.get(k).norm();
        }
        return s;
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder("Hamiltonian (dimension ").append(dim).append(", ").append(ops.size())
                .append(" terms)");
        for (int k = 0; k < ops.size(); k++) {
            sb.append("\n  ").append(drives.get(k).name()).append(" · A").append(k);
        }
        return sb.toString();
    }

    /** Mutable builder for {@link Hamiltonian}; not thread-safe. */
    public static final class Builder {
        private final int dim;
        private final List<Operator> ops = new ArrayList<>();
        private final List<Drive> drives = new ArrayList<>();

        private Builder(int dim) {
            this.dim = dim;
        }

        /**
         * Adds the constant term c·A (A Hermitian).
         *
         * @param c the coefficient
         * @param a the operator
         * @return this builder
         */
        public Builder term(double c, Operator a) {
            Require.finite(c, "c");
            return term(a, Drive.constant(c));
        }

        /**
         * Adds the driven term c(t)·A (A Hermitian).
         *
         * @param a the operator
         * @param c the drive
         * @return this builder
         */
        public Builder term(Operator a, Drive c) {
            String name = "operator of term " + ops.size();
            Require.nonNull(a, name);
            Require.nonNull(c, "drive of term " + ops.size());
            if (a.dim() != dim) {
                throw InvalidInputException.of(Reason.DIMENSION_MISMATCH, name, "dimension " + dim,
                        "dimension " + a.dim());
            }
            a.requireHermitian(name);
            checkBreakpoints(c, "drive of term " + ops.size());
            ops.add(a);
            drives.add(c);
            return this;
        }

        // a user drive's breakpoints end up as step boundaries of integrators: refuse junk once, here
        private static void checkBreakpoints(Drive c, String name) {
            double[] b = c.breakpoints();
            if (b == null) {
                throw InvalidInputException.of(Reason.NULL, name, "breakpoints() to return an array (empty for none)",
                        "null from '" + c.name() + "'");
            }
            for (int k = 0; k < b.length; k++) {
                if (!Double.isFinite(b[k]) || (k > 0 && !(b[k] >= b[k - 1]))) {
                    throw InvalidInputException.of(Reason.OUT_OF_RANGE, name,
                            "finite ascending breakpoints from '" + c.name() + "'",
                            b[k] + " at index " + k + (k > 0 ? " after " + b[k - 1] : ""));
                }
            }
        }

        /** @return the Hamiltonian; at least one term is required */
        public Hamiltonian build() {
            if (ops.isEmpty()) {
                throw InvalidInputException.of(Reason.EMPTY, "terms", "at least one term", "none");
            }
            return new Hamiltonian(dim, Collections.unmodifiableList(new ArrayList<>(ops)),
                    Collections.unmodifiableList(new ArrayList<>(drives)));
        }
    }
}
