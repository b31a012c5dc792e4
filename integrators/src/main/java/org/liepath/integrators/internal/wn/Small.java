package org.liepath.integrators.internal.wn;

import java.util.Arrays;

/**
 * Kernels on small dense complex matrices stored planar and row-major (entry (i, j) of an r×c matrix is
 * {@code re[i*c+j] + i im[i*c+j]}). Used for the m×m adjoint representation of a chart and for the blocks of the block
 * Riccati decomposition. No method allocates; outputs must not alias inputs. Not part of the public API.
 */
public final class Small {
    private Small() {
    }

    /** c (r×q) = a (r×k) · b (k×q). */
    public static void mul(int r, int k, int q, double[] ar, double[] ai, double[] br, double[] bi,
                           double[] cr, double[] ci) {
        Arrays.fill(cr, 0, r * q, 0.0);
        Arrays.fill(ci, 0, r * q, 0.0);
        for (int i = 0; i < r; i++) {
            for (int l = 0; l < k; l++) {
                double xr = ar[i * k + l], xi = ai[i * k + l];
                if (xr == 0.0 && xi == 0.0) {
                    continue;
                }
                int bo = l * q, co = i * q;
                for (int j = 0; j < q; j++) {
                    double yr = br[bo + j], yi = bi[bo + j];
                    cr[co + j] += xr * yr - xi * yi;
                    ci[co + j] += xr * yi + xi * yr;
                }
            }
        }
    }

    /** Sets the n×n identity. */
    public static void identity(int n, double[] re, double[] im) {
        Arrays.fill(re, 0, n * n, 0.0);
        Arrays.fill(im, 0, n * n, 0.0);
        for (int i = 0; i < n; i++) {
            re[i * n + i] = 1.0;
        }
    }

    /** Maximum absolute column sum of an r×c matrix. */
    public static double norm1(int r, int c, double[] re, double[] im) {
        double best = 0;
        for (int j = 0; j < c; j++) {
            double s = 0;
            for (int i = 0; i < r; i++) {
                s += Math.hypot(re[i * c + j], im[i * c + j]);
            }
            if (!(s <= best)) {
                best = s;
            }
        }
        return best;
    }

    /**
     * LU factorisation with partial pivoting in place (unit lower L below the diagonal, U on and above).
     *
     * @return false if a pivot is zero or not finite
     */
    public static boolean lu(int n, double[] ar, double[] ai, int[] piv) {
        for (int k = 0; k < n; k++) {
            int p = k;
            double best = -1;
            for (int i = k; i < n; i++) {
                double m = Math.abs(ar[i * n + k]) + Math.abs(ai[i * n + k]);
                if (m > best) {
                    best = m;
                    p = i;
                }
            }
            piv[k] = p;
            if (!(best > 0) || !Double.isFinite(best)) {
                return false;
            }
            if (p != k) {
                for (int j = 0; j < n; j++) {
                    double t = ar[k * n + j];
                    ar[k * n + j] = ar[p * n + j];
                    ar[p * n + j] = t;
                    t = ai[k * n + j];
                    ai[k * n + j] = ai[p * n + j];
                    ai[p * n + j] = t;
                }
            }
            double dr = ar[k * n + k], di = ai[k * n + k];
            double den = dr * dr + di * di;
            double invr = dr / den, invi = -di / den;
            for (int i = k + 1; i < n; i++) {
                double xr = ar[i * n + k], xi = ai[i * n + k];
                double lr = xr * invr - xi * invi, li = xr * invi + xi * invr;
                ar[i * n + k] = lr;
                ai[i * n + k] = li;
                if (lr == 0 && li == 0) {
                    continue;
                }
                for (int j = k + 1; j < n; j++) {
                    double ur = ar[k * n + j], ui = ai[k * n + j];
                    ar[i * n + j] -= lr * ur - li * ui;
                    ai[i * n + j] -= lr * ui + li * ur;
                }
            }
        }
        return true;
    }

    /** Solves (LU) x = b in place for one right-hand side b (length n) after {@link #lu}. */
    public static void luSolve(int n, double[] lr, double[] li, int[] piv, double[] br, double[] bi) {
        for (int k = 0; k < n; k++) {
            int p = piv[k];
            if (p != k) {
                double t = br[k];
                br[k] = br[p];
                br[p] = t;
                t = bi[k];
                bi[k] = bi[p];
                bi[p] = t;
            }
        }
        for (int i = 1; i < n; i++) {
            double sr = br[i], si = bi[i];
            for (int k = 0; k < i; k++) {
                double xr = lr[i * n + k], xi = li[i * n + k];
                sr -= xr * br[k] - xi * bi[k];
                si -= xr * bi[k] + xi * br[k];
            }
            br[i] = sr;
            bi[i] = si;
        }
        for (int i = n - 1; i >= 0; i--) {
            double sr = br[i], si = bi[i];
            for (int k = i + 1; k < n; k++) {
                double xr = lr[i * n + k], xi = li[i * n + k];
                sr -= xr * br[k] - xi * bi[k];
                si -= xr * bi[k] + xi * br[k];
            }
            double dr = lr[i * n + i], di = li[i * n + i];
            double den = dr * dr + di * di;
            br[i] = (sr * dr + si * di) / den;
            bi[i] = (si * dr - sr * di) / den;
        }
    }

    /**
     * Inverts an n×n matrix: (ar, ai) is overwritten by its LU factors and the inverse is written to (outR, outI);
     * colR/colI are scratch vectors of length n.
     *
     * @return false if the matrix is singular
     */
    public static boolean invert(int n, double[] ar, double[] ai, int[] piv, double[] outR, double[] outI,
                                 double[] colR, double[] colI) {
        if (!lu(n, ar, ai, piv)) {
            return false;
        }
        for (int j = 0; j < n; j++) {
            Arrays.fill(colR, 0, n, 0.0);
            Arrays.fill(colI, 0, n, 0.0);
            colR[j] = 1.0;
            luSolve(n, ar, ai, piv, colR, colI);
            for (int i = 0; i < n; i++) {
                outR[i * n + j] = colR[i];
                outI[i * n + j] = colI[i];
            }
        }
        return true;
    }

    /**
     * c = a·b for square n×n planar matrices, through EJML's blocked complex kernel for n ≥ 32 (several times faster
     * than a plain triple loop there; the planar/interleaved conversion is O(n²)). Allocates the EJML matrices: for
     * reconstructions, not for hot loops.
     */
    public static void mulLarge(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        if (n < 32) {
            org.liepath.core.internal.Dense.mul(n, ar, ai, br, bi, cr, ci);
            return;
        }
        org.ejml.data.ZMatrixRMaj a = new org.ejml.data.ZMatrixRMaj(n, n), b = new org.ejml.data.ZMatrixRMaj(n, n);
        org.ejml.data.ZMatrixRMaj c = new org.ejml.data.ZMatrixRMaj(n, n);
        for (int k = 0; k < n * n; k++) {
            a.data[2 * k] = ar[k];
            a.data[2 * k + 1] = ai[k];
            b.data[2 * k] = br[k];
            b.data[2 * k + 1] = bi[k];
        }
        org.ejml.dense.row.CommonOps_ZDRM.mult(a, b, c);
        for (int k = 0; k < n * n; k++) {
            cr[k] = c.data[2 * k];
            ci[k] = c.data[2 * k + 1];
        }
    }
}
