package org.liepath.algebra.internal;

import java.util.ArrayList;
import java.util.List;

/**
 * A growing real-orthonormal set of 2n² vectors (matrices under Re tr(X†Y)), with classical Gram–Schmidt and one
 * re-orthogonalisation pass ("CGS2").
 *
 * <p>Why CGS2 rather than modified Gram–Schmidt: with one re-orthogonalisation both keep the computed basis
 * orthonormal to working precision (L. Giraud, J. Langou, M. Rozložník, "The loss of orthogonality in the
 * Gram–Schmidt orthogonalization process", Comput. Math. Appl. 50, 1069 (2005); the "twice is enough" rule goes back
 * to W. Kahan, see B. N. Parlett, The Symmetric Eigenvalue Problem, 1980, §6.9). CGS2 computes all projection
 * coefficients of a pass from the same vector, so a sparse candidate (a bracket of Pauli strings) is projected
 * through an inverted index (matrix position → sparse basis elements touching it) in O(nnz · elements per position)
 * instead of O(m·n²).
 *
 * <p>A candidate whose residual after the first pass is already at or below the acceptance threshold is refused
 * without the second pass: the second pass only removes components inside the span, so it cannot raise the residual
 * above the threshold. Mutable, not thread-safe; used only while an algebra is being built.
 */
public final class Basis {
    private final int n;
    private final List<double[]> vecs = new ArrayList<>();
    private final List<int[]> supports = new ArrayList<>();
    private double[] coef = new double[16];
    /** inverted index of the sparse elements: for each matrix position, the elements whose support contains it */
    private final int[][] at;
    private final int[] atCount;
    /** elements without a support list (dense) */
    private int[] dense = new int[8];
    private int denseCount;

    public Basis(int n) {
        this.n = n;
        this.at = new int[n * n][];
        this.atCount = new int[n * n];
    }

    public int n() {
        return n;
    }

    public int size() {
        return vecs.size();
    }

    public double[] vec(int k) {
        return vecs.get(k);
    }

    public int[] support(int k) {
        return supports.get(k);
    }

    /** Appends v (already orthonormal to the set, unit norm); v is kept, not copied. */
    public void addOrthonormal(double[] v) {
        int k = vecs.size();
        int[] sv = MatVec.support(n, v);
        vecs.add(v);
        supports.add(sv);
        if (sv == null) {
            if (denseCount == dense.length) {
                dense = java.util.Arrays.copyOf(dense, 2 * denseCount);
            }
            dense[denseCount++] = k;
            return;
        }
        for (int q : sv) {
            if (at[q] == null) {
                at[q] = new int[4];
            } else if (atCount[q] == at[q].length) {
                at[q] = java.util.Arrays.copyOf(at[q], 2 * atCount[q]);
            }
            at[q][atCount[q]++] = k;
        }
    }

    /**
     * out[k] = ⟨e_k, x⟩ for all k; out must be zero on entry and have length ≥ size(). For a sparse x only the
     * elements sharing a matrix position with x (inverted index) and the dense elements are visited.
     */
    private void dots(double[] x, int[] sx, double[] out) {
        int m = vecs.size();
        if (sx == null) {
            for (int k = 0; k < m; k++) {
                out[k] = MatVec.dot(n, vecs.get(k), supports.get(k), x, null);
            }
            return;
        }
        int nn = n * n;
        for (int q : sx) {
            int[] list = at[q];
            double xr = x[q], xi = x[nn + q];
            for (int e = 0; e < atCount[q]; e++) {
                double[] v = vecs.get(list[e]);
                out[list[e]] += v[q] * xr + v[nn + q] * xi;
            }
        }
        for (int d = 0; d < denseCount; d++) {
            int k = dense[d];
            out[k] = MatVec.dot(n, vecs.get(k), null, x, sx);
        }
    }

    /**
     * Replaces c by its component orthogonal to the span and returns the norm of that component.
     *
     * @param threshold acceptance threshold (see the class comment for the early exit)
     */
    public double orthogonalise(double[] c, double threshold) {
        double r = pass(c);
        if (r <= threshold) {
            return r;
        }
        return pass(c);
    }

    /** Normalises the residual c (norm r) and adds it. */
    public void addResidual(double[] c, double r) {
        double s = 1.0 / r;
        for (int q = 0; q < c.length; q++) {
            c[q] *= s;
        }
        addOrthonormal(c);
    }

    /** @return real coordinates ⟨e_k, x⟩ of x on every basis vector (x unchanged) */
    public double[] project(double[] x) {
        double[] out = new double[vecs.size()];
        dots(x, MatVec.support(n, x), out);
        return out;
    }

    private double pass(double[] c) {
        int m = vecs.size();
        if (coef.length < m) {
            coef = new double[Math.max(m, 2 * coef.length)];
        }
        int[] sc = MatVec.support(n, c);
        double norm = MatVec.norm(c);
        // coefficients at rounding level of ‖c‖ are dropped: they cannot change the accept/refuse decision and keeping
        // them would turn sparse candidates dense
        double drop = 4e-16 * norm;
        java.util.Arrays.fill(coef, 0, m, 0.0);
        dots(c, sc, coef);
        for (int k = 0; k < m; k++) {
            if (Math.abs(coef[k]) > drop) {
                MatVec.axpy(n, -coef[k], vecs.get(k), supports.get(k), c);
            }
        }
        return MatVec.norm(c);
    }
}
