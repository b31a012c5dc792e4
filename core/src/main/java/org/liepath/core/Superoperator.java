package org.liepath.core;

import org.liepath.core.internal.Require;

/**
 * A linear map on n×n operators, stored as its n²×n² matrix S acting on column-stacked vectors:
 * vec(E(X)) = S vec(X), with vec(X)[i + n j] = X_ij (so vec(A X B) = (Bᵀ ⊗ A) vec(X)).
 *
 * <p>Used for GKLS generators ({@link Lindbladian#at(double)}) and for dynamical maps (channels). The Choi matrix is
 * J = Σ_ab |a⟩⟨b| ⊗ E(|a⟩⟨b|) (input ⊗ output), J[a n + i, b n + j] = S[i + n j, a + n b]; E is completely
 * positive iff J ⪰ 0 (M.-D. Choi, Linear Algebra Appl. 10 (1975) 285) and trace preserving iff tr_out J = I.
 *
 * <p>Immutable and thread-safe. Cost: {@link #apply} O(n⁴), {@link #compose} and {@link #exp} O(n⁶).
 */
public final class Superoperator {
    private final int n;
    private final Operator matrix;

    private Superoperator(int n, Operator matrix) {
        this.n = n;
        this.matrix = matrix;
    }

    /**
     * Wraps an n²×n² matrix in column-stacking convention.
     *
     * @throws InvalidInputException if the matrix dimension is not a perfect square
     */
    public static Superoperator ofMatrix(Operator s) {
        Require.nonNull(s, "s");
        int n = (int) Math.round(Math.sqrt(s.dim()));
        if (n * n != s.dim()) {
            throw InvalidInputException.of(InvalidInputException.Reason.DIMENSION_MISMATCH, "s",
                    "an n²×n² matrix", s.dim() + "x" + s.dim());
        }
        return new Superoperator(n, s);
    }

    /** @return the identity map on n×n operators */
    public static Superoperator identity(int n) {
        return new Superoperator(n, Operator.identity(n * n));
    }

    /** @return X ↦ A X B, i.e. S = Bᵀ ⊗ A */
    public static Superoperator sandwich(Operator a, Operator b) {
        Require.nonNull(a, "a");
        Require.nonNull(b, "b");
        Require.sameDim(a.dim(), b.dim(), "b");
        return new Superoperator(a.dim(), b.transpose().kron(a));
    }

    /** @return the unitary channel ρ ↦ U ρ U† (S = conj(U) ⊗ U) */
    public static Superoperator unitary(Operator u) {
        Require.nonNull(u, "u");
        return new Superoperator(u.dim(), u.conjugate().kron(u));
    }

    /** @return the Kraus channel ρ ↦ Σ K ρ K† */
    public static Superoperator kraus(java.util.List<Operator> ks) {
        Require.nonNull(ks, "ks");
        if (ks.isEmpty()) {
            throw InvalidInputException.of(InvalidInputException.Reason.EMPTY, "ks", "at least one Kraus operator", "none");
        }
        Operator s = null;
        for (int k = 0; k < ks.size(); k++) {
            Operator kk = Require.nonNull(ks.get(k), "ks[" + k + "]");
            if (s != null) {
                Require.sameDim(s.dim(), kk.dim() * kk.dim(), "ks[" + k + "]");
            }
            Operator term = kk.conjugate().kron(kk);
            s = s == null ? term : s.plus(term);
        }
        return ofMatrix(s);
    }

    /** @return the Hilbert-space dimension n (the map acts on n×n operators) */
    public int dim() {
        return n;
    }

    /** @return the n²×n² matrix in column-stacking convention */
    public Operator matrix() {
        return matrix;
    }

    /** @return E(ρ) */
    public Operator apply(Operator rho) {
        Require.nonNull(rho, "rho");
        Require.sameDim(n, rho.dim(), "rho");
        int nn = n * n;
        double[] vr = new double[nn], vi = new double[nn];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                vr[i + n * j] = rho.re[i * n + j];
                vi[i + n * j] = rho.im[i * n + j];
            }
        }
        double[] wr = new double[nn], wi = new double[nn];
        org.liepath.core.internal.Dense.mulVec(nn, matrix.re, matrix.im, vr, vi, wr, wi);
        double[] r = new double[nn], im = new double[nn];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                r[i * n + j] = wr[i + n * j];
                im[i * n + j] = wi[i + n * j];
            }
        }
        return new Operator(n, r, im);
    }

    /** @return the composition this ∘ other (other acts first) */
    public Superoperator compose(Superoperator other) {
        Require.nonNull(other, "other");
        Require.sameDim(n, other.n, "other");
        return new Superoperator(n, matrix.times(other.matrix));
    }

    /** @return this + other */
    public Superoperator plus(Superoperator other) {
        Require.nonNull(other, "other");
        Require.sameDim(n, other.n, "other");
        return new Superoperator(n, matrix.plus(other.matrix));
    }

    /** @return s·this */
    public Superoperator scale(double s) {
        return new Superoperator(n, matrix.scale(s));
    }

    /** @return exp(S): the dynamical map after unit time of a constant generator S (Padé scaling and squaring) */
    public Superoperator exp() {
        return new Superoperator(n, matrix.exp());
    }

    /** @return exp(t S) */
    public Superoperator exp(double t) {
        Require.finite(t, "t");
        return new Superoperator(n, matrix.scale(t).exp());
    }

    /** @return the Choi matrix J (n²×n², input ⊗ output ordering; see class comment) */
    public Operator choi() {
        int nn = n * n;
        double[] r = new double[nn * nn], im = new double[nn * nn];
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                for (int i = 0; i < n; i++) {
                    for (int j = 0; j < n; j++) {
                        int row = a * n + i, col = b * n + j;
                        int sr = i + n * j, sc = a + n * b;
                        r[row * nn + col] = matrix.re[sr * nn + sc];
                        im[row * nn + col] = matrix.im[sr * nn + sc];
                    }
                }
            }
        }
        return new Operator(nn, r, im);
    }

    /** @return the largest |Σ_i S[i + n i, a + n b] − δ_ab|: zero for a trace-preserving map */
    public double traceDefect() {
        int nn = n * n;
        double worst = 0;
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                double sr = 0, si = 0;
                int col = a + n * b;
                for (int i = 0; i < n; i++) {
                    int row = i + n * i;
                    sr += matrix.re[row * nn + col];
                    si += matrix.im[row * nn + col];
                }
                if (a == b) {
                    sr -= 1;
                }
                worst = Math.max(worst, Math.hypot(sr, si));
            }
        }
        return worst;
    }

    /** @return the generator-form trace defect max_col |Σ_i S[i + n i, col]| (zero for a trace-annihilating S) */
    public double generatorTraceDefect() {
        int nn = n * n;
        double worst = 0;
        for (int col = 0; col < nn; col++) {
            double sr = 0, si = 0;
            for (int i = 0; i < n; i++) {
                int row = i + n * i;
                sr += matrix.re[row * nn + col];
                si += matrix.im[row * nn + col];
            }
            worst = Math.max(worst, Math.hypot(sr, si));
        }
        return worst;
    }

    /** @return the Frobenius distance between the matrices */
    public double distance(Superoperator other) {
        Require.nonNull(other, "other");
        Require.sameDim(n, other.n, "other");
        return matrix.distance(other.matrix);
    }

    @Override
    public String toString() {
        return "Superoperator on " + n + "x" + n + " operators\n" + matrix;
    }
}
