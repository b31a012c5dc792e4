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
     * @param s the operator
     * @return the superoperator with matrix s
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

    /**
     * @param n the dimension
     * @return the identity map on n×n operators
     */
    public static Superoperator identity(int n) {
        Require.positive(n, "n");
        if (n > 215) { // (n²)² entries must fit in one array
            throw InvalidInputException.of(InvalidInputException.Reason.LIMIT_EXCEEDED, "n", "a dimension ≤ 215", n);
        }
        return new Superoperator(n, Operator.identity(n * n));
    }

    /**
     * @param a the operator
     * @param b the other operator
     * @return X ↦ A X B, i.e. S = Bᵀ ⊗ A
     */
    public static Superoperator sandwich(Operator a, Operator b) {
        Require.nonNull(a, "a");
        Require.nonNull(b, "b");
        Require.sameDim(a.dim(), b.dim(), "b");
        return new Superoperator(a.dim(), b.transpose().kron(a));
    }

    /**
     * @param u the operator
     * @return the unitary channel ρ ↦ U ρ U† (S = conj(U) ⊗ U)
     */
    public static Superoperator unitary(Operator u) {
        Require.nonNull(u, "u");
        return new Superoperator(u.dim(), u.conjugate().kron(u));
    }

    /**
     * @param ks the Kraus operators
     * @return the Kraus channel ρ ↦ Σ K ρ K†
     */
    public static Superoperator kraus(java.util.List<Operator> ks) {
        Require.nonNull(ks, "ks");
        if (ks.isEmpty()) {
            throw InvalidInputException.of(InvalidInputException.Reason.EMPTY, "ks", "at least one Kraus operator", "none");
        }
        Operator s = null;
        for (int k = 0; k < ks.size(); k++) {
            Operator kk = Require.nonNull(ks.get(k), "ks[" + k + "]");
            if (s != null) {
                // compare Hilbert-space dimensions, so that the message speaks of the operators the caller passed
                Require.sameDim(ks.get(0).dim(), kk.dim(), "ks[" + k + "]");
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

    /**
     * @param rho the density matrix
     * @return E(ρ)
     */
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

    /**
     * @param other the other operand
     * @return the composition this ∘ other (other acts first)
     */
    public Superoperator compose(Superoperator other) {
        Require.nonNull(other, "other");
        Require.sameDim(n, other.n, "other");
        return new Superoperator(n, matrix.times(other.matrix));
    }

    /**
     * @param other the other operand
     * @return this + other
     */
    public Superoperator plus(Superoperator other) {
        Require.nonNull(other, "other");
        Require.sameDim(n, other.n, "other");
        return new Superoperator(n, matrix.plus(other.matrix));
    }

    /**
     * @param s the factor
     * @return s·this
     */
    public Superoperator scale(double s) {
        return new Superoperator(n, matrix.scale(s));
    }

    /** @return exp(S): the dynamical map after unit time of a constant generator S (Padé scaling and squaring) */
    public Superoperator exp() {
        return new Superoperator(n, matrix.exp());
    }

    /**
     * @param t the time
     * @return exp(t S)
     */
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

    /**
     * @param other the other operand
     * @return the Frobenius distance between the matrices
     */
    public double distance(Superoperator other) {
        Require.nonNull(other, "other");
        Require.sameDim(n, other.n, "other");
        return matrix.distance(other.matrix);
    }

    @Override
    public String toString() {
        return "Superoperator on " + n + "x" + n + " operators\n" + matrix;
    }

    // ------------------------------------------------------------------ added conveniences

    /**
     * A Kraus representation E(ρ) = Σ_k K_k ρ K_k† of this map, read off a factorisation J = Σ_k v_k v_k† of the Choi
     * matrix (K_k[i][a] = v_k[a n + i], see the class comment). The factorisation is a Cholesky decomposition with
     * diagonal pivoting, stopped when the largest remaining diagonal entry falls below 1e-12·‖J‖_F (N. J. Higham,
     * <i>Analysis of the Cholesky decomposition of a semi-definite matrix</i>, 1990); it gives rank(J) operators,
     * which reproduce the map to that tolerance but are not the Hilbert–Schmidt-orthogonal canonical set of an
     * eigendecomposition. Cost O(rank·n⁴).
     *
     * @return a Kraus representation E(ρ) = Σ_k K_k ρ K_k† of this map, read off a factorisation J = Σ_k v_k v_k† of
     *     the Choi matrix (K_k[i][a] = v_k[a n + i], see the class comment)
     * @throws InvalidInputException with reason OUT_OF_RANGE if the map is not completely positive (J is not
     *                               Hermitian, has a negative pivot, or a remainder that is not negligible)
     */
    public java.util.List<Operator> krausOperators() {
        Operator j = choi();
        int nn = n * n;
        double scale = Math.max(j.norm(), Double.MIN_NORMAL), tol = 1e-12 * scale;
        if (j.hermitianDefect() > tol) {
            throw InvalidInputException.of(InvalidInputException.Reason.OUT_OF_RANGE, "this",
                    "a completely positive map (Hermitian Choi matrix)", "‖J − J†‖_F = " + j.hermitianDefect());
        }
        double[] ar = j.reArray(), ai = j.imArray();
        boolean[] done = new boolean[nn];
        java.util.List<Operator> out = new java.util.ArrayList<>();
        for (int step = 0; step < nn; step++) {
            int p = -1;
            double best = 0, worst = 0;
            for (int i = 0; i < nn; i++) {
                if (!done[i]) {
                    double d = ar[i * nn + i];
                    worst = Math.min(worst, d);
                    if (d > best) {
                        best = d;
                        p = i;
                    }
                }
            }
            if (worst < -tol) {
                throw InvalidInputException.of(InvalidInputException.Reason.OUT_OF_RANGE, "this",
                        "a completely positive map (positive semidefinite Choi matrix)", "a negative pivot " + worst);
            }
            if (best <= tol) {
                break;
            }
            double piv = Math.sqrt(best);
            double[] lr = new double[nn], li = new double[nn];
            for (int i = 0; i < nn; i++) {
                if (!done[i]) {
                    lr[i] = ar[i * nn + p] / piv;
                    li[i] = ai[i * nn + p] / piv;
                }
            }
            for (int i = 0; i < nn; i++) {
                if (done[i] || (lr[i] == 0 && li[i] == 0)) {
                    continue;
                }
                for (int c = 0; c < nn; c++) {
                    if (!done[c]) {
                        // A[i][c] -= l_i conj(l_c)
                        ar[i * nn + c] -= lr[i] * lr[c] + li[i] * li[c];
                        ai[i * nn + c] -= li[i] * lr[c] - lr[i] * li[c];
                    }
                }
            }
            done[p] = true;
            double[] kr = new double[nn], ki = new double[nn];
            for (int a = 0; a < n; a++) {
                for (int i = 0; i < n; i++) {
                    kr[i * n + a] = lr[a * n + i];
                    ki[i * n + a] = li[a * n + i];
                }
            }
            out.add(new Operator(n, kr, ki));
        }
        // a small diagonal does not bound the off-diagonal part unless the remainder is semidefinite: check it all
        double rest = 0;
        for (int i = 0; i < nn; i++) {
            for (int c = 0; c < nn && !done[i]; c++) {
                if (!done[c]) {
                    rest = Math.max(rest, Math.hypot(ar[i * nn + c], ai[i * nn + c]));
                }
            }
        }
        if (rest > 10 * tol) {
            throw InvalidInputException.of(InvalidInputException.Reason.OUT_OF_RANGE, "this",
                    "a completely positive map (positive semidefinite Choi matrix)",
                    "an indefinite remainder of size " + rest);
        }
        if (out.isEmpty()) {
            out.add(Operator.zero(n)); // the zero map
        }
        return java.util.Collections.unmodifiableList(out);
    }

    /**
     * The steady state of a generator: the operator ρ with S vec(ρ) = 0 and tr ρ = 1, assuming it is unique. The
     * trace condition replaces the row of S for the (0,0) entry, which is redundant for a trace-annihilating S (that
     * row is minus the sum of the other diagonal rows); the square system is solved by Gaussian elimination with
     * complete pivoting. Cost O(n⁶).
     *
     * @return the steady state of a generator
     * @throws InvalidInputException with reason UNSUPPORTED if S does not annihilate the trace (relative defect above
     *                               1e-10) or the steady state is not unique (relative pivot below 1e-12)
     */
    public Operator steadyState() {
        int nn = n * n;
        double sNorm = Math.max(matrix.norm(), Double.MIN_NORMAL);
        if (generatorTraceDefect() > 1e-10 * sNorm) {
            throw InvalidInputException.of(InvalidInputException.Reason.UNSUPPORTED, "this",
                    "a trace-annihilating generator", "generator trace defect " + generatorTraceDefect());
        }
        double[] ar = matrix.reArray(), ai = matrix.imArray(), br = new double[nn], bi = new double[nn];
        // the trace row is scaled like S so that pivot sizes compare fairly
        double rowScale = sNorm / Math.sqrt(nn);
        java.util.Arrays.fill(ar, 0, nn, 0.0);
        java.util.Arrays.fill(ai, 0, nn, 0.0);
        for (int i = 0; i < n; i++) {
            ar[i + n * i] = rowScale;
        }
        br[0] = rowScale;
        int[] cols = new int[nn];
        for (int k = 0; k < nn; k++) {
            cols[k] = k;
        }
        double first = 0;
        for (int k = 0; k < nn; k++) {
            int pr = k, pc = k;
            double best = -1;
            for (int i = k; i < nn; i++) {
                for (int c = k; c < nn; c++) {
                    double m = Math.hypot(ar[i * nn + c], ai[i * nn + c]);
                    if (m > best) {
                        best = m;
                        pr = i;
                        pc = c;
                    }
                }
            }
            if (k == 0) {
                first = best;
            }
            if (!(best > 1e-12 * first)) {
                throw InvalidInputException.of(InvalidInputException.Reason.UNSUPPORTED, "this",
                        "a generator with a unique steady state",
                        "a rank-deficient system (relative pivot " + best / first + " at step " + k + " of " + nn + ")");
            }
            swap(ar, ai, nn, pr, k, true);
            swap(ar, ai, nn, pc, k, false);
            double t = br[pr]; br[pr] = br[k]; br[k] = t;
            t = bi[pr]; bi[pr] = bi[k]; bi[k] = t;
            int tc = cols[pc]; cols[pc] = cols[k]; cols[k] = tc;
            double dr = ar[k * nn + k], di = ai[k * nn + k], den = dr * dr + di * di;
            for (int i = k + 1; i < nn; i++) {
                double xr = ar[i * nn + k], xi = ai[i * nn + k];
                if (xr == 0 && xi == 0) {
                    continue;
                }
                double fr = (xr * dr + xi * di) / den, fi = (xi * dr - xr * di) / den;
                for (int c = k; c < nn; c++) {
                    double ur = ar[k * nn + c], ui = ai[k * nn + c];
                    ar[i * nn + c] -= fr * ur - fi * ui;
                    ai[i * nn + c] -= fr * ui + fi * ur;
                }
                br[i] -= fr * br[k] - fi * bi[k];
                bi[i] -= fr * bi[k] + fi * br[k];
            }
        }
        double[] xr = new double[nn], xi = new double[nn];
        for (int k = nn - 1; k >= 0; k--) {
            double sr = br[k], si = bi[k];
            for (int c = k + 1; c < nn; c++) {
                sr -= ar[k * nn + c] * xr[c] - ai[k * nn + c] * xi[c];
                si -= ar[k * nn + c] * xi[c] + ai[k * nn + c] * xr[c];
            }
            double dr = ar[k * nn + k], di = ai[k * nn + k], den = dr * dr + di * di;
            xr[k] = (sr * dr + si * di) / den;
            xi[k] = (si * dr - sr * di) / den;
        }
        double[] r = new double[nn], im = new double[nn];
        for (int k = 0; k < nn; k++) {
            int v = cols[k], i = v % n, j = v / n; // vec index v = i + n j
            r[i * n + j] = xr[k];
            im[i * n + j] = xi[k];
        }
        return new Operator(n, r, im);
    }

    /**
     * The map whose Choi matrix is j (the inverse of {@link #choi()}): S[i + n j', a + n b] = J[a n + i, b n + j'].
     *
     * @param j the Choi matrix
     * @return the map whose Choi matrix is j (the inverse of {@link #choi()})
     * @throws InvalidInputException if j is null or its dimension is not a perfect square
     */
    public static Superoperator ofChoi(Operator j) {
        Require.nonNull(j, "j");
        int n = (int) Math.round(Math.sqrt(j.dim())), nn = n * n;
        if (nn != j.dim()) {
            throw InvalidInputException.of(InvalidInputException.Reason.DIMENSION_MISMATCH, "j", "an n²×n² matrix",
                    j.dim() + "x" + j.dim());
        }
        double[] r = new double[nn * nn], im = new double[nn * nn];
        for (int a = 0; a < n; a++) {
            for (int b = 0; b < n; b++) {
                for (int i = 0; i < n; i++) {
                    for (int k = 0; k < n; k++) {
                        int src = (a * n + i) * nn + b * n + k, dst = (i + n * k) * nn + a + n * b;
                        r[dst] = j.re[src];
                        im[dst] = j.im[src];
                    }
                }
            }
        }
        return new Superoperator(n, new Operator(nn, r, im));
    }

    /** Exact equality of the matrices (numeric, so 0.0 equals −0.0); use {@link #distance} to compare approximately. */
    @Override
    public boolean equals(Object o) {
        return o instanceof Superoperator && matrix.equals(((Superoperator) o).matrix);
    }

    @Override
    public int hashCode() {
        return matrix.hashCode();
    }

    private static void swap(double[] ar, double[] ai, int nn, int p, int k, boolean rows) {
        if (p == k) {
            return;
        }
        for (int q = 0; q < nn; q++) {
            int x = rows ? p * nn + q : q * nn + p, y = rows ? k * nn + q : q * nn + k;
            double t = ar[x]; ar[x] = ar[y]; ar[y] = t;
            t = ai[x]; ai[x] = ai[y]; ai[y] = t;
        }
    }
}
