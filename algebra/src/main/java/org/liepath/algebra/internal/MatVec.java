package org.liepath.algebra.internal;

import org.liepath.core.Operator;

/**
 * Complex n×n matrices flattened to real vectors of length 2n² (the n² real parts row-major, then the n² imaginary
 * parts), so that the real inner product of two vectors is Re tr(X†Y). Matrices with few non-zero entries (Pauli
 * strings, matrix units and their closures) carry a support list, and brackets and inner products then cost
 * O(nnz·n) and O(nnz) instead of O(n³) and O(n²). Not part of the public API; no method keeps references to its
 * arguments.
 *
 * <p>Stateless static helpers: thread-safe.
 */
public final class MatVec {
    private MatVec() {
    }

    /** Supports are kept only when at most this fraction of the n² entries is non-zero. */
    private static final int SPARSE_DIVISOR = 4;

    /** @return the 2n² vector of {@code a·scale}, optionally multiplied by −i first (the DLA convention). */
    public static double[] of(Operator a, boolean timesMinusI, double scale) {
        int n = a.dim(), nn = n * n;
        double[] re = a.reArray(), im = a.imArray(), v = new double[2 * nn];
        for (int q = 0; q < nn; q++) {
            if (timesMinusI) {
                // −i (x + i y) = y − i x
                v[q] = im[q] * scale;
                v[nn + q] = -re[q] * scale;
            } else {
                v[q] = re[q] * scale;
                v[nn + q] = im[q] * scale;
            }
        }
        return v;
    }

    /** @return the operator of a 2n² vector */
    public static Operator toOperator(int n, double[] v) {
        int nn = n * n;
        double[] re = new double[nn], im = new double[nn];
        System.arraycopy(v, 0, re, 0, nn);
        System.arraycopy(v, nn, im, 0, nn);
        return Operator.ofPlanar(n, re, im);
    }

    /**
     * @return the matrix positions q = i·n + j (each once) where the entry is non-zero, or null when more than a
     *         quarter of the entries are non-zero (then dense loops are faster)
     */
    public static int[] support(int n, double[] v) {
        int nn = n * n, count = 0, limit = nn / SPARSE_DIVISOR;
        for (int q = 0; q < nn; q++) {
            if (v[q] != 0.0 || v[nn + q] != 0.0) {
                if (++count > limit) {
                    return null;
                }
            }
        }
        int[] s = new int[count];
        int c = 0;
        for (int q = 0; q < nn; q++) {
            if (v[q] != 0.0 || v[nn + q] != 0.0) {
                s[c++] = q;
            }
        }
        return s;
    }

    /** Real inner product Re tr(a†b); sa and sb are supports (or null for dense). */
    public static double dot(int n, double[] a, int[] sa, double[] b, int[] sb) {
        int nn = n * n;
        int[] s = sa == null ? sb : (sb == null || sa.length <= sb.length ? sa : sb);
        double acc = 0;
        if (s != null) {
            for (int q : s) {
                acc += a[q] * b[q] + a[nn + q] * b[nn + q];
            }
            return acc;
        }
        for (int q = 0; q < 2 * nn; q++) {
            acc += a[q] * b[q];
        }
        return acc;
    }

    /** y += c·x, x with support sx (or null). */
    public static void axpy(int n, double c, double[] x, int[] sx, double[] y) {
        int nn = n * n;
        if (sx != null) {
            for (int q : sx) {
                y[q] += c * x[q];
                y[nn + q] += c * x[nn + q];
            }
            return;
        }
        for (int q = 0; q < 2 * nn; q++) {
            y[q] += c * x[q];
        }
    }

    /** @return the Euclidean norm (= Frobenius norm of the matrix) */
    public static double norm(double[] v) {
        double s = 0;
        for (double x : v) {
            s += x * x;
        }
        return Math.sqrt(s);
    }

    /**
     * out = [a, b] = ab − ba. Cost: 2·nnz(a)·n complex multiply-adds when a is sparse (likewise b), else 2n³.
     * out must not alias a or b.
     */
    public static void commutator(int n, double[] a, int[] sa, double[] b, int[] sb, double[] out) {
        java.util.Arrays.fill(out, 0.0);
        if (sa == null && sb != null) {
            sparseCommutator(n, b, sb, a, out);
            for (int q = 0; q < out.length; q++) {
                out[q] = -out[q];
            }
        } else if (sa != null) {
            sparseCommutator(n, a, sa, b, out);
        } else {
            denseCommutator(n, a, b, out);
        }
    }

    private static void sparseCommutator(int n, double[] a, int[] sa, double[] b, double[] out) {
        int nn = n * n;
        for (int q : sa) {
            int i = q / n, k = q % n;
            double xr = a[q], xi = a[nn + q];
            // (a b)_{i j} += a_{i k} b_{k j}: row k of b into row i
            int rk = k * n, ri = i * n;
            for (int j = 0; j < n; j++) {
                double yr = b[rk + j], yi = b[nn + rk + j];
                out[ri + j] += xr * yr - xi * yi;
                out[nn + ri + j] += xr * yi + xi * yr;
            }
            // (b a)_{l k} += b_{l i} a_{i k}: column i of b into column k, subtracted
            for (int l = 0; l < n; l++) {
                double yr = b[l * n + i], yi = b[nn + l * n + i];
                out[l * n + k] -= yr * xr - yi * xi;
                out[nn + l * n + k] -= yr * xi + yi * xr;
            }
        }
    }

    private static void denseCommutator(int n, double[] a, double[] b, double[] out) {
        int nn = n * n;
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < n; k++) {
                double ar = a[i * n + k], ai = a[nn + i * n + k];
                double br = b[i * n + k], bi = b[nn + i * n + k];
                int rk = k * n, ri = i * n;
                for (int j = 0; j < n; j++) {
                    double yr = b[rk + j], yi = b[nn + rk + j];
                    double zr = a[rk + j], zi = a[nn + rk + j];
                    out[ri + j] += (ar * yr - ai * yi) - (br * zr - bi * zi);
                    out[nn + ri + j] += (ar * yi + ai * yr) - (br * zi + bi * zr);
                }
            }
        }
    }

    /** @return ‖X − X†‖_F / 2-like defects: [0] = ‖X − X†‖_F (Hermitian defect), [1] = ‖X + X†‖_F (anti-Hermitian defect) */
    public static double[] hermitianDefects(Operator x) {
        int n = x.dim();
        double h = 0, ah = 0;
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                double ar = x.re(i, j), ai = x.im(i, j), br = x.re(j, i), bi = -x.im(j, i);
                h += (ar - br) * (ar - br) + (ai - bi) * (ai - bi);
                ah += (ar + br) * (ar + br) + (ai + bi) * (ai + bi);
            }
        }
        return new double[] {Math.sqrt(h), Math.sqrt(ah)};
    }
}
