package org.liepath.integrators.internal;

import org.liepath.core.Hamiltonian;
import org.liepath.core.Lindbladian;
import org.liepath.core.Operator;

/**
 * The linear equation X' = A(t) X with A(t) = Σ_k c_k(t) G_k + G_0, the one form every scheme works on.
 *
 * <p>For a Hamiltonian H(t) = Σ c_k(t) A_k the generators are G_k = −i A_k and G_0 = 0 (so every exponential of a
 * real combination is unitary to rounding). For a GKLS generator in Liouville space (column stacking) G_k is the
 * matrix of ρ ↦ −i[A_k, ρ] and G_0 the dissipator. Matrices are planar row-major.
 *
 * <p>Immutable after construction and safe to share between threads; the coefficient source must be pure.
 */
public final class LinearSystem {
    /** Source of the coefficients c_k(t); may throw (e.g. a drive failure). */
    @FunctionalInterface
    public interface Coefficients {
        void at(double t, double[] out);
    }

    final int m;
    final int terms;
    final double[][] gr, gi;
    /** Constant part G_0, or null. */
    final double[] g0r, g0i;
    private final Coefficients source;
    final double[] breakpoints;
    final boolean piecewiseConstant;
    final boolean skewHermitian;

    private LinearSystem(int m, double[][] gr, double[][] gi, double[] g0r, double[] g0i, Coefficients source,
                         double[] breakpoints, boolean piecewiseConstant, boolean skewHermitian) {
        this.m = m;
        this.terms = gr.length;
        this.gr = gr;
        this.gi = gi;
        this.g0r = g0r;
        this.g0i = g0i;
        this.source = source;
        this.breakpoints = breakpoints;
        this.piecewiseConstant = piecewiseConstant;
        this.skewHermitian = skewHermitian;
    }

    /** X' = −i H(t) X. */
    public static LinearSystem of(Hamiltonian h) {
        int n = h.dim(), L = h.size();
        double[][] gr = new double[L][], gi = new double[L][];
        for (int k = 0; k < L; k++) {
            Operator a = h.operators().get(k);
            double[] re = a.reArray(), im = a.imArray();
            // −i (re + i im) = im − i re
            gr[k] = im;
            gi[k] = new double[n * n];
            for (int q = 0; q < n * n; q++) {
                gi[k][q] = -re[q];
            }
        }
        return new LinearSystem(n, gr, gi, null, null, h::coefficients, h.breakpoints(), h.isPiecewiseConstant(),
                true);
    }

    /** v' = S(t) v in Liouville space (column stacking), S(t) = Σ c_k(t)(−i(I⊗A_k − A_kᵀ⊗I)) + dissipator. */
    public static LinearSystem of(Lindbladian l) {
        Hamiltonian h = l.hamiltonian();
        int L = h.size();
        double[][] gr = new double[L][], gi = new double[L][];
        for (int k = 0; k < L; k++) {
            Operator s = Lindbladian.hamiltonianPart(h.operators().get(k));
            gr[k] = s.reArray();
            gi[k] = s.imArray();
        }
        Operator d = l.dissipator().matrix();
        boolean anyDissipation = d.norm() > 0;
        int m = h.dim() * h.dim();
        return new LinearSystem(m, gr, gi, anyDissipation ? d.reArray() : null, anyDissipation ? d.imArray() : null,
                h::coefficients, h.breakpoints(), h.isPiecewiseConstant(), !anyDissipation);
    }

    /**
     * A general system (used by tests of coefficient tables): generators G_k (planar, m×m, not copied) with
     * coefficients from source.
     */
    public static LinearSystem general(int m, double[][] gr, double[][] gi, Coefficients source) {
        return new LinearSystem(m, gr, gi, null, null, source, new double[0], false, false);
    }

    /** @return the dimension m of X (m×m) */
    public int dim() {
        return m;
    }

    /** @return the number of driven terms */
    public int terms() {
        return terms;
    }

    /** @return interior non-smooth times of the coefficients, ascending (shared; do not modify) */
    public double[] breakpoints() {
        return breakpoints;
    }

    /** @return whether all coefficients are piecewise constant */
    public boolean isPiecewiseConstant() {
        return piecewiseConstant;
    }

    /** @return whether every real combination of generators is anti-Hermitian (exponentials are unitary) */
    public boolean isSkewHermitian() {
        return skewHermitian;
    }

    /** out[k] = c_k(t). */
    public void coefficients(double t, double[] out) {
        source.at(t, out);
    }

    /** out = Σ_k w_k G_k + w0 G_0 (planar m×m). */
    public void combine(double[] w, double w0, double[] outR, double[] outI) {
        int len = m * m;
        java.util.Arrays.fill(outR, 0, len, 0.0);
        java.util.Arrays.fill(outI, 0, len, 0.0);
        for (int k = 0; k < terms; k++) {
            double c = w[k];
            if (c == 0.0) {
                continue;
            }
            double[] r = gr[k], i = gi[k];
            for (int q = 0; q < len; q++) {
                outR[q] += c * r[q];
                outI[q] += c * i[q];
            }
        }
        if (g0r != null && w0 != 0.0) {
            for (int q = 0; q < len; q++) {
                outR[q] += w0 * g0r[q];
                outI[q] += w0 * g0i[q];
            }
        }
    }
}
