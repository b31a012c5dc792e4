package org.liepath.core.internal;

/**
 * Kernels on dense complex n×n matrices stored planar and row-major: entry (i, j) is {@code re[i*n+j] + i im[i*n+j]}.
 * No method allocates; outputs must not alias inputs unless stated. Not part of the public API.
 */
public final class Dense {
    private Dense() {
    }

    /** c = a·b. Outputs must not alias inputs. Cost 8n³ flops. */
    public static void mul(int n, double[] ar, double[] ai, double[] br, double[] bi, double[] cr, double[] ci) {
        java.util.Arrays.fill(cr, 0, n * n, 0.0);
        java.util.Arrays.fill(ci, 0, n * n, 0.0);
        for (int i = 0; i < n; i++) {
            int in = i * n;
            for (int k = 0; k < n; k++) {
                double xr = ar[in + k], xi = ai[in + k];
                if (xr == 0.0 && xi == 0.0) {
                    continue;
                }
                int kn = k * n;
                for (int j = 0; j < n; j++) {
                    double yr = br[kn + j], yi = bi[kn + j];
                    cr[in + j] += xr * yr - xi * yi;
                    ci[in + j] += xr * yi + xi * yr;
                }
            }
        }
    }

    /** y = a·x for a vector x (planar). Outputs must not alias inputs. */
    public static void mulVec(int n, double[] ar, double[] ai, double[] xr, double[] xi, double[] yr, double[] yi) {
        for (int i = 0; i < n; i++) {
            double sr = 0, si = 0;
            int in = i * n;
            for (int k = 0; k < n; k++) {
                double pr = ar[in + k], pi = ai[in + k], qr = xr[k], qi = xi[k];
                sr += pr * qr - pi * qi;
                si += pr * qi + pi * qr;
            }
            yr[i] = sr;
            yi[i] = si;
        }
    }

    /** Maximum absolute column sum (the matrix 1-norm), with |z| the complex modulus. */
    public static double norm1(int n, double[] re, double[] im) {
        double best = 0;
        for (int j = 0; j < n; j++) {
            double s = 0;
            for (int i = 0; i < n; i++) {
                s += Math.hypot(re[i * n + j], im[i * n + j]);
            }
            best = Math.max(best, s);
        }
        return best;
    }

    /** Frobenius norm. */
    public static double frobenius(int len, double[] re, double[] im) {
        double s = 0;
        for (int i = 0; i < len; i++) {
            s += re[i] * re[i] + im[i] * im[i];
        }
        return Math.sqrt(s);
    }

    /** Sets (re, im) to the identity. */
    public static void identity(int n, double[] re, double[] im) {
        java.util.Arrays.fill(re, 0, n * n, 0.0);
        java.util.Arrays.fill(im, 0, n * n, 0.0);
        for (int i = 0; i < n; i++) {
            re[i * n + i] = 1.0;
        }
    }

    /**
     * Solves (a) x = b in place for k = n right-hand sides (b is n×n, overwritten with x) by LU with partial
     * pivoting; a is overwritten with its factors. Returns false if a pivot is exactly zero.
     */
    public static boolean solveInPlace(int n, double[] ar, double[] ai, double[] br, double[] bi, int[] piv) {
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
            if (best == 0) {
                return false;
            }
            if (p != k) {
                swapRows(n, ar, k, p);
                swapRows(n, ai, k, p);
                swapRows(n, br, k, p);
                swapRows(n, bi, k, p);
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
                for (int j = 0; j < n; j++) {
                    double ur = br[k * n + j], ui = bi[k * n + j];
                    br[i * n + j] -= lr * ur - li * ui;
                    bi[i * n + j] -= lr * ui + li * ur;
                }
            }
        }
        // back substitution
        for (int k = n - 1; k >= 0; k--) {
            double dr = ar[k * n + k], di = ai[k * n + k];
            double den = dr * dr + di * di;
            double invr = dr / den, invi = -di / den;
            for (int j = 0; j < n; j++) {
                double sr = br[k * n + j], si = bi[k * n + j];
                for (int m = k + 1; m < n; m++) {
                    double ur = ar[k * n + m], ui = ai[k * n + m];
                    double xr = br[m * n + j], xi = bi[m * n + j];
                    sr -= ur * xr - ui * xi;
                    si -= ur * xi + ui * xr;
                }
                br[k * n + j] = sr * invr - si * invi;
                bi[k * n + j] = sr * invi + si * invr;
            }
        }
        return true;
    }

    private static void swapRows(int n, double[] a, int r1, int r2) {
        int o1 = r1 * n, o2 = r2 * n;
        for (int j = 0; j < n; j++) {
            double t = a[o1 + j];
            a[o1 + j] = a[o2 + j];
            a[o2 + j] = t;
        }
    }
}
